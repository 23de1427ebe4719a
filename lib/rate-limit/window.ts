// Pure arithmetic of a fixed-window limit, shared by the server (lib/rate-limit/index.ts) and tests.

export type RateLimitRule = {
  /** What is counted and for whom, e.g. `qa:post:<user id>` or `sign-in:<address>`. */
  key: string;
  /** The most hits allowed in one window. */
  limit: number;
  windowSeconds: number;
};

export type RateLimitDecision = {
  allowed: boolean;
  /** hits in this window, this one included */
  count: number;
  limit: number;
  remaining: number;
  /** when the window ends and hits are counted afresh */
  resetAt: Date;
  retryAfterSeconds: number;
};

export function decide(rule: RateLimitRule, count: number, windowStart: Date, now: Date): RateLimitDecision {
  const resetAt = new Date(windowStart.getTime() + rule.windowSeconds * 1000);
  return {
    allowed: count <= rule.limit,
    count,
    limit: rule.limit,
    remaining: Math.max(0, rule.limit - count),
    resetAt,
    retryAfterSeconds: Math.max(1, Math.ceil((resetAt.getTime() - now.getTime()) / 1000)),
  };
}

/** "in 23 minutes (at 14:00 UTC)", "in 40 seconds (at 14:00 UTC)". */
export function describeRetry(resetAt: Date, now: Date): string {
  const seconds = Math.max(1, Math.ceil((resetAt.getTime() - now.getTime()) / 1000));
  const wait =
    seconds < 90 ? `${seconds} second${seconds === 1 ? "" : "s"}` : seconds < 5400 ? `${Math.ceil(seconds / 60)} minutes` : `${Math.ceil(seconds / 3600)} hours`;
  const at = resetAt.toISOString().slice(11, 16);
  return `in ${wait} (at ${at} UTC)`;
}
