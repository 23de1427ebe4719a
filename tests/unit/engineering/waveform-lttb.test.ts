// Largest-Triangle-Three-Buckets, checked against its published description (S. Steinarsson,
// "Downsampling Time Series for Visual Representation", MSc thesis, University of Iceland, 2013, ch. 4):
// the first and last points are kept, the points between are split into (target − 2) buckets, one point
// is chosen per bucket, and that point forms the largest triangle with the previously chosen point and
// the average of the next bucket. Also against the `downsample` package from npm (an independent
// implementation of the same algorithm).
import { LTTB } from "downsample";
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { EngineeringInputError, downsampleForPlot, measurePulses, parseCaptureCsv } from "@/lib/engineering";
import { pulseTrain, toCsv } from "./synthetic-captures";

function bucketBounds(n: number, target: number, bucket: number): [number, number] {
  const every = (n - 2) / (target - 2);
  return [Math.floor(bucket * every) + 1, Math.floor((bucket + 1) * every) + 1];
}

function triangleArea(a: [number, number], b: [number, number], c: [number, number]): number {
  return Math.abs((a[0] - c[0]) * (b[1] - a[1]) - (a[0] - b[0]) * (c[1] - a[1])) / 2;
}

describe("downsampleForPlot (LTTB)", () => {
  const trace = pulseTrain({ sampleRateHz: 1e6, samples: 5_003, frequencyHz: 2e3, duty: 0.3, lowV: 0, highV: 15, riseTimeS: 20e-6, noiseRmsV: 0.3, seed: 11 });

  it("keeps the first and last points and gives exactly the number of points asked for", () => {
    const out = downsampleForPlot(trace.timeS, trace.values, 250);
    expect(out.timeS.length).toBe(250);
    expect(out.values.length).toBe(250);
    expect(out.indices[0]).toBe(0);
    expect(out.indices[249]).toBe(trace.values.length - 1);
    expect(out.timeS[0]).toBe(trace.timeS[0]);
    expect(out.values[249]).toBe(trace.values[trace.values.length - 1]);
  });

  it("chooses one point per bucket: the one with the largest triangle", () => {
    const target = 120;
    const n = trace.values.length;
    const out = downsampleForPlot(trace.timeS, trace.values, target);
    for (let bucket = 0; bucket < target - 2; bucket += 1) {
      const [from, to] = bucketBounds(n, target, bucket);
      const chosen = out.indices[bucket + 1]!;
      expect(chosen).toBeGreaterThanOrEqual(from);
      expect(chosen).toBeLessThan(to);
      const previous = out.indices[bucket]!;
      const [nextFrom, nextTo] = bucket === target - 3 ? [n - 1, n] : bucketBounds(n, target, bucket + 1);
      let avgT = 0;
      let avgV = 0;
      for (let i = nextFrom; i < nextTo; i += 1) {
        avgT += trace.timeS[i]!;
        avgV += trace.values[i]!;
      }
      const avg: [number, number] = [avgT / (nextTo - nextFrom), avgV / (nextTo - nextFrom)];
      const a: [number, number] = [trace.timeS[previous]!, trace.values[previous]!];
      const areaOf = (i: number) => triangleArea(a, [trace.timeS[i]!, trace.values[i]!], avg);
      let best = -1;
      for (let i = from; i < to; i += 1) best = Math.max(best, areaOf(i));
      expect(areaOf(chosen)).toBeCloseTo(best, 9);
    }
  });

  it("matches the npm `downsample` package's LTTB point for point", () => {
    fc.assert(
      fc.property(fc.array(fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e3, max: 1e3 }), { minLength: 3, maxLength: 400 }), fc.integer({ min: 3, max: 60 }), (values, target) => {
        const timeS = values.map((_, i) => i * 1e-6);
        const ours = downsampleForPlot(timeS, values, target);
        const reference = LTTB(values.map((v, i) => [timeS[i]!, v] as [number, number]), target) as [number, number][];
        expect(Array.from(ours.timeS)).toEqual(reference.map((p) => p[0]));
        expect(Array.from(ours.values)).toEqual(reference.map((p) => p[1]));
      }),
      { numRuns: 200 },
    );
  });

  it("keeps a one-sample spike that a plain decimation would drop", () => {
    const timeS = Float64Array.from({ length: 10_000 }, (_, i) => i * 1e-7);
    const values = new Float64Array(10_000);
    values[4_321] = 48;
    const out = downsampleForPlot(timeS, values, 100);
    expect(Math.max(...out.values)).toBe(48);
  });

  it("keeps the visual shape: the extremes of a pulse train survive a 50:1 reduction", () => {
    const out = downsampleForPlot(trace.timeS, trace.values, 100);
    expect(Math.max(...out.values)).toBeGreaterThan(15);
    expect(Math.min(...out.values)).toBeLessThan(0);
  });

  it("returns every point when asked for as many or more", () => {
    const out = downsampleForPlot([0, 1, 2], [5, 6, 7], 10);
    expect(Array.from(out.values)).toEqual([5, 6, 7]);
    expect(Array.from(out.indices)).toEqual([0, 1, 2]);
  });

  it("refuses a target below two points and mismatched arrays", () => {
    expect(() => downsampleForPlot([0, 1, 2], [1, 2, 3], 1)).toThrow(EngineeringInputError);
    expect(() => downsampleForPlot([0, 1, 2], [1, 2, 3], 2.5)).toThrow(EngineeringInputError);
    expect(() => downsampleForPlot([0, 1], [1, 2, 3], 2)).toThrow(/must match/);
    expect(() => downsampleForPlot([0, 1, 2], [1, Number.NaN, 3], 2)).toThrow(EngineeringInputError);
  });
});

describe("a capture from file to figures", () => {
  it("measures the same gate-drive figures from CSV text in each dialect", () => {
    const trace = pulseTrain({ sampleRateHz: 10e6, samples: 10_000, frequencyHz: 25e3, duty: 0.45, lowV: -2, highV: 15, riseTimeS: 1.2e-6, fallTimeS: 0.8e-6 });
    for (const dialect of [{ delimiter: "," as const }, { delimiter: ";" as const, decimalComma: true }, { delimiter: "\t" as const, newline: "\r\n" as const }]) {
      const d = dialect.delimiter;
      const text = toCsv(["Capture of the low-side gate", `Time (s)${d}Gate (V)`], [trace.timeS, trace.values], dialect);
      const capture = parseCaptureCsv(text);
      const m = measurePulses({ timeS: capture.timeS, values: capture.channels[0]!.values });
      expect(m.frequencyHz! / 25e3).toBeCloseTo(1, 6);
      expect(m.dutyCyclePct).toBeCloseTo(45, 4);
      expect(m.lowV).toBeCloseTo(-2, 9);
      expect(m.highV).toBeCloseTo(15, 9);
      expect(m.riseTimeS! / 1.2e-6).toBeCloseTo(1, 5);
    }
  });
});
