import fc from "fast-check";
import { bignumber } from "mathjs";
import { describe, expect, it } from "vitest";
import { mulDivRoundHalfUp, splitRefund } from "@/lib/orders/refund-split";

// Rounding to the cent "half up" is the rule Council Regulation (EC) No 1103/97, art. 5, sets for
// amounts converted to euro: a result exactly half way is rounded up (from memory). The reference
// implementation is decimal.js inside mathjs (BigNumber, ROUND_HALF_UP = 4), an independent library.
const ROUND_HALF_UP = (bignumber(0).constructor as unknown as { ROUND_HALF_UP: 4 }).ROUND_HALF_UP;

function referenceRound(a: number, b: number, d: number): number {
  return bignumber(a).times(b).div(d).toDecimalPlaces(0, ROUND_HALF_UP).toNumber();
}

describe("mulDivRoundHalfUp", () => {
  it("rounds an exact half up and anything below it down", () => {
    expect(mulDivRoundHalfUp(1, 5, 2)).toBe(3); // 2.5 → 3
    expect(mulDivRoundHalfUp(1, 7, 2)).toBe(4); // 3.5 → 4
    expect(mulDivRoundHalfUp(1, 2499, 1000)).toBe(2); // 2.499 → 2
    expect(mulDivRoundHalfUp(4, 125, 1000)).toBe(1); // 0.5 → 1
  });

  it("agrees with decimal.js's ROUND_HALF_UP for any amounts, including products past 2^53", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 2 ** 40 }), fc.integer({ min: 0, max: 2 ** 20 }), fc.integer({ min: 1, max: 2 ** 40 }), (a, b, d) => {
        expect(mulDivRoundHalfUp(a, b, d)).toBe(referenceRound(a, b, d));
      }),
    );
  });
});

describe("splitRefund", () => {
  // Worked by hand: an order of €125.00 with an 8 % fee (€10.00) and the seller's €115.00.
  it("refunds the fee pro rata: €33.33 of €125.00 gives back €2.67 of fee (266.64 rounded) and €30.66 of share", () => {
    expect(splitRefund({ subtotalMinor: 12_500, feeMinor: 1_000, refundedBeforeMinor: 0, amountMinor: 3_333 })).toEqual({ feeMinor: 267, sellerMinor: 3_066 });
  });

  it("takes the rest of the fee with the last refund, so the whole fee and the whole share go back", () => {
    // 12 500 refunded in total: fee back 1000; before it 267 were back, so 733 now.
    expect(splitRefund({ subtotalMinor: 12_500, feeMinor: 1_000, refundedBeforeMinor: 3_333, amountMinor: 9_167 })).toEqual({ feeMinor: 733, sellerMinor: 8_434 });
    expect(267 + 733).toBe(1_000);
    expect(3_066 + 8_434).toBe(11_500);
  });

  it("rounds an exact half cent of fee up", () => {
    // 4 × 125 / 1000 = 0.5 → 1 cent of fee, 3 cents from the seller.
    expect(splitRefund({ subtotalMinor: 1_000, feeMinor: 125, refundedBeforeMinor: 0, amountMinor: 4 })).toEqual({ feeMinor: 1, sellerMinor: 3 });
  });

  it("refunds no fee when the fee was 0 %, and all of it from the seller", () => {
    expect(splitRefund({ subtotalMinor: 5_000, feeMinor: 0, refundedBeforeMinor: 0, amountMinor: 1_234 })).toEqual({ feeMinor: 0, sellerMinor: 1_234 });
  });

  it("refuses to refund more than the subtotal", () => {
    expect(() => splitRefund({ subtotalMinor: 12_500, feeMinor: 1_000, refundedBeforeMinor: 12_000, amountMinor: 501 })).toThrow(RangeError);
    expect(() => splitRefund({ subtotalMinor: 12_500, feeMinor: 1_000, refundedBeforeMinor: 0, amountMinor: -1 })).toThrow(RangeError);
  });

  it("for any order and any way of refunding all of it in parts: each part splits into whole non-negative units, and the parts add up to exactly the fee and the share", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 10_000_000 }),
        fc.integer({ min: 0, max: 5_000 }),
        fc.array(fc.integer({ min: 1, max: 1_000 }), { minLength: 1, maxLength: 12 }),
        (subtotal, feeBps, weights) => {
          const fee = referenceRound(subtotal, feeBps, 10_000);
          // Cut the subtotal into parts proportional to the weights; the last part takes the rest.
          const totalWeight = weights.reduce((a, b) => a + b, 0);
          const parts: number[] = [];
          let given = 0;
          weights.forEach((w, i) => {
            const part = i === weights.length - 1 ? subtotal - given : Math.floor((subtotal * w) / totalWeight);
            parts.push(part);
            given += part;
          });
          let before = 0;
          let feeBack = 0;
          let sellerBack = 0;
          for (const amount of parts.filter((p) => p > 0)) {
            const split = splitRefund({ subtotalMinor: subtotal, feeMinor: fee, refundedBeforeMinor: before, amountMinor: amount });
            expect(Number.isInteger(split.feeMinor) && Number.isInteger(split.sellerMinor)).toBe(true);
            expect(split.feeMinor).toBeGreaterThanOrEqual(0);
            expect(split.sellerMinor).toBeGreaterThanOrEqual(0);
            expect(split.feeMinor + split.sellerMinor).toBe(amount);
            // Never more than one unit away from the exact pro-rata fee of this part.
            expect(Math.abs(split.feeMinor - (amount * fee) / subtotal)).toBeLessThanOrEqual(1);
            before += amount;
            feeBack += split.feeMinor;
            sellerBack += split.sellerMinor;
          }
          expect(feeBack).toBe(fee);
          expect(sellerBack).toBe(subtotal - fee);
        },
      ),
    );
  });
});
