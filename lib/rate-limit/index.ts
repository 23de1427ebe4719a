import "server-only";
import type { Executor } from "@/db/client";
import { countHit } from "@/db/queries/rate-limits";
import { decide, describeRetry, type RateLimitDecision, type RateLimitRule } from "./window";

// Rate limits kept in PostgreSQL (table rate_limits), so every app instance counts against the
// same windows. Fixed windows: simple, one row per key and window, and an atomic upsert per hit.

export type { RateLimitDecision, RateLimitRule } from "./window";
export { describeRetry } from "./window";

export class RateLimitedError extends Error {
  constructor(
    message: string,
    readonly decision: RateLimitDecision,
  ) {
    super(message);
    this.name = "RateLimitedError";
  }
}

/**
 * Counts one hit and says whether it is within the limit. Inside a transaction (`executor`), the
 * hit is undone if the transaction rolls back, and the window's row stays locked until it ends,
 * so the caller's own concurrent requests are counted one after another.
 */
export async function consumeRateLimit(
  rule: RateLimitRule,
  { executor, now }: { executor?: Executor; now?: Date } = {},
): Promise<RateLimitDecision> {
  if (!Number.isInteger(rule.limit) || rule.limit < 1) throw new Error(`rate limit for ${rule.key} must be a whole number ≥ 1`);
  if (!Number.isInteger(rule.windowSeconds) || rule.windowSeconds < 1) throw new Error(`rate window for ${rule.key} must be whole seconds ≥ 1`);
  // Without `now` the database's clock places the window, the same clock for every instance.
  const { count, windowStart } = await countHit({ key: rule.key, windowSeconds: rule.windowSeconds, ...(now ? { at: now } : {}) }, executor);
  return decide(rule, count, windowStart, now ?? new Date());
}

/** consumeRateLimit, throwing RateLimitedError with `refusal(retry)` as its message when over the limit. */
export async function enforceRateLimit(
  rule: RateLimitRule,
  refusal: (retry: string) => string,
  options: { executor?: Executor; now?: Date } = {},
): Promise<RateLimitDecision> {
  const decision = await consumeRateLimit(rule, options);
  if (!decision.allowed) throw new RateLimitedError(refusal(describeRetry(decision.resetAt, options.now ?? new Date())), decision);
  return decision;
}
