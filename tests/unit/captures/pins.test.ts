// Pinning comments: the time a reviewer types (SI prefixes of the SI Brochure, 9th ed., table 7;
// U+2212 is the minus sign of ISO 80000-1, as the viewer prints it), the form's limits, and who
// may pin when (the review session states of the product brief).
import { describe, expect, it } from "vitest";
import { decidePin, pinScope } from "@/lib/captures/pin-rules";
import { parseTimeText, pinSchema } from "@/lib/captures/pin-schema";

describe("a typed time", () => {
  it("takes seconds with or without an SI prefix", () => {
    expect(parseTimeText("12.5 µs")).toBeCloseTo(12.5e-6, 15);
    expect(parseTimeText("12.5us")).toBeCloseTo(12.5e-6, 15);
    expect(parseTimeText("0.3 ms")).toBeCloseTo(3e-4, 15);
    expect(parseTimeText("250 ns")).toBeCloseTo(2.5e-7, 15);
    expect(parseTimeText("2.5e-5")).toBe(2.5e-5);
    expect(parseTimeText("1 s")).toBe(1);
    expect(parseTimeText("−12 µs")).toBeCloseTo(-12e-6, 15);
  });

  it("refuses a decimal comma, words and units that are not sub-second times", () => {
    expect(parseTimeText("1,5 µs")).toBeNull();
    expect(parseTimeText("soon")).toBeNull();
    expect(parseTimeText("5 Ms")).toBeNull();
    expect(parseTimeText("5 kHz")).toBeNull();
    expect(parseTimeText("")).toBeNull();
  });
});

describe("the pin form", () => {
  const base = { captureId: "7d3c1a8e-0000-4000-8000-000000000001", time: "12.5 µs", channel: "", body: "Ringing here after the falling edge." };

  it("reads the time and an optional channel", () => {
    expect(pinSchema.parse(base)).toMatchObject({ channel: null, body: base.body });
    expect(pinSchema.parse({ ...base, channel: "1" }).channel).toBe(1);
  });

  it("keeps comments between 1 and 2000 characters after trimming", () => {
    expect(pinSchema.safeParse({ ...base, body: "   " }).success).toBe(false);
    expect(pinSchema.safeParse({ ...base, body: "x".repeat(2000) }).success).toBe(true);
    expect(pinSchema.safeParse({ ...base, body: "x".repeat(2001) }).success).toBe(false);
    expect(pinSchema.safeParse({ ...base, time: "later" }).success).toBe(false);
  });
});

describe("who pins", () => {
  const session = { reviewerId: "reviewer", logId: "log", state: "accepted" as const };

  it("the session's reviewer, on a capture of the reviewed log, while accepted or delivered", () => {
    expect(decidePin({ actorId: "reviewer", session, captureLogId: "log" })).toEqual({ ok: true });
    expect(decidePin({ actorId: "reviewer", session: { ...session, state: "delivered" }, captureLogId: "log" })).toEqual({ ok: true });
  });

  it("nobody else, on no other log, and not once the session is over or not yet accepted", () => {
    expect(decidePin({ actorId: "builder", session, captureLogId: "log" })).toMatchObject({ ok: false, status: 404 });
    expect(decidePin({ actorId: "reviewer", session: null, captureLogId: "log" })).toMatchObject({ ok: false, status: 404 });
    expect(decidePin({ actorId: "reviewer", session, captureLogId: "another log" })).toMatchObject({ ok: false, status: 404 });
    for (const state of ["requested", "closed", "declined", "expired", "disputed"] as const) {
      expect(decidePin({ actorId: "reviewer", session: { ...session, state }, captureLogId: "log" })).toMatchObject({ ok: false, status: 409 });
    }
  });

  it("the builder and moderators read every pin, a reviewer their own sessions', a visitor none", () => {
    expect([pinScope("owner"), pinScope("moderator"), pinScope("reviewer"), pinScope("public")]).toEqual(["all", "all", "own-sessions", "none"]);
  });
});
