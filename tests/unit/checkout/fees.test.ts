import fc from "fast-check";
import { bignumber, round } from "mathjs";
import { describe, expect, it } from "vitest";
import { formatFeeRate, splitFee } from "@/lib/checkout/fees";

// Reference for the rounding: mathjs BigNumber `round` (decimal.js, ROUND_HALF_UP; for non-negative
// amounts the same as "round half up"), an exact decimal implementation outside this project.
function referenceFee(subtotalMinor: number, feeBps: number): number {
  return round(bignumber(subtotalMinor).mul(feeBps).div(10_000)).toNumber();
}

describe("splitFee", () => {
  it("worked examples at 8 %: 12.50 → 1.00 exact; 12.56 → 1.0048 → 1.00; 12.57 → 1.0056 → 1.01 (hand arithmetic)", () => {
    expect(splitFee(1250, 800)).toEqual({ feeMinor: 100, sellerShareMinor: 1150 });
    expect(splitFee(1256, 800)).toEqual({ feeMinor: 100, sellerShareMinor: 1156 });
    expect(splitFee(1257, 800)).toEqual({ feeMinor: 101, sellerShareMinor: 1156 });
  });

  it("rounds an exact half up, not to even and not down: 5 % of 0.10, 0.30, 0.50 → 0.005, 0.015, 0.025 → 0.01, 0.02, 0.03", () => {
    // Banker's rounding would give 0, 2, 2; truncation 0, 1, 2. Half up gives 1, 2, 3.
    expect(splitFee(10, 500).feeMinor).toBe(1);
    expect(splitFee(30, 500).feeMinor).toBe(2);
    expect(splitFee(50, 500).feeMinor).toBe(3);
    // 2.5 % of 0.20 = 0.005 → 0.01; 2.5 % of 0.60 = 0.015 → 0.02
    expect(splitFee(20, 250).feeMinor).toBe(1);
    expect(splitFee(60, 250).feeMinor).toBe(2);
  });

  it("just below and above a half: 8 % of 6.19 = 0.4952 → 0.50 … and of 0.06 = 0.0048 → 0.00, of 0.07 = 0.0056 → 0.01", () => {
    expect(splitFee(619, 800).feeMinor).toBe(50);
    expect(splitFee(6, 800).feeMinor).toBe(0);
    expect(splitFee(7, 800).feeMinor).toBe(1);
  });

  it("no fee and the 50 % ceiling of platform_settings", () => {
    expect(splitFee(9999, 0)).toEqual({ feeMinor: 0, sellerShareMinor: 9999 });
    expect(splitFee(9999, 5000)).toEqual({ feeMinor: 5000, sellerShareMinor: 4999 }); // 4999.5 → 5000
  });

  it("matches the decimal reference and fee + share = subtotal for every amount and rate", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 2_000_000_000 }), fc.integer({ min: 0, max: 10_000 }), (subtotal, bps) => {
        const { feeMinor, sellerShareMinor } = splitFee(subtotal, bps);
        expect(feeMinor).toBe(referenceFee(subtotal, bps));
        expect(feeMinor + sellerShareMinor).toBe(subtotal);
        expect(Number.isInteger(feeMinor) && feeMinor >= 0 && sellerShareMinor >= 0).toBe(true);
      }),
      { numRuns: 2000 },
    );
  });

  it("stays exact where subtotal × bps passes 2^53 (floats would not)", () => {
    const subtotal = Number.MAX_SAFE_INTEGER; // 9007199254740991
    expect(splitFee(subtotal, 800).feeMinor).toBe(referenceFee(subtotal, 800));
  });

  it("refuses fractions of a minor unit, negative amounts and impossible rates", () => {
    expect(() => splitFee(10.5, 800)).toThrow(RangeError);
    expect(() => splitFee(-1, 800)).toThrow(RangeError);
    expect(() => splitFee(100, 10_001)).toThrow(RangeError);
    expect(() => splitFee(100, 8.5)).toThrow(RangeError);
  });
});

describe("formatFeeRate", () => {
  it("basis points as a percentage (1 % = 100 bps, by definition)", () => {
    expect(formatFeeRate(800)).toBe("8 %");
    expect(formatFeeRate(850)).toBe("8.5 %");
    expect(formatFeeRate(1025)).toBe("10.25 %");
    expect(formatFeeRate(0)).toBe("0 %");
  });
});
