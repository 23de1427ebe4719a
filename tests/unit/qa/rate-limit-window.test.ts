import { describe, expect, it } from "vitest";
import { decide, describeRetry } from "@/lib/rate-limit/window";
import { postingLimit, flaggingLimit } from "@/lib/qa/limits";

// A fixed-window counter: hits are counted per window; the window's limit is the most allowed, and a
// refusal says when the window ends. 429 Too Many Requests is RFC 6585 §4; Retry-After as
// delay-seconds is RFC 9110 §10.2.3 (a whole number of seconds, rounded up here so a client that
// waits that long is never early).

describe("decide", () => {
  const rule = { key: "k", limit: 10, windowSeconds: 3600 };
  const windowStart = new Date("2025-03-01T13:00:00Z");

  it("allows the 10th hit of the hour and refuses the 11th", () => {
    const now = new Date("2025-03-01T13:47:12Z");
    expect(decide(rule, 10, windowStart, now)).toMatchObject({ allowed: true, remaining: 0 });
    expect(decide(rule, 11, windowStart, now)).toMatchObject({ allowed: false, remaining: 0 });
    expect(decide(rule, 1, windowStart, now)).toMatchObject({ allowed: true, remaining: 9 });
  });

  it("ends the window one window length after its start: 13:47:12 waits 12 min 48 s = 768 s for 14:00", () => {
    const d = decide(rule, 11, windowStart, new Date("2025-03-01T13:47:12Z"));
    expect(d.resetAt.toISOString()).toBe("2025-03-01T14:00:00.000Z");
    expect(d.retryAfterSeconds).toBe(768);
  });

  it("rounds a part second up and never answers zero", () => {
    expect(decide(rule, 11, windowStart, new Date("2025-03-01T13:59:59.200Z")).retryAfterSeconds).toBe(1);
    expect(decide(rule, 11, windowStart, new Date("2025-03-01T14:00:00Z")).retryAfterSeconds).toBe(1);
  });
});

describe("describeRetry", () => {
  it("names the wait and the clock time in UTC", () => {
    expect(describeRetry(new Date("2025-03-01T14:00:00Z"), new Date("2025-03-01T13:47:12Z"))).toBe("in 13 minutes (at 14:00 UTC)");
    expect(describeRetry(new Date("2025-03-01T14:00:00Z"), new Date("2025-03-01T13:59:20Z"))).toBe("in 40 seconds (at 14:00 UTC)");
  });
});

describe("the Q&A's limits (issue 6 brief: posting 10 per hour, flagging 20 per hour, per member)", () => {
  it("keys each budget by member and kind", () => {
    expect(postingLimit("u1")).toEqual({ key: "qa:post:u1", limit: 10, windowSeconds: 3600 });
    expect(flaggingLimit("u1")).toEqual({ key: "qa:flag:u1", limit: 20, windowSeconds: 3600 });
    expect(postingLimit("u1").key).not.toBe(postingLimit("u2").key);
  });
});
