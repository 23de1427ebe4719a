import "server-only";
import {
  closeReview,
  collectionsDue,
  collectReviewPayment,
  expireReview,
  releasesDue,
  releaseSessionHold,
  sessionsDueForClosing,
  sessionsDueForExpiry,
} from "@/db/queries/reviews";

// The scheduled job behind the deadlines (queue reviews-expire, every 5 minutes): requests nobody
// answered in 48 hours and accepted sessions with no report by the delivery deadline expire and
// their holds are released; delivered sessions with no dispute after 7 days close. It also retries
// whatever the provider did not confirm earlier: releases, captures and the reviewers' transfers.

export type SweepResult = { expired: number; closed: number; released: number; collected: number };

export async function expireOverdueReviews(now = new Date()): Promise<SweepResult> {
  const result: SweepResult = { expired: 0, closed: 0, released: 0, collected: 0 };
  for (const id of await sessionsDueForExpiry(now)) {
    if (await expireReview(id, now)) result.expired += 1;
  }
  for (const id of await sessionsDueForClosing(now)) {
    if (await closeReview(id, now)) result.closed += 1;
  }
  for (const id of await releasesDue()) {
    if (await releaseSessionHold(id)) result.released += 1;
  }
  for (const id of await collectionsDue()) {
    const outcome = await collectReviewPayment(id);
    if (outcome.captured && outcome.transferred) result.collected += 1;
  }
  return result;
}
