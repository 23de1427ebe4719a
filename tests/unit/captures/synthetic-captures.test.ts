// The test captures' generator (tests/support/captures.ts) against the definitions it claims:
// IEEE Std 181 places a pulse's start and end at its 50 % (mesial) crossings, so the duty cycle is
// their distance over the period; a linear ramp crosses 10 % and 90 % at 0.1 and 0.9 of its length.
// Crossings are found here by linear interpolation between samples, independently of the library.
import { describe, expect, it } from "vitest";
import { captureCsv, pulseTrain, seededGaussian, seededRandom, transitionDuration1090, trapezoidAt } from "../../support/captures";

function crossings(times: ArrayLike<number>, values: ArrayLike<number>, level: number, rising: boolean): number[] {
  const out: number[] = [];
  for (let i = 1; i < values.length; i++) {
    const a = values[i - 1]!;
    const b = values[i]!;
    if (rising ? a < level && b >= level : a > level && b <= level) out.push(times[i - 1]! + ((level - a) / (b - a)) * (times[i]! - times[i - 1]!));
  }
  return out;
}

describe("synthetic pulse trains", () => {
  const spec = { sampleRateHz: 100e6, samples: 20_000, frequencyHz: 20e3, dutyCyclePct: 40, lowV: 0, highV: 15, riseRampS: 500e-9, fallRampS: 250e-9, delayS: 2e-6 };
  const { timeS, values } = pulseTrain(spec);

  it("cross the 50 % level at the period and duty cycle asked for", () => {
    const up = crossings(timeS, values, 7.5, true);
    const down = crossings(timeS, values, 7.5, false);
    expect(up[0]).toBeCloseTo(2e-6 + 250e-9, 12);
    expect(up[1]! - up[0]!).toBeCloseTo(50e-6, 12);
    expect((down[0]! - up[0]!) / (up[1]! - up[0]!)).toBeCloseTo(0.4, 9);
  });

  it("rise from 10 % to 90 % in 0.8 of the ramp", () => {
    const t10 = crossings(timeS, values, 1.5, true)[0]!;
    const t90 = crossings(timeS, values, 13.5, true)[0]!;
    expect(t90 - t10).toBeCloseTo(transitionDuration1090(500e-9), 12);
    expect(trapezoidAt(2e-6 + 5e-6, spec)).toBe(15);
    expect(trapezoidAt(2e-6 + 30e-6, spec)).toBe(0);
  });

  it("add the same seeded noise every time, of the asked standard deviation", () => {
    const a = pulseTrain({ ...spec, noiseRmsV: 0.1, seed: 3 });
    const b = pulseTrain({ ...spec, noiseRmsV: 0.1, seed: 3 });
    expect(Array.from(a.values.subarray(0, 50))).toEqual(Array.from(b.values.subarray(0, 50)));
    const g = seededGaussian(11);
    const draws = Array.from({ length: 20_000 }, g);
    const mean = draws.reduce((s, x) => s + x, 0) / draws.length;
    const sd = Math.sqrt(draws.reduce((s, x) => s + (x - mean) ** 2, 0) / draws.length);
    // A standard normal: mean 0, sd 1, within a few standard errors of 20 000 draws.
    expect(Math.abs(mean)).toBeLessThan(0.03);
    expect(Math.abs(sd - 1)).toBeLessThan(0.03);
    expect(seededRandom(5)()).toBe(seededRandom(5)());
  });

  it("write CSV in the dialect asked for", () => {
    const text = captureCsv([0, 1e-7], [{ name: "CH1", values: [0, 15] }], { separator: ";", decimal: ",", header: "row", metadata: ["Model;Bench scope"], digits: 3 });
    expect(text).toBe("Model;Bench scope\nTime;CH1\ns;V\n0,00e+0;0,00e+0\n1,00e-7;1,50e+1\n");
    expect(() => captureCsv([0], [{ name: "CH1", values: [0] }], { decimal: "," })).toThrow();
  });
});
