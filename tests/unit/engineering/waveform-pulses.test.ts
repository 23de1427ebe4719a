// Pulse figures checked against the definitions of IEEE Std 181-2011 ("IEEE Standard for
// Transitions, Pulses, and Related Waveforms"): state levels by the histogram mode method (§5.2.1),
// transition duration between the 10 % and 90 % reference levels (§5.3.3), pulse duration and period
// between 50 % (mesial) reference level instants (§5.3.2, §5.3.4), duty factor = pulse duration /
// period, and overshoot/undershoot as post-transition aberrations in percent of the amplitude (§5.4).
// Every expected figure below follows from those definitions and the synthetic signal's parameters.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { EngineeringInputError, measurePulses } from "@/lib/engineering";
import { dampedSineLobes, pulseTrain } from "./synthetic-captures";

const gateDrive = { sampleRateHz: 10e6, samples: 20_000, frequencyHz: 20e3, duty: 0.4, lowV: 0, highV: 12 } as const;

describe("measurePulses — ideal pulses", () => {
  it("finds the levels, period and duty cycle of a 20 kHz, 40 % gate-drive square wave exactly", () => {
    // Common practice: a two-transistor forward converter's gate drive runs below 50 % duty, in the tens of kilohertz.
    const m = measurePulses(pulseTrain(gateDrive));
    expect(m.lowV).toBe(0);
    expect(m.highV).toBe(12);
    expect(m.amplitudeV).toBe(12);
    expect(m.periodS).toBeCloseTo(50e-6, 12);
    expect(m.frequencyHz).toBeCloseTo(20e3, 3);
    expect(m.dutyCyclePct).toBeCloseTo(40, 6);
    expect(m.dutyCyclePct!).toBeLessThan(50);
    expect(m.overshootPct).toBe(0);
    expect(m.undershootPct).toBe(0);
    expect(m.reason).toBeNull();
    // 2 ms of a 50 µs period, first edge at 12.55 µs: 40 rising edges, so 39 complete pulses.
    expect(m.pulseCount).toBe(39);
    expect(m.referenceLevels!.low10).toBeCloseTo(1.2, 12);
    expect(m.referenceLevels!.mesial50).toBeCloseTo(6, 12);
    expect(m.referenceLevels!.high90).toBeCloseTo(10.8, 12);
  });

  it("gives an ideal edge a transition duration of 0.8 sample intervals (linear interpolation between two samples)", () => {
    const m = measurePulses(pulseTrain(gateDrive));
    // Between the two samples on either side of a step, the 10 % and 90 % instants are 0.8 intervals apart.
    expect(m.riseTimeS).toBeCloseTo(0.8 / gateDrive.sampleRateHz, 12);
    expect(m.fallTimeS).toBeCloseTo(0.8 / gateDrive.sampleRateHz, 12);
  });

  it("marks one representative period between 50 % instants", () => {
    const m = measurePulses(pulseTrain(gateDrive));
    expect(m.markers).not.toBeNull();
    const { pulseStartS, pulseEndS, nextPulseStartS } = m.markers!;
    expect(pulseEndS - pulseStartS).toBeCloseTo(20e-6, 9);
    expect(nextPulseStartS - pulseStartS).toBeCloseTo(50e-6, 9);
  });
});

describe("measurePulses — finite edges, offset, noise and ringing", () => {
  it("measures 10–90 % rise and fall times of trapezoid pulses", () => {
    // Edges of 16 and 12 sample intervals: the 10 % and 90 % instants then lie at least a sample inside the
    // linear part, where interpolation between samples is exact, so the durations come back as built.
    const m = measurePulses(pulseTrain({ ...gateDrive, riseTimeS: 1.6e-6, fallTimeS: 1.2e-6 }));
    expect(m.riseTimeS! / 1.6e-6).toBeCloseTo(1, 6);
    expect(m.fallTimeS! / 1.2e-6).toBeCloseTo(1, 6);
    // Pulse duration and period are between 50 % instants, unaffected by the edges' own duration.
    expect(m.dutyCyclePct).toBeCloseTo(40, 4);
    expect(m.frequencyHz).toBeCloseTo(20e3, 2);
  });

  it("reports a DC offset in the levels and leaves the timing alone", () => {
    const m = measurePulses(pulseTrain({ ...gateDrive, lowV: -5, highV: 10, riseTimeS: 300e-9, fallTimeS: 300e-9 }));
    expect(m.lowV).toBeCloseTo(-5, 9);
    expect(m.highV).toBeCloseTo(10, 9);
    expect(m.amplitudeV).toBeCloseTo(15, 9);
    expect(m.referenceLevels!.mesial50).toBeCloseTo(2.5, 9);
    expect(m.dutyCyclePct).toBeCloseTo(40, 4);
  });

  it("keeps levels and timing within small bounds under Gaussian noise (fixed seed)", () => {
    // Noise of 2 % of the amplitude (0.24 V rms). Histogram-mode levels average the noise out; timing
    // from many periods does too. Bounds: a tenth of the noise for levels, 0.2 % for timing (our choice).
    const m = measurePulses(pulseTrain({ ...gateDrive, samples: 100_000, riseTimeS: 500e-9, fallTimeS: 500e-9, noiseRmsV: 0.24, seed: 7 }));
    expect(Math.abs(m.lowV! - 0)).toBeLessThan(0.024);
    expect(Math.abs(m.highV! - 12)).toBeLessThan(0.024);
    expect(m.frequencyHz! / 20e3).toBeCloseTo(1, 2);
    expect(Math.abs(m.dutyCyclePct! - 40)).toBeLessThan(0.2);
    expect(m.riseTimeS! / 500e-9).toBeGreaterThan(0.85);
    expect(m.riseTimeS! / 500e-9).toBeLessThan(1.15);
    expect(m.pulseCount).toBe(199);
  });

  it("measures overshoot and undershoot of damped ringing after each edge", () => {
    // Ringing k·A·e^(−t/τ)·sin(2πf t) after each edge: the first lobe beyond the final level is the
    // overshoot, the second lobe back short of it the undershoot (IEEE Std 181 post-transition aberrations).
    const ringing = { factor: 0.25, frequencyHz: 1e6, decayS: 0.6e-6 };
    const m = measurePulses(pulseTrain({ ...gateDrive, sampleRateHz: 100e6, samples: 400_000, riseTimeS: 40e-9, fallTimeS: 40e-9, ringing }));
    const lobes = dampedSineLobes(ringing.factor, ringing.frequencyHz, ringing.decayS);
    // Sampling at 100 MSa/s misses the analytic peak by at most (2π·1 MHz·5 ns)²/2 ≈ 0.05 % of it.
    expect(m.overshootPct! / (100 * lobes.first)).toBeCloseTo(1, 2);
    expect(m.undershootPct! / (100 * lobes.second)).toBeCloseTo(1, 2);
    // The ringing is over well before each state ends, so the state levels stay at 0 V and 12 V.
    expect(m.lowV).toBeCloseTo(0, 2);
    expect(m.highV).toBeCloseTo(12, 2);
    expect(m.dutyCyclePct).toBeCloseTo(40, 2);
  });

  it("handles a low duty cycle where the high state holds few samples", () => {
    const m = measurePulses(pulseTrain({ ...gateDrive, duty: 0.05 }));
    expect(m.highV).toBe(12);
    expect(m.dutyCyclePct).toBeCloseTo(5, 6);
  });
});

describe("measurePulses — at the edges of validity", () => {
  it("gives null timing with a reason when the capture holds fewer than two complete periods", () => {
    // 80 µs of a 50 µs period with the first edge at 12.55 µs: two rising edges, one complete period.
    const m = measurePulses(pulseTrain({ ...gateDrive, samples: 800 }));
    expect(m.pulseCount).toBe(1);
    expect(m.periodS).toBeNull();
    expect(m.frequencyHz).toBeNull();
    expect(m.dutyCyclePct).toBeNull();
    expect(m.reason).toMatch(/1 complete period/);
    // Levels need no complete period.
    expect(m.lowV).toBe(0);
    expect(m.highV).toBe(12);
  });

  it("measures exactly two complete periods", () => {
    const m = measurePulses(pulseTrain({ ...gateDrive, samples: 1_300 }));
    expect(m.pulseCount).toBe(2);
    expect(m.periodS).toBeCloseTo(50e-6, 12);
  });

  it("still measures a single edge's rise time, as a capture of one edge is taken for", () => {
    const edge = pulseTrain({ ...gateDrive, samples: 400, riseTimeS: 2e-6, firstEdgeS: 20.05e-6 });
    const m = measurePulses(edge);
    expect(m.riseTimeS! / 2e-6).toBeCloseTo(1, 6);
    expect(m.fallTimeS).toBeNull();
    expect(m.frequencyHz).toBeNull();
    expect(m.reason).toMatch(/0 complete periods/);
  });

  it("says so when the trace is flat", () => {
    const flat = { timeS: Float64Array.from({ length: 100 }, (_, i) => i * 1e-6), values: new Float64Array(100).fill(3.3) };
    const m = measurePulses(flat);
    expect(m.amplitudeV).toBe(0);
    expect(m.frequencyHz).toBeNull();
    expect(m.reason).toMatch(/constant/);
  });

  it("does not invent pulses from noise alone", () => {
    const noise = pulseTrain({ ...gateDrive, lowV: 0, highV: 0, noiseRmsV: 1, seed: 3 });
    const m = measurePulses(noise);
    expect(m.frequencyHz).toBeNull();
    expect(m.pulseCount).toBe(0);
    expect(m.reason).toMatch(/not a pulse waveform/);
  });

  it("refuses mismatched, non-finite or backward input with an input error", () => {
    const t = [0, 1, 2];
    expect(() => measurePulses({ timeS: t, values: [1, 2] })).toThrow(EngineeringInputError);
    expect(() => measurePulses({ timeS: t, values: [1, Number.NaN, 2] })).toThrow(/values\[1\]/);
    expect(() => measurePulses({ timeS: [0, 2, 1], values: [1, 2, 3] })).toThrow(/earlier/);
    expect(() => measurePulses({ timeS: [0], values: [1] })).toThrow(/two samples/);
    expect(() => measurePulses(null as never)).toThrow(EngineeringInputError);
  });

  it("never returns NaN or infinite figures", () => {
    for (const samples of [2, 3, 10, 800, 5_000]) {
      const m = measurePulses(pulseTrain({ ...gateDrive, samples, noiseRmsV: 0.1 }));
      for (const [key, value] of Object.entries(m)) {
        if (typeof value === "number") expect(Number.isFinite(value), key).toBe(true);
      }
    }
  });
});

describe("measurePulses — any pulse train (property)", () => {
  it("recovers the frequency, duty cycle and levels it was built with", () => {
    fc.assert(
      fc.property(
        fc.record({
          frequencyHz: fc.double({ min: 1e3, max: 200e3, noNaN: true }),
          duty: fc.double({ min: 0.1, max: 0.9, noNaN: true }),
          samplesPerPeriod: fc.integer({ min: 200, max: 1000 }),
          lowV: fc.double({ min: -20, max: 5, noNaN: true }),
          amplitudeV: fc.double({ min: 1, max: 400, noNaN: true }),
          edgeFraction: fc.double({ min: 0, max: 0.04, noNaN: true }),
        }),
        ({ frequencyHz, duty, samplesPerPeriod, lowV, amplitudeV, edgeFraction }) => {
          const period = 1 / frequencyHz;
          const edge = edgeFraction * period;
          const trace = pulseTrain({ sampleRateHz: samplesPerPeriod * frequencyHz, samples: samplesPerPeriod * 6, frequencyHz, duty, lowV, highV: lowV + amplitudeV, riseTimeS: edge, fallTimeS: edge });
          const m = measurePulses(trace);
          // IEEE Std 181 instants are interpolated between samples. On an ideal step the 50 % crossing lands
          // midway between the last sample on one side and the first on the other, so each instant is off by
          // up to half a sample interval and a pulse's width by up to one: the duty cycle by up to
          // 100 / samplesPerPeriod percentage points. The bound is met with equality when both edges fall on
          // a sample (duty × samplesPerPeriod a whole number), so it allows for rounding in the last digits.
          const oneSamplePct = (100 / samplesPerPeriod) * (1 + 1e-9);
          expect(m.pulseCount).toBeGreaterThanOrEqual(4);
          expect(Math.abs(m.frequencyHz! - frequencyHz) / frequencyHz).toBeLessThan(1 / samplesPerPeriod);
          expect(Math.abs(m.dutyCyclePct! - 100 * duty)).toBeLessThanOrEqual(oneSamplePct);
          // Levels: each is the mean of the samples in the fine histogram bin (1/4096 of the range) that
          // holds it. An edge crosses a bin in at most one sample (40 samples at most span the amplitude),
          // and two edges meet each level per period, so the pull is under two bin widths over one
          // period's flat samples.
          const binWidth = amplitudeV / 4096;
          const flatPerPeriod = samplesPerPeriod * (Math.min(duty, 1 - duty) - edgeFraction);
          const levelBound = (2 * binWidth) / flatPerPeriod;
          expect(Math.abs(m.lowV! - lowV)).toBeLessThan(levelBound);
          expect(Math.abs(m.highV! - (lowV + amplitudeV))).toBeLessThan(levelBound);
        },
      ),
      // Counterexamples of earlier bounds, kept: a fixed level bound of 1e-6 of the amplitude (CI, 2026-12-02),
      // and a duty-cycle bound of under one sample, which an ideal step with both edges on a sample meets
      // with equality (2026-12-03).
      {
        numRuns: 60,
        examples: [
          [{ frequencyHz: 1000, duty: 0.1, samplesPerPeriod: 922, lowV: 0, amplitudeV: 1, edgeFraction: 0.0399169843006454 }],
          [{ frequencyHz: 92861.69529521641, duty: 0.10000000000000017, samplesPerPeriod: 210, lowV: 0, amplitudeV: 5.85498873564484, edgeFraction: 0 }],
        ],
      },
    );
  });
});

describe("measurePulses — aberrations of clean edges", () => {
  it("finds no overshoot or undershoot on ideal trapezoids, even when the capture starts mid-edge", () => {
    // IEEE Std 181: aberrations are departures from the state level after a transition; a linear ramp
    // that lands on the level has none, and the next edge's foot is not an aberration of this one.
    for (const firstEdgeS of [0, 7.3e-6, 12.55e-6]) {
      const m = measurePulses(pulseTrain({ sampleRateHz: 100e6, samples: 20_000, frequencyHz: 20e3, duty: 0.4, lowV: 0, highV: 15, riseTimeS: 400e-9, fallTimeS: 200e-9, firstEdgeS }));
      expect(m.overshootPct).toBeCloseTo(0, 9);
      expect(m.undershootPct).toBeCloseTo(0, 9);
    }
  });
});
