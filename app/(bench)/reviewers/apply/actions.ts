"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { createReviewerApplication } from "@/db/queries/reviews";
import { requireUser } from "@/lib/auth/guard";
import { invalidReviewForm, reviewFailure } from "@/lib/reviews/form-result";
import type { FormResult } from "@/lib/validations/auth";
import { reviewerApplicationSchema } from "@/lib/validations/reviews";

export async function applyToReview(_previous: FormResult | null, form: FormData): Promise<FormResult> {
  const expertise = form.getAll("expertise").map(String);
  const raw = { expertise, profileMd: String(form.get("profileMd") ?? ""), trackRecordMd: String(form.get("trackRecordMd") ?? ""), price: String(form.get("price") ?? "") };
  const values = { ...raw, expertise: expertise.join(",") };
  try {
    const user = await requireUser();
    const parsed = reviewerApplicationSchema.safeParse(raw);
    if (!parsed.success) return invalidReviewForm(parsed.error, values);
    await createReviewerApplication(user.id, parsed.data);
  } catch (error) {
    return reviewFailure(error, "apply", values);
  }
  revalidatePath("/reviewers/apply");
  // The form gives way to the application's status, so the confirmation travels in the URL.
  redirect("/reviewers/apply?sent=1");
}
