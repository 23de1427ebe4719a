import { describe, expect, it } from "vitest";
import { bookingSchema, reportSchema, reviewerApplicationSchema, reviewPriceSchema, settleDisputeSchema, verdictSchema } from "@/lib/validations/reviews";

// Prices are typed in major units and parsed as digits, never through a float: 0.1 + 0.2 ≠ 0.3 in
// IEEE 754 binary64 (the standard's double), so "19.99" must become exactly 1999 minor units.
// EUR has two minor digits (ISO 4217, as Intl reports it).

const application = {
  expertise: ["welding-inverters", "gate-drive"],
  profileMd: "I review half-bridge welders and bench supplies, mostly from scope captures and lamp tests.",
  trackRecordMd: "Brought up five stick welders and two induction heaters; found a swapped gate-drive winding and a cracked bus capacitor on the way.",
  price: "45",
};

describe("review price", () => {
  it("turns major units into exact minor units", () => {
    expect(reviewPriceSchema.parse("19.99")).toBe(1999);
    expect(reviewPriceSchema.parse("45")).toBe(4500);
    expect(reviewPriceSchema.parse(" 12.5 ")).toBe(1250);
    expect(reviewPriceSchema.parse("1000.00")).toBe(100_000);
  });

  it("refuses more than two decimals, separators, signs and prices outside 5.00–1000.00", () => {
    for (const bad of ["19.999", "1,000", "€45", "-10", "4.99", "1000.01", "", "abc"]) {
      expect(reviewPriceSchema.safeParse(bad).success, bad).toBe(false);
    }
  });
});

describe("reviewer application", () => {
  it("parses a complete application into minor units", () => {
    const { price: _price, ...rest } = application;
    expect(reviewerApplicationSchema.parse(application)).toStrictEqual({ ...rest, priceMinor: 4500 });
  });

  it("needs an area from the list, each once, and a substantial track record", () => {
    expect(reviewerApplicationSchema.safeParse({ ...application, expertise: [] }).success).toBe(false);
    expect(reviewerApplicationSchema.safeParse({ ...application, expertise: ["astrology"] }).success).toBe(false);
    expect(reviewerApplicationSchema.safeParse({ ...application, expertise: ["chargers", "chargers"] }).success).toBe(false);
    expect(reviewerApplicationSchema.safeParse({ ...application, trackRecordMd: "Lots." }).success).toBe(false);
  });
});

describe("booking", () => {
  const base = { logId: "3f0c2b1a-9d8e-4c7b-a6f5-0e1d2c3b4a59", reviewerId: "demo-reviewer" };

  it("puts the stages in bring-up order whatever order they were ticked in", () => {
    expect(bookingSchema.parse({ ...base, stages: ["rated-load", "control-supply"] }).stages).toEqual(["control-supply", "rated-load"]);
  });

  it("needs at least one known stage and keeps the note within the payment metadata's 500 characters", () => {
    expect(bookingSchema.safeParse({ ...base, stages: [] }).success).toBe(false);
    expect(bookingSchema.safeParse({ ...base, stages: ["smoke-test"] }).success).toBe(false);
    expect(bookingSchema.safeParse({ ...base, stages: ["series-lamp"], message: "x".repeat(501) }).success).toBe(false);
    expect(bookingSchema.safeParse({ ...base, stages: ["series-lamp"], message: "x".repeat(500) }).success).toBe(true);
  });
});

describe("report", () => {
  const id = "7a1b2c3d-4e5f-4a6b-8c7d-9e0f1a2b3c4d";

  it("a fine verdict may stand alone; needs attention and stop must say what to fix", () => {
    expect(verdictSchema.safeParse({ checkpointId: id, verdict: "fine" }).success).toBe(true);
    expect(verdictSchema.safeParse({ checkpointId: id, verdict: "stop", comment: "bad" }).success).toBe(false);
    expect(verdictSchema.safeParse({ checkpointId: id, verdict: "needs_attention", comment: "" }).success).toBe(false);
    expect(verdictSchema.safeParse({ checkpointId: id, verdict: "stop", comment: "Bus rises past 400 V behind the lamp; find the cause first." }).success).toBe(true);
    expect(verdictSchema.safeParse({ checkpointId: id, verdict: "maybe" }).success).toBe(false);
  });

  it("needs at least one verdict and a summary", () => {
    expect(reportSchema.safeParse({ verdicts: [], summaryMd: "x".repeat(50) }).success).toBe(false);
    expect(reportSchema.safeParse({ verdicts: [{ checkpointId: id, verdict: "fine" }], summaryMd: "Fine." }).success).toBe(false);
  });
});

describe("settling a dispute", () => {
  const note = "Half the booked stages were reviewed properly.";

  it("a part refund needs an amount, parsed exactly; the other outcomes ignore it", () => {
    expect(settleDisputeSchema.parse({ outcome: "refund_partial", amount: "15.05", note })).toEqual({ outcome: "refund_partial", note, refundMinor: 1505 });
    expect(settleDisputeSchema.parse({ outcome: "refund_full", amount: "15", note })).toEqual({ outcome: "refund_full", note });
    expect(settleDisputeSchema.safeParse({ outcome: "refund_partial", amount: "", note }).success).toBe(false);
    expect(settleDisputeSchema.safeParse({ outcome: "refund_partial", amount: "0", note }).success).toBe(false);
    expect(settleDisputeSchema.safeParse({ outcome: "refund_everything", note }).success).toBe(false);
  });
});
