import { describe, expect, it } from "vitest";
import { classifyReading } from "@/lib/engineering";

// A bus checkpoint expected at 320–340 V (230 V mains, no load: √2·230 ≈ 325 V, IEC 60038).
const range = { min: 320, max: 340 };

describe("classifyReading", () => {
  it("is within for values inside the range, bounds included", () => {
    expect(classifyReading({ value: 325, ...range })).toEqual({ verdict: "within", farOutside: false, deviation: 0 });
    expect(classifyReading({ value: 320, ...range }).verdict).toBe("within");
    expect(classifyReading({ value: 340, ...range }).verdict).toBe("within");
  });

  it("is low or high outside, with the distance to the bound", () => {
    expect(classifyReading({ value: 318, ...range })).toEqual({ verdict: "low", farOutside: false, deviation: 2 });
    expect(classifyReading({ value: 343, ...range })).toEqual({ verdict: "high", farOutside: false, deviation: 3 });
  });

  it("flags far outside beyond 25 % of the range width (common practice): 5 V here", () => {
    expect(classifyReading({ value: 345, ...range }).farOutside).toBe(false);
    expect(classifyReading({ value: 345.1, ...range }).farOutside).toBe(true);
    expect(classifyReading({ value: 160, ...range })).toMatchObject({ verdict: "low", farOutside: true });
  });

  it("handles negative rails and single-value ranges", () => {
    expect(classifyReading({ value: -15.2, min: -15.5, max: -14.5 }).verdict).toBe("within");
    expect(classifyReading({ value: 13, min: 15, max: 15 })).toMatchObject({ verdict: "low", farOutside: false });
    expect(classifyReading({ value: 10, min: 15, max: 15 })).toMatchObject({ verdict: "low", farOutside: true });
  });

  it("rejects a range whose max is below its min", () => {
    expect(() => classifyReading({ value: 1, min: 5, max: 2 })).toThrow(/max/);
  });
});
