"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { acceptReview, declineReview, disputeReview } from "@/db/queries/reviews";
import { requireUser } from "@/lib/auth/guard";
import { invalidReviewForm, reviewFailure } from "@/lib/reviews/form-result";
import type { FormResult } from "@/lib/validations/auth";
import { declineReviewSchema, disputeSchema } from "@/lib/validations/reviews";

// Each action re-checks on the server who may do it and whether the session's state and clock allow
// it (db/queries/reviews.ts through lib/reviews/transitions.ts); the page's buttons are only a guide.

function done(sessionId: string, what: string): never {
  revalidatePath("/reviews");
  revalidatePath(`/reviews/${sessionId}`);
  redirect(`/reviews/${sessionId}?done=${what}`);
}

export async function acceptAction(sessionId: string, _previous: FormResult | null, _form: FormData): Promise<FormResult> {
  try {
    const user = await requireUser(["reviewer"]);
    await acceptReview({ actor: user, sessionId });
  } catch (error) {
    return reviewFailure(error, "accept");
  }
  done(sessionId, "accepted");
}

export async function declineAction(sessionId: string, _previous: FormResult | null, form: FormData): Promise<FormResult> {
  try {
    const user = await requireUser(["reviewer"]);
    const parsed = declineReviewSchema.safeParse({ reason: String(form.get("reason") ?? "") });
    if (!parsed.success) return invalidReviewForm(parsed.error);
    await declineReview({ actor: user, sessionId, reason: parsed.data.reason });
  } catch (error) {
    return reviewFailure(error, "decline");
  }
  done(sessionId, "declined");
}

export async function disputeAction(sessionId: string, _previous: FormResult | null, form: FormData): Promise<FormResult> {
  try {
    const user = await requireUser();
    const parsed = disputeSchema.safeParse({ reason: String(form.get("reason") ?? "") });
    if (!parsed.success) return invalidReviewForm(parsed.error);
    await disputeReview({ actor: user, sessionId, reason: parsed.data.reason });
  } catch (error) {
    return reviewFailure(error, "dispute");
  }
  done(sessionId, "disputed");
}
