"use server";

import { revalidatePath } from "next/cache";
import { failedForm, formText, isRefusal, memberOrRefusal } from "@/lib/qa/form-result";
import { moderatePost } from "@/lib/qa/moderation";
import type { PostAction } from "@/lib/qa/moderation-rules";
import type { FormResult } from "@/lib/validations/auth";

// The Q&A queue's three decisions. Each: the moderator guard, then moderatePost (zod, then the rules
// against the locked post: state, not one's own), then the queue and the question's page are refreshed.

async function decide(kind: string, id: string, action: PostAction, body: Record<string, string>): Promise<FormResult> {
  const user = await memberOrRefusal(body, ["moderator"]);
  if (isRefusal(user)) return user;
  const outcome = await moderatePost(user, kind, id, action, body);
  if (!outcome.ok) return failedForm(outcome, body);
  revalidatePath("/moderate/posts");
  revalidatePath("/questions");
  revalidatePath(`/questions/${outcome.questionId}`);
  const words = { approve: "Approved: it is visible now.", remove: "Removed; the author has been e-mailed the reason.", restore: "Restored: it is visible again and its flags are resolved." };
  return { ok: true, message: words[action] };
}

export async function approvePostAction(kind: string, id: string, _previous: FormResult | null): Promise<FormResult> {
  return decide(kind, id, "approve", {});
}

export async function removePostAction(kind: string, id: string, _previous: FormResult | null, formData: FormData): Promise<FormResult> {
  return decide(kind, id, "remove", { reason: formText(formData, "reason") });
}

export async function restorePostAction(kind: string, id: string, _previous: FormResult | null): Promise<FormResult> {
  return decide(kind, id, "restore", {});
}
