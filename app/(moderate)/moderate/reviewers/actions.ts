"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { approveReviewerApplication, declineReviewerApplication } from "@/db/queries/reviews";
import { requireUser } from "@/lib/auth/guard";
import { invalidReviewForm, reviewFailure } from "@/lib/reviews/form-result";
import type { FormResult } from "@/lib/validations/auth";
import { declineReviewerSchema } from "@/lib/validations/reviews";

export async function approveReviewerAction(applicationId: string, _previous: FormResult | null, _form: FormData): Promise<FormResult> {
  try {
    const user = await requireUser(["moderator"]);
    await approveReviewerApplication({ actor: user, applicationId });
  } catch (error) {
    return reviewFailure(error, "vet");
  }
  revalidatePath("/moderate", "layout");
  revalidatePath("/reviewers");
  redirect("/moderate/reviewers?done=approved");
}

export async function declineReviewerAction(applicationId: string, _previous: FormResult | null, form: FormData): Promise<FormResult> {
  try {
    const user = await requireUser(["moderator"]);
    const parsed = declineReviewerSchema.safeParse({ reason: String(form.get("reason") ?? "") });
    if (!parsed.success) return invalidReviewForm(parsed.error);
    await declineReviewerApplication({ actor: user, applicationId, reason: parsed.data.reason });
  } catch (error) {
    return reviewFailure(error, "vet");
  }
  revalidatePath("/moderate", "layout");
  redirect("/moderate/reviewers?done=declined");
}
