"use server";

import { redirect } from "next/navigation";
import { requireUser } from "@/lib/auth/guard";
import { enforceRateLimit, RateLimitedError } from "@/lib/rate-limit";
import { reviewRequestLimit, reviewRequestRefusal } from "@/lib/rate-limit/posting";
import { invalidReviewForm, reviewFailure } from "@/lib/reviews/form-result";
import { startBooking } from "@/lib/reviews/payments";
import type { FormResult } from "@/lib/validations/auth";
import { bookingSchema } from "@/lib/validations/reviews";

/** "Pay and send the request": checks and prices the booking, then sends the builder to the payment page. */
export async function bookReview(_previous: FormResult | null, form: FormData): Promise<FormResult> {
  let url: string;
  try {
    const user = await requireUser();
    const parsed = bookingSchema.safeParse({
      logId: String(form.get("logId") ?? ""),
      reviewerId: String(form.get("reviewerId") ?? ""),
      stages: form.getAll("stages").map(String),
      message: String(form.get("message") ?? ""),
    });
    if (!parsed.success) return invalidReviewForm(parsed.error);
    await enforceRateLimit(reviewRequestLimit(user.id), reviewRequestRefusal);
    url = (await startBooking(user, parsed.data)).url;
  } catch (error) {
    if (error instanceof RateLimitedError) return { ok: false, message: error.message, fieldErrors: {} };
    return reviewFailure(error, "book");
  }
  redirect(url);
}
