import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { refundParts, reviewerShareDue, reviewSplit } from "@/lib/reviews/money";

// Worked by hand: 8 % of €45.00 is 4500 × 800 / 10 000 = 360 exactly; 8 % of €39.99 is 319.92,
// rounded half up to 320. Refunds give the fee back pro rata (the same rule as order refunds).

describe("a review's fee and share", () => {
  it("splits the price at the platform's rate, fee + share = price", () => {
    expect(reviewSplit(4500, 800)).toEqual({ feeMinor: 360, reviewerShareMinor: 4140 });
    expect(reviewSplit(3999, 800)).toEqual({ feeMinor: 320, reviewerShareMinor: 3679 });
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 10_000_000 }), fc.integer({ min: 0, max: 5000 }), (price, bps) => {
        const { feeMinor, reviewerShareMinor } = reviewSplit(price, bps);
        return feeMinor + reviewerShareMinor === price && feeMinor >= 0 && reviewerShareMinor >= 0;
      }),
    );
  });
});

describe("refunds after a dispute", () => {
  const session = { priceMinor: 4500, feeMinor: 360, reviewerShareMinor: 4140, refundedMinor: 0 };

  it("a third back: the fee gives up 120, the reviewer 1380", () => {
    expect(refundParts(session, 1500)).toEqual({ feeMinor: 120, reviewerMinor: 1380 });
  });

  it("in full: the whole fee and the whole share go back", () => {
    expect(refundParts(session, 4500)).toEqual({ feeMinor: 360, reviewerMinor: 4140 });
  });

  it("the share still owed shrinks by the reviewer's part of what was refunded", () => {
    expect(reviewerShareDue(session)).toBe(4140);
    expect(reviewerShareDue({ ...session, refundedMinor: 1500 })).toBe(4140 - 1380);
    expect(reviewerShareDue({ ...session, refundedMinor: 4500 })).toBe(0);
  });
});
