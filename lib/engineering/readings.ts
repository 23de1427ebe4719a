import { EngineeringInputError, finiteResult, requireFinite, requireObject } from "./errors";

export type ReadingVerdict = "within" | "low" | "high";

export interface ReadingClassification {
  verdict: ReadingVerdict;
  /**
   * More than 25 % of the range width beyond the nearer bound (common practice for telling
   * "a little off" from "something is wrong"). For a single-value range (min = max) the
   * margin is 25 % of that value's magnitude.
   */
  farOutside: boolean;
  /** how far beyond the nearer bound, in the reading's unit; 0 when within */
  deviation: number;
}

export interface ClassifyReadingInput {
  value: number;
  min: number;
  max: number;
}

export const FAR_OUTSIDE_FRACTION = 0.25;

/** Places a bring-up reading against the checkpoint's expected range; bounds are inclusive. */
export function classifyReading(input: ClassifyReadingInput): ReadingClassification {
  const i = requireObject("input", input);
  const value = requireFinite("value", i.value);
  const min = requireFinite("min", i.min);
  const max = requireFinite("max", i.max);
  if (min > max) throw new EngineeringInputError("max", "max must not be below min.");
  const width = max - min;
  const margin = FAR_OUTSIDE_FRACTION * (width > 0 ? width : Math.abs(min));
  if (value < min) {
    const deviation = finiteResult("value", min - value);
    return { verdict: "low", farOutside: deviation > margin, deviation };
  }
  if (value > max) {
    const deviation = finiteResult("value", value - max);
    return { verdict: "high", farOutside: deviation > margin, deviation };
  }
  return { verdict: "within", farOutside: false, deviation: 0 };
}
