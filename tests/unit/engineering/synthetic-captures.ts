// Synthetic oscilloscope captures with known parameters, so expected pulse figures follow from the
// IEEE Std 181 definitions rather than from our own measuring code.
import { seededGaussian } from "../../support/captures";

export type PulseSpec = {
  sampleRateHz: number;
  samples: number;
  frequencyHz: number;
  /** Pulse duration at the 50 % level over the period, 0–1. */
  duty: number;
  lowV: number;
  highV: number;
  /** 10 %–90 % transition durations; 0 gives ideal (instant) edges. */
  riseTimeS?: number;
  fallTimeS?: number;
  /** Time of the first rising 50 % crossing; by default a quarter period in, between two samples. */
  firstEdgeS?: number;
  /** Damped ringing after each edge: peak factor of the amplitude, ring frequency, decay time constant. */
  ringing?: { factor: number; frequencyHz: number; decayS: number };
  noiseRmsV?: number;
  seed?: number;
};

export type SyntheticTrace = { timeS: Float64Array; values: Float64Array };

/** Trapezoid pulses with linear edges: a 10–90 % time tr means the full edge lasts tr / 0.8. */
export function pulseTrain(spec: PulseSpec): SyntheticTrace {
  const { sampleRateHz, samples, frequencyHz, duty, lowV, highV } = spec;
  const period = 1 / frequencyHz;
  const amplitude = highV - lowV;
  const rise = (spec.riseTimeS ?? 0) / 0.8;
  const fall = (spec.fallTimeS ?? 0) / 0.8;
  // Edges between samples, so rounding never decides on which side of an edge a sample falls.
  const first = spec.firstEdgeS ?? period / 4 + 0.5 / sampleRateHz;
  const random = gaussian(spec.seed ?? 1);
  const timeS = new Float64Array(samples);
  const values = new Float64Array(samples);
  for (let i = 0; i < samples; i += 1) {
    const t = i / sampleRateHz;
    timeS[i] = t;
    let p = (t - first) % period;
    if (p < 0) p += period;
    // q runs from the start of the rising edge through one period.
    const q = p < period - rise / 2 ? p : p - period;
    const fallAt = duty * period;
    let v: number;
    let sinceEdge = Number.NaN;
    let direction = 0;
    if (q < rise / 2) v = rise === 0 ? highV : lowV + (amplitude * (q + rise / 2)) / rise;
    else if (q < fallAt - fall / 2) {
      v = highV;
      sinceEdge = q - rise / 2;
      direction = 1;
    } else if (q < fallAt + fall / 2) v = fall === 0 ? lowV : highV - (amplitude * (q - (fallAt - fall / 2))) / fall;
    else {
      v = lowV;
      sinceEdge = q - (fallAt + fall / 2);
      direction = -1;
    }
    if (spec.ringing && direction !== 0) {
      const { factor, frequencyHz: ring, decayS } = spec.ringing;
      v += direction * amplitude * factor * Math.exp(-sinceEdge / decayS) * Math.sin(2 * Math.PI * ring * sinceEdge);
    }
    if (spec.noiseRmsV) v += spec.noiseRmsV * random();
    values[i] = v;
  }
  return { timeS, values };
}

/** Peak of k·e^(−t/τ)·sin(ωt): at tan(ωt) = ωτ. Returns the first lobe and the second (opposite) lobe. */
export function dampedSineLobes(factor: number, frequencyHz: number, decayS: number): { first: number; second: number } {
  const w = 2 * Math.PI * frequencyHz;
  const t1 = Math.atan(w * decayS) / w;
  const peak = (t: number) => factor * Math.exp(-t / decayS) * Math.sin(w * t);
  return { first: peak(t1), second: -peak(t1 + Math.PI / w) };
}

/** Repeatable Gaussian noise: the seeded Box–Muller generator the capture tests share. */
export const gaussian = seededGaussian;

export type CsvDialect = { delimiter: "," | ";" | "\t"; decimalComma?: boolean; newline?: "\n" | "\r\n" };

/** Writes columns as an instrument would: header lines given, then one row per sample. */
export function toCsv(header: string[], columns: ArrayLike<number>[], dialect: CsvDialect = { delimiter: "," }): string {
  const nl = dialect.newline ?? "\n";
  const format = (v: number) => (dialect.decimalComma ? String(v).replace(".", ",") : String(v));
  const rows: string[] = [...header];
  const n = columns[0]?.length ?? 0;
  for (let i = 0; i < n; i += 1) rows.push(columns.map((c) => format(c[i]!)).join(dialect.delimiter));
  return rows.join(nl) + nl;
}
