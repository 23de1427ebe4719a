// Synthetic oscilloscope captures with known parameters, for unit, integration and browser tests.
//
// A pulse train here is a trapezoid: each period starts at `delayS` (plus whole periods) with a
// linear rise from the low to the high level over `riseRampS`, stays high, falls linearly over
// `fallRampS`, and stays low until the next period. The ramps are placed so the 50 % (mesial)
// crossings are exactly `dutyCyclePct` of a period apart, which is how IEEE Std 181 defines
// pulse duration and duty cycle; for a linear ramp the 10 %–90 % transition duration is 0.8 of
// the ramp (see `transitionDuration1090`). Noise is Gaussian from a seeded generator, so every
// run gives the same samples.

import { seededRandom } from "@/lib/random/seeded";

export type PulseTrainSpec = {
  sampleRateHz: number;
  /** how many samples; or give `durationS` */
  samples?: number;
  durationS?: number;
  frequencyHz: number;
  /** pulse duration at the 50 % level over the period, in per cent */
  dutyCyclePct: number;
  lowV?: number;
  highV?: number;
  /** 0 → 100 % duration of the rising edge; 0 gives an ideal step */
  riseRampS?: number;
  fallRampS?: number;
  /** time of the first rising edge's start, within the first period */
  delayS?: number;
  /** added to every sample */
  offsetV?: number;
  /** standard deviation of added Gaussian noise */
  noiseRmsV?: number;
  /** damped ringing after each edge: peak as a fraction of the amplitude, frequency, decay time constant */
  ringing?: { fraction: number; frequencyHz: number; decayS: number };
  seed?: number;
  /** time of sample 0 */
  startS?: number;
};

export type SyntheticTrace = { timeS: Float64Array; values: Float64Array };

/** The shared seeded generator (lib/random/seeded.ts), for the tests that import it from here. */
export { seededRandom };

/** Standard normal samples by the Box–Muller transform over a seeded uniform source. */
export function seededGaussian(seed: number): () => number {
  const uniform = seededRandom(seed);
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const s = spare;
      spare = null;
      return s;
    }
    const u = Math.max(uniform(), Number.EPSILON);
    const v = uniform();
    const r = Math.sqrt(-2 * Math.log(u));
    spare = r * Math.sin(2 * Math.PI * v);
    return r * Math.cos(2 * Math.PI * v);
  };
}

/** 10 %–90 % duration of a linear ramp that takes `rampS` from 0 % to 100 %. */
export function transitionDuration1090(rampS: number): number {
  return 0.8 * rampS;
}

function sampleCount(spec: PulseTrainSpec): number {
  if (spec.samples !== undefined) return spec.samples;
  if (spec.durationS !== undefined) return Math.round(spec.durationS * spec.sampleRateHz);
  throw new Error("give samples or durationS");
}

/** The noiseless trapezoid level at time t (relative to the start of the train), without ringing. */
export function trapezoidAt(t: number, spec: PulseTrainSpec): number {
  const low = spec.lowV ?? 0;
  const high = spec.highV ?? 1;
  const period = 1 / spec.frequencyHz;
  const rise = spec.riseRampS ?? 0;
  const fall = spec.fallRampS ?? 0;
  // Mesial crossings at rise/2 and rise/2 + D·T; the fall ramp is centred on the second.
  const fallStart = rise / 2 + (spec.dutyCyclePct / 100) * period - fall / 2;
  const phase = (((t - (spec.delayS ?? 0)) % period) + period) % period;
  if (phase < rise) return low + ((high - low) * phase) / rise;
  if (phase < fallStart) return high;
  if (phase < fallStart + fall) return high - ((high - low) * (phase - fallStart)) / fall;
  return low;
}

/** A pulse train sampled at `sampleRateHz`, with offset, ringing and seeded noise as asked. */
export function pulseTrain(spec: PulseTrainSpec): SyntheticTrace {
  const n = sampleCount(spec);
  const dt = 1 / spec.sampleRateHz;
  const start = spec.startS ?? 0;
  const timeS = new Float64Array(n);
  const values = new Float64Array(n);
  const noise = spec.noiseRmsV ? seededGaussian(spec.seed ?? 1) : null;
  const period = 1 / spec.frequencyHz;
  const amplitude = (spec.highV ?? 1) - (spec.lowV ?? 0);
  const rise = spec.riseRampS ?? 0;
  const fall = spec.fallRampS ?? 0;
  const fallEnd = rise / 2 + (spec.dutyCyclePct / 100) * period + fall / 2;
  for (let i = 0; i < n; i++) {
    const t = i * dt;
    timeS[i] = start + t;
    let v = trapezoidAt(t, spec) + (spec.offsetV ?? 0);
    if (spec.ringing) {
      const phase = (((t - (spec.delayS ?? 0)) % period) + period) % period;
      const { fraction, frequencyHz, decayS } = spec.ringing;
      // Ringing starts where each edge ends: up after the rise, down after the fall.
      if (phase >= rise && phase < fallEnd - fall) {
        const s = phase - rise;
        v += fraction * amplitude * Math.exp(-s / decayS) * Math.sin(2 * Math.PI * frequencyHz * s);
      } else if (phase >= fallEnd) {
        const s = phase - fallEnd;
        v -= fraction * amplitude * Math.exp(-s / decayS) * Math.sin(2 * Math.PI * frequencyHz * s);
      }
    }
    if (noise) v += (spec.noiseRmsV ?? 0) * noise();
    values[i] = v;
  }
  return { timeS, values };
}

export type CsvDialect = {
  separator?: "," | ";" | "\t";
  /** "," only with a ";" or tab separator, as instruments write it */
  decimal?: "." | ",";
  /** "inline": `Time (s),CH1 (V)`; "row": names, then a row of units; "none": no header row */
  header?: "inline" | "row" | "none";
  /** lines written before the header, e.g. `Model,Bench scope` */
  metadata?: readonly string[];
  timeName?: string;
  /** significant digits of every number (scientific notation) */
  digits?: number;
  lineEnding?: "\n" | "\r\n";
  /** leave out the time column and write this line instead before the header, e.g. `Sample interval,1e-7` */
  intervalLine?: string;
};

export type CsvChannel = { name: string; unit?: string; values: ArrayLike<number> };

/** The capture as a CSV (or semicolon / tab) text in the dialect asked for. */
export function captureCsv(timeS: ArrayLike<number>, channels: readonly CsvChannel[], dialect: CsvDialect = {}): string {
  const sep = dialect.separator ?? ",";
  const decimal = dialect.decimal ?? ".";
  if (decimal === "," && sep === ",") throw new Error("a decimal comma needs a ';' or tab separator");
  const eol = dialect.lineEnding ?? "\n";
  const digits = dialect.digits ?? 7;
  const withTime = dialect.intervalLine === undefined;
  const number = (v: number) => {
    const text = v.toExponential(digits - 1);
    return decimal === "," ? text.replace(".", ",") : text;
  };
  const lines: string[] = [...(dialect.metadata ?? [])];
  if (dialect.intervalLine !== undefined) lines.push(dialect.intervalLine);
  const timeName = dialect.timeName ?? "Time";
  const names = [...(withTime ? [timeName] : []), ...channels.map((c) => c.name)];
  const units = [...(withTime ? ["s"] : []), ...channels.map((c) => c.unit ?? "V")];
  switch (dialect.header ?? "inline") {
    case "inline":
      lines.push(names.map((name, i) => `${name} (${units[i]})`).join(sep));
      break;
    case "row":
      lines.push(names.join(sep), units.join(sep));
      break;
    case "none":
      break;
  }
  const n = timeS.length;
  const row: string[] = [];
  for (let i = 0; i < n; i++) {
    row.length = 0;
    if (withTime) row.push(number(timeS[i] ?? 0));
    for (const c of channels) row.push(number(c.values[i] ?? 0));
    lines.push(row.join(sep));
  }
  return lines.join(eol) + eol;
}

/**
 * Two gate signals of a two-transistor forward converter's drive (both switches switch together,
 * so the second is the first with its own noise), or of any two-channel capture: a convenience
 * for the browser and integration tests.
 */
export function twoChannelGateCapture(spec: PulseTrainSpec & { secondHighV?: number }): { text: string; trace: SyntheticTrace; second: SyntheticTrace } {
  const trace = pulseTrain(spec);
  const second = pulseTrain({ ...spec, highV: spec.secondHighV ?? spec.highV, seed: (spec.seed ?? 1) + 1 });
  const text = captureCsv(trace.timeS, [
    { name: "CH1", unit: "V", values: trace.values },
    { name: "CH2", unit: "V", values: second.values },
  ], { metadata: ["Instrument,Bench scope", "Record length," + String(trace.timeS.length)] });
  return { text, trace, second };
}
