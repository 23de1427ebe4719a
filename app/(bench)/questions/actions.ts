"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { failedForm, formText, isRefusal, memberOrRefusal } from "@/lib/qa/form-result";
import { askQuestion } from "@/lib/qa/posting";
import type { FormResult } from "@/lib/validations/auth";
import { photosFromForm } from "@/lib/validations/qa";

/** The ask form: session, then askQuestion (zod, rate limit, links, pre-moderation), then the question's page. */
export async function askQuestionAction(_previous: FormResult | null, formData: FormData): Promise<FormResult> {
  const values = { title: formText(formData, "title"), bodyMd: formText(formData, "bodyMd"), listingId: formText(formData, "listingId"), logId: formText(formData, "logId") };
  const user = await memberOrRefusal(values);
  if (isRefusal(user)) return user;
  const outcome = await askQuestion(user, { ...values, photos: photosFromForm(formData) });
  if (!outcome.ok) return failedForm(outcome, values);
  revalidatePath("/questions");
  revalidatePath("/moderate/posts");
  redirect(`/questions/${outcome.id}?posted=${outcome.state}`);
}
