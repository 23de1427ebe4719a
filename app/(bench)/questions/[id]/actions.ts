"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { failedForm, formText, isRefusal, memberOrRefusal } from "@/lib/qa/form-result";
import { flagPost } from "@/lib/qa/moderation";
import { answerQuestion } from "@/lib/qa/posting";
import { acceptAnswer, voteOnAnswer } from "@/lib/qa/votes";
import type { FormResult } from "@/lib/validations/auth";
import { photosFromForm } from "@/lib/validations/qa";

// The question page's member actions. Each: the session guard, then the Q&A operation (which checks
// visibility, ownership, state and rate limits itself), then the page is rendered afresh.

const refresh = (questionId: string) => {
  revalidatePath(`/questions/${questionId}`);
  revalidatePath("/questions");
};

export async function answerAction(questionId: string, _previous: FormResult | null, formData: FormData): Promise<FormResult> {
  const values = { bodyMd: formText(formData, "bodyMd") };
  const user = await memberOrRefusal(values);
  if (isRefusal(user)) return user;
  const outcome = await answerQuestion(user, questionId, { ...values, photos: photosFromForm(formData) });
  if (!outcome.ok) return failedForm(outcome, values);
  refresh(questionId);
  revalidatePath("/moderate/posts");
  redirect(`/questions/${questionId}?answered=${outcome.state}#answer-${outcome.id}`);
}

export async function flagAction(kind: "question" | "answer", postId: string, questionId: string, _previous: FormResult | null, formData: FormData): Promise<FormResult> {
  const values = { reason: formText(formData, "reason") };
  const user = await memberOrRefusal(values);
  if (isRefusal(user)) return user;
  const outcome = await flagPost(user, kind, postId, values);
  if (!outcome.ok) return failedForm(outcome, values);
  refresh(questionId);
  revalidatePath("/moderate/posts");
  // A post hidden by this flag disappears for the flagger, so the thanks goes on the page, not on the post.
  if (kind === "question" && outcome.hidden) redirect("/questions?flagged=hidden");
  redirect(`/questions/${questionId}?flagged=${outcome.hidden ? "hidden" : "open"}${kind === "answer" && !outcome.hidden ? `#answer-${postId}` : ""}`);
}

export async function voteAction(answerId: string, questionId: string, _previous: FormResult | null, formData: FormData): Promise<FormResult> {
  const user = await memberOrRefusal();
  if (isRefusal(user)) return user;
  const outcome = await voteOnAnswer(user, answerId, { value: formText(formData, "value") });
  if (!outcome.ok) return failedForm(outcome);
  refresh(questionId);
  return { ok: true, message: outcome.vote === 0 ? "Vote taken back." : outcome.vote === 1 ? "Voted up." : "Voted down." };
}

export async function acceptAction(questionId: string, answerId: string | null, _previous: FormResult | null): Promise<FormResult> {
  const user = await memberOrRefusal();
  if (isRefusal(user)) return user;
  const outcome = await acceptAnswer(user, questionId, { answerId });
  if (!outcome.ok) return failedForm(outcome);
  refresh(questionId);
  return { ok: true, message: answerId ? "Marked as the accepted answer." : "No answer is accepted now." };
}
