import type { RateLimitRule } from "./window";

// How often a member may put something in front of other people besides Q&A posts (lib/qa/limits.ts):
// review requests reach a reviewer and open a hosted payment each; listing submissions fill the
// moderators' queue. Both are a handful a day for a real person; a flood is stopped within the hour.

export const REVIEW_REQUESTS_PER_HOUR = 10;
export const LISTING_SUBMISSIONS_PER_HOUR = 20;
const HOUR = 3600;

export const reviewRequestLimit = (userId: string): RateLimitRule => ({ key: `reviews:request:${userId}`, limit: REVIEW_REQUESTS_PER_HOUR, windowSeconds: HOUR });
export const listingSubmissionLimit = (userId: string): RateLimitRule => ({ key: `listings:submit:${userId}`, limit: LISTING_SUBMISSIONS_PER_HOUR, windowSeconds: HOUR });

export const reviewRequestRefusal = (retry: string) =>
  `You have asked for ${REVIEW_REQUESTS_PER_HOUR} reviews in this hour, the most we take from one member. Nothing was charged; you can ask again ${retry}.`;
export const listingSubmissionRefusal = (retry: string) =>
  `You have submitted ${LISTING_SUBMISSIONS_PER_HOUR} listings for review in this hour, the most we take from one seller. You can submit again ${retry}.`;
