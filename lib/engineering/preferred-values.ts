import { EngineeringInputError, finiteResult, requireObject, requireOneOf, requirePositive } from "./errors";

/**
 * IEC 60063 preferred-number series, one decade. They are rounded by convention (2.7, 3.3,
 * 4.7 …) rather than computed as 10^(n/12), so they are tables. Stored as two-digit integers
 * to build any decade without binary rounding noise.
 */
export const E12_SERIES = [10, 12, 15, 18, 22, 27, 33, 39, 47, 56, 68, 82] as const;
export const E24_SERIES = [
  10, 11, 12, 13, 15, 16, 18, 20, 22, 24, 27, 30, 33, 36, 39, 43, 47, 51, 56, 62, 68, 75, 82, 91,
] as const;

export const PREFERRED_SERIES = { E12: E12_SERIES, E24: E24_SERIES } as const;
export type PreferredSeries = keyof typeof PREFERRED_SERIES;
export type PreferredDirection = "down" | "up" | "nearest";

export interface PreferredValueOptions {
  series: PreferredSeries;
  direction: PreferredDirection;
}

// Values within this relative distance count as equal, so 4.7e3 computed as 4699.999999999999
// still maps to 4.7 kΩ when rounding down.
const SAME_VALUE = 1e-12;

function scaled(twoDigits: number, exponent: number): number {
  // Dividing by an exact power of ten rounds once, so 47 / 1e7 === 4.7e-6.
  return exponent >= 0 ? twoDigits * 10 ** exponent : twoDigits / 10 ** -exponent;
}

function candidatesAround(value: number, series: readonly number[]): number[] {
  const decade = Math.floor(Math.log10(value)) - 1;
  const out: number[] = [];
  for (let exponent = decade - 1; exponent <= decade + 1; exponent++) {
    for (const digits of series) out.push(scaled(digits, exponent));
  }
  return out;
}

/**
 * The IEC 60063 value of the series next to `value`, in any decade. "nearest" is nearest on a
 * logarithmic scale, the scale the series is spaced on (so between 4.7 and 5.6 the split is at
 * their geometric mean, ≈5.13).
 */
export function preferredValue(value: number, options: PreferredValueOptions): number {
  const v = requirePositive("value", value);
  const opts = requireObject("options", options);
  const series = requireOneOf("series", opts.series, ["E12", "E24"] as const);
  const direction = requireOneOf("direction", opts.direction, ["down", "up", "nearest"] as const);
  const candidates = candidatesAround(v, PREFERRED_SERIES[series]).filter(
    (c) => Number.isFinite(c) && c > 0,
  );

  let result: number | undefined;
  if (direction === "down") {
    result = candidates.filter((c) => c <= v * (1 + SAME_VALUE)).at(-1);
  } else if (direction === "up") {
    result = candidates.find((c) => c >= v * (1 - SAME_VALUE));
  } else {
    let best = Infinity;
    for (const c of candidates) {
      const distance = Math.abs(Math.log(c / v));
      if (distance < best) {
        best = distance;
        result = c;
      }
    }
  }
  if (result === undefined) {
    throw new EngineeringInputError("value", "value is outside the range a preferred value can be found for.");
  }
  return finiteResult("value", result);
}
