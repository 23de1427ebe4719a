import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { minorDigits, toDecimalString } from "@/lib/format/money";
import { basisPointsToPercent, parseMajorUnits, parsePercentToBasisPoints } from "@/lib/orders/amount-input";

// Minor digits per ISO 4217 as Intl's CLDR data gives them: EUR 2, JPY 0, KWD 3 (from memory, and
// checked here against Intl itself).
describe("parseMajorUnits", () => {
  it("reads major units of EUR, JPY and KWD into their minor units", () => {
    expect(minorDigits("EUR")).toBe(2);
    expect(parseMajorUnits("12.50", minorDigits("EUR"))).toEqual({ ok: true, minor: 1250 });
    expect(parseMajorUnits("12.5", 2)).toEqual({ ok: true, minor: 1250 });
    expect(parseMajorUnits("12", 2)).toEqual({ ok: true, minor: 1200 });
    expect(parseMajorUnits("1200", minorDigits("JPY"))).toEqual({ ok: true, minor: 1200 });
    expect(parseMajorUnits("1.234", minorDigits("KWD"))).toEqual({ ok: true, minor: 1234 });
  });

  it("takes a decimal comma, as many European keyboards and locales write it (CLDR de-DE: 12,50)", () => {
    expect(parseMajorUnits("12,50", 2)).toEqual({ ok: true, minor: 1250 });
    expect(parseMajorUnits(" 0,05 ", 2)).toEqual({ ok: true, minor: 5 });
  });

  it("is exact where binary floating point is not: 0.30 is 30 cents, while 0.1 + 0.2 in floats is not 0.3", () => {
    expect(0.1 + 0.2).not.toBe(0.3); // IEEE 754 binary64
    expect(parseMajorUnits("0.30", 2)).toEqual({ ok: true, minor: 30 });
    // 1.15 × 100 is 114.99999999999999 in binary64; a float-based parser would give 114 or need rounding.
    expect(1.15 * 100).not.toBe(115);
    expect(parseMajorUnits("1.15", 2)).toEqual({ ok: true, minor: 115 });
  });

  it("refuses what it would have to guess at", () => {
    for (const text of ["", "abc", "-5", "+5", "1,234.50", "1.234,50", "12.505", "€12", "12.", ".5", "1e3"]) {
      expect(parseMajorUnits(text, 2).ok, text).toBe(false);
    }
    expect(parseMajorUnits("12.5", minorDigits("JPY")).ok).toBe(false);
    expect(parseMajorUnits("99999999999999999999", 2).ok).toBe(false);
  });

  it("reads back every amount the app's formatter writes (round trip through toDecimalString)", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: Number.MAX_SAFE_INTEGER }), fc.constantFrom(0, 2, 3), (minor, digits) => {
        expect(parseMajorUnits(toDecimalString(minor, digits), digits)).toEqual({ ok: true, minor });
      }),
    );
  });
});

describe("percentages and basis points", () => {
  // A basis point is one hundredth of a percent (common practice in finance): 8 % = 800 bp.
  it("reads 8, 8.25 and 50 % as 800, 825 and 5000 bp", () => {
    expect(parsePercentToBasisPoints("8")).toEqual({ ok: true, minor: 800 });
    expect(parsePercentToBasisPoints("8.25")).toEqual({ ok: true, minor: 825 });
    expect(parsePercentToBasisPoints("8.5%")).toEqual({ ok: true, minor: 850 });
    expect(parsePercentToBasisPoints("50")).toEqual({ ok: true, minor: 5000 });
    expect(parsePercentToBasisPoints("0")).toEqual({ ok: true, minor: 0 });
  });

  it("refuses a third decimal (a fraction of a basis point) and negative rates", () => {
    expect(parsePercentToBasisPoints("8.125").ok).toBe(false);
    expect(parsePercentToBasisPoints("-1").ok).toBe(false);
  });

  it("writes basis points back as the percentage typed", () => {
    expect(basisPointsToPercent(800)).toBe("8");
    expect(basisPointsToPercent(825)).toBe("8.25");
    expect(basisPointsToPercent(850)).toBe("8.5");
    expect(basisPointsToPercent(5)).toBe("0.05");
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 5000 }), (bps) => {
        expect(parsePercentToBasisPoints(basisPointsToPercent(bps))).toEqual({ ok: true, minor: bps });
      }),
    );
  });
});
