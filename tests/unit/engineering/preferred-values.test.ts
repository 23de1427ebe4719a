import { describe, expect, it } from "vitest";
import { E12_SERIES, E24_SERIES, preferredValue } from "@/lib/engineering";

// IEC 60063 tables, copied here from the standard's E12 and E24 columns (not from the code).
const IEC_E12 = [1.0, 1.2, 1.5, 1.8, 2.2, 2.7, 3.3, 3.9, 4.7, 5.6, 6.8, 8.2];
const IEC_E24 = [
  1.0, 1.1, 1.2, 1.3, 1.5, 1.6, 1.8, 2.0, 2.2, 2.4, 2.7, 3.0, 3.3, 3.6, 3.9, 4.3, 4.7, 5.1, 5.6, 6.2, 6.8, 7.5, 8.2, 9.1,
];

describe("E12 / E24 tables (IEC 60063)", () => {
  it("match the standard, including the values a formula would get wrong (2.7, 3.3, 4.7)", () => {
    expect(E12_SERIES.map((d) => d / 10)).toEqual(IEC_E12);
    expect(E24_SERIES.map((d) => d / 10)).toEqual(IEC_E24);
    expect(Math.round(10 ** (5 / 12) * 10) / 10).toBe(2.6); // 10^(5/12) rounds to 2.6, the table says 2.7
  });
});

describe("preferredValue (IEC 60063)", () => {
  it("finds every table value in its own decade and others", () => {
    for (const m of IEC_E12) {
      for (const decade of [1e-9, 1e-6, 1, 1e3, 1e6]) {
        const v = Number((m * decade).toPrecision(3));
        expect(preferredValue(v, { series: "E12", direction: "down" })).toBe(v);
        expect(preferredValue(v, { series: "E12", direction: "up" })).toBe(v);
        expect(preferredValue(v, { series: "E12", direction: "nearest" })).toBe(v);
      }
    }
  });

  it("rounds down, up and to the nearest (on the log scale the series is spaced on)", () => {
    expect(preferredValue(50_000, { series: "E12", direction: "down" })).toBe(47_000);
    expect(preferredValue(50_000, { series: "E12", direction: "up" })).toBe(56_000);
    expect(preferredValue(50_000, { series: "E12", direction: "nearest" })).toBe(47_000);
    expect(preferredValue(50_000, { series: "E24", direction: "nearest" })).toBe(51_000);
    expect(preferredValue(5.2, { series: "E12", direction: "nearest" })).toBe(5.6); // above √(4.7·5.6) ≈ 5.13
    expect(preferredValue(5.1, { series: "E12", direction: "nearest" })).toBe(4.7);
    // 5.14 is past the geometric mean (5.13) but short of the arithmetic one (5.15)
    expect(preferredValue(5.14, { series: "E12", direction: "nearest" })).toBe(5.6);
  });

  it("crosses decade boundaries: 9.5 rounds up to 10, 0.95 down to 0.82", () => {
    expect(preferredValue(9.5, { series: "E12", direction: "up" })).toBe(10);
    expect(preferredValue(9.6, { series: "E24", direction: "nearest" })).toBe(10); // above √(9.1·10) ≈ 9.54
    expect(preferredValue(9.5, { series: "E24", direction: "nearest" })).toBe(9.1);
    expect(preferredValue(0.95, { series: "E12", direction: "down" })).toBe(0.82);
    expect(preferredValue(0.0048, { series: "E24", direction: "up" })).toBe(0.0051);
    expect(preferredValue(3.3e-7, { series: "E12", direction: "down" })).toBe(3.3e-7);
  });

  it("treats a value a hair below a table entry as that entry (binary rounding)", () => {
    expect(preferredValue(4699.999999999999, { series: "E12", direction: "down" })).toBe(4700);
    expect(preferredValue(0.1 * 3 * 11, { series: "E24", direction: "down" })).toBe(3.3);
  });
});
