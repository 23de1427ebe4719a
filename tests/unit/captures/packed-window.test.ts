// The capture viewer's first window, packed for the page: the times of an evenly sampled capture go as
// gaps on its sample grid and must read back as exactly the numbers they were; anything else keeps its list.
// The traces are downsampled with the app's LTTB, as the page does.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { packWindow, time12, unpackWindow } from "@/lib/captures/packed-window";
import type { CaptureWindowView } from "@/lib/captures/types";
import { downsampleForPlot } from "@/lib/engineering";
import { pulseTrain } from "../engineering/synthetic-captures";

function windowOf(timeS: number[], values: number[]): CaptureWindowView {
  return { from: timeS[0] ?? 0, to: timeS.at(-1) ?? 0, points: 1200, samplesInWindow: timeS.length, traces: [{ index: 0, name: "Q1 gate", unit: "V", timeS, values }] };
}

describe("packWindow / unpackWindow", () => {
  it("reads a downsampled pulse train back exactly, in under a third of the JSON", () => {
    const dt = 5e-8;
    const trace = pulseTrain({ sampleRateHz: 1 / dt, samples: 40_000, frequencyHz: 25e3, duty: 0.4, lowV: 0, highV: 15, riseTimeS: 300e-9, noiseRmsV: 0.05, seed: 5 });
    const reduced = downsampleForPlot(trace.timeS, trace.values, 1200);
    const view = windowOf(Array.from(reduced.timeS, (t) => time12(t - 1e-4)), Array.from(reduced.values));
    const packed = packWindow(view, dt);
    expect(Array.isArray(packed.traces[0]!.timeS)).toBe(false);
    expect(unpackWindow(packed)).toEqual(view);
    const bytes = (v: unknown) => JSON.stringify(v).length;
    expect(bytes(packed.traces[0]!.timeS)).toBeLessThan(bytes(view.traces[0]!.timeS) / 3);
  });

  it("round-trips any increasing picks of any grid (fast-check)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1, max: 1, noNaN: true }),
        fc.double({ min: 1e-12, max: 1e-2, noNaN: true }),
        fc.uniqueArray(fc.integer({ min: 0, max: 2_000_000 }), { minLength: 1, maxLength: 300 }),
        (start, dt, picks) => {
          const sorted = [...picks].sort((a, b) => a - b);
          const origin = time12(start);
          const view = windowOf(
            sorted.map((k) => time12(origin + k * dt)),
            sorted.map((k) => k % 7),
          );
          expect(unpackWindow(packWindow(view, dt))).toEqual(view);
        },
      ),
      { numRuns: 300 },
    );
  });

  it("keeps the list of an uneven trace, or when no interval is known", () => {
    const uneven = windowOf([0, 1e-6, 2.5e-6, 3e-6], [1, 2, 3, 4]);
    expect(packWindow(uneven, 1e-6).traces[0]!.timeS).toEqual([0, 1e-6, 2.5e-6, 3e-6]);
    const even = windowOf([0, 1e-6, 2e-6], [1, 2, 3]);
    for (const interval of [null, 0, -1e-6, Number.NaN]) expect(packWindow(even, interval).traces[0]!.timeS).toEqual(even.traces[0]!.timeS);
    expect(packWindow(even, 1e-6).traces[0]!.timeS).toEqual({ origin: 0, stepS: 1e-6, gaps: [1, 1] });
    expect(unpackWindow(packWindow(windowOf([], []), 1e-6))).toEqual(windowOf([], []));
  });

  it("keeps the list when two times fall on one grid step (times that are not the capture's own samples)", () => {
    const view = windowOf([0, 1e-6, 1.2e-6, 3e-6], [1, 2, 3, 4]);
    expect(packWindow(view, 1e-6).traces[0]!.timeS).toEqual(view.traces[0]!.timeS);
  });
});
