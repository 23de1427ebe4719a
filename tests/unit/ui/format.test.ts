import fc from "fast-check";
import { unit as mathUnit } from "mathjs";
import { describe, expect, it } from "vitest";
import { formatSi } from "@/components/ui/format";

// Prefixes and the space between number and unit follow the SI Brochure (BIPM, 9th ed. 2019,
// §3 table 7 and §5.4.3). Worked values: PRODUCT.md's bus peak √2·230 V·1.1 = 357.77 V ≈ 358 V.
describe("formatSi: worked examples", () => {
  it.each([
    [0.000047, "F", 3, "47 µF"],
    [357.77, "V", 3, "358 V"],
    [4.7e-9, "F", 3, "4.7 nF"],
    [2_200_000, "Ω", 3, "2.2 MΩ"],
    [0.5, "V", 3, "500 mV"],
    [1, "V", 3, "1 V"],
    [1234.5, "W", 3, "1.23 kW"],
    [1234.5, "W", 2, "1.2 kW"],
    [0.0123456, "s", 4, "12.35 ms"],
    [33e-12, "F", 3, "33 pF"],
    [-0.02, "A", 3, "−20 mA"],
  ])("%s %s (%i digits) → %s", (value, unit, digits, expected) => {
    expect(formatSi(value, unit, digits)).toBe(expected);
  });

  it("carries into the next prefix when rounding reaches 1000", () => {
    // 999.7 V to 3 significant digits is 1.00 kV, not "1000 V".
    expect(formatSi(999.7, "V", 3)).toBe("1 kV");
    expect(formatSi(0.00099995, "F", 3)).toBe("1 mF");
  });

  it("handles zero, unbounded and missing values", () => {
    expect(formatSi(0, "V")).toBe("0 V");
    // An unbounded discharge time (no bleeder) is a real answer, so it prints as infinity.
    expect(formatSi(Number.POSITIVE_INFINITY, "s")).toBe("∞ s");
    expect(formatSi(Number.NaN, "s")).toBe("—");
  });

  it("does not prefix units that take none", () => {
    // SI Brochure §5.4.7: a space before %, and no prefix on it; °C is never prefixed in practice.
    expect(formatSi(12.5, "%")).toBe("12.5 %");
    expect(formatSi(1500, "°C")).toBe("1500 °C");
    expect(formatSi(2400, "", 3)).toBe("2400");
    expect(formatSi(2400, "A/mm²", 3, { prefixes: false })).toBe("2400 A/mm²");
  });

  it("clamps to pico and tera at the ends of the range", () => {
    expect(formatSi(3e-13, "F")).toBe("0.3 pF");
    expect(formatSi(5e15, "J")).toBe("5000 TJ");
  });
});

// Cross-check against mathjs's own unit parser: reading our text back must give the value to
// within the rounding that `digits` allows, and the mantissa must sit in [1, 1000).
describe("formatSi: round trip through mathjs", () => {
  const toMathjs = (text: string) => text.replace("µ", "u").replace("−", "-");
  it("parses back to the same value", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-12, max: 9e14, noNaN: true }),
        fc.boolean(),
        fc.constantFrom("V", "A", "F", "H", "s", "W", "J"),
        fc.integer({ min: 2, max: 6 }),
        (magnitude, negative, unit, digits) => {
          const value = negative ? -magnitude : magnitude;
          const text = formatSi(value, unit, digits);
          const mantissa = Math.abs(Number.parseFloat(toMathjs(text)));
          expect(mantissa).toBeGreaterThanOrEqual(1);
          expect(mantissa).toBeLessThan(1000);
          const back = mathUnit(toMathjs(text)).toNumber(unit);
          expect(Math.abs(back - value)).toBeLessThanOrEqual(Math.abs(value) * 0.5 * 10 ** (1 - digits) * 1.000001);
        },
      ),
      { numRuns: 2000 },
    );
  });
});
