import type { RateLimitRule } from "@/lib/rate-limit/window";

// How often a member may post and flag. Questions and answers share one budget: a flood is a
// flood whichever form it takes.

export const POSTS_PER_HOUR = 10;
export const FLAGS_PER_HOUR = 20;
const HOUR = 3600;

export const postingLimit = (userId: string): RateLimitRule => ({ key: `qa:post:${userId}`, limit: POSTS_PER_HOUR, windowSeconds: HOUR });
export const flaggingLimit = (userId: string): RateLimitRule => ({ key: `qa:flag:${userId}`, limit: FLAGS_PER_HOUR, windowSeconds: HOUR });

export const postingRefusal = (retry: string) =>
  `You have posted ${POSTS_PER_HOUR} questions and answers in this hour, the most we take from one member. You can post again ${retry}.`;
export const flaggingRefusal = (retry: string) =>
  `You have flagged ${FLAGS_PER_HOUR} posts in this hour, the most we take from one member. You can flag again ${retry}; if something is urgent, write to the moderators.`;
