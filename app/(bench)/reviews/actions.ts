"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { setReviewerAvailability } from "@/db/queries/reviews";
import { requireUser } from "@/lib/auth/guard";
import { reviewFailure } from "@/lib/reviews/form-result";
import { startReviewerPayoutOnboarding } from "@/lib/reviews/payouts";
import type { FormResult } from "@/lib/validations/auth";

/** "Connect payout account": makes the connected account if needed and sends the reviewer to the provider's onboarding. */
export async function connectReviewerPayout(_previous: FormResult | null, _form: FormData): Promise<FormResult> {
  let url: string;
  try {
    const user = await requireUser(["reviewer"]);
    url = await startReviewerPayoutOnboarding(user);
  } catch (error) {
    return reviewFailure(error, "payouts");
  }
  redirect(url);
}

export async function changeAvailability(_previous: FormResult | null, form: FormData): Promise<FormResult> {
  try {
    const user = await requireUser(["reviewer"]);
    await setReviewerAvailability(user.id, form.get("available") === "yes");
  } catch (error) {
    return reviewFailure(error, "availability");
  }
  revalidatePath("/reviews");
  revalidatePath("/reviewers");
  return { ok: true };
}
