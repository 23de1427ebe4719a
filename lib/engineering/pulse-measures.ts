// Pulse figures in the terms and by the methods of IEEE Std 181 (transitions, pulses and related
// waveforms): state levels from the histogram of the samples, 10 % / 90 % reference levels for
// transition durations, the 50 % (mesial) level for period and pulse duration, and aberrations
// after each transition relative to the amplitude. Figures are averaged over every complete pulse.
import { EngineeringInputError, isNumberList } from "./errors";

export type PulseMeasurement = {
  lowV: number | null;
  highV: number | null;
  amplitudeV: number | null;
  frequencyHz: number | null;
  periodS: number | null;
  dutyCyclePct: number | null;
  riseTimeS: number | null;
  fallTimeS: number | null;
  overshootPct: number | null;
  undershootPct: number | null;
  /** Complete pulses (a rising and a falling mesial crossing followed by the next rising one). */
  pulseCount: number;
  /** Why some figures are null, in words for the builder; null when every figure was measured. */
  reason: string | null;
  referenceLevels: { low10: number; mesial50: number; high90: number } | null;
  /** One representative complete period, for marking on a plot. */
  markers: { pulseStartS: number; pulseEndS: number; nextPulseStartS: number } | null;
};

export type PulseInput = { timeS: ArrayLike<number>; values: ArrayLike<number> };

const HISTOGRAM_BINS = 256;
const FINE_PER_BIN = 16;
/** Half-width of the window that refines each histogram mode (mean shift), as a fraction of the full range. */
const MODE_WINDOW = 0.02;
/** IEEE Std 181 leaves the state boundaries to the user; ±10 % of the amplitude is common practice. */
const STATE_TOLERANCE = 0.1;
/** Below this share of samples near the two levels, the trace is not a two-level pulse waveform. */
const MIN_STATE_OCCUPANCY = 0.3;
/** A transition has ended once the signal is within 2 % of the amplitude of its new level (common practice). */
const SETTLED = 0.02;

/** `startIndex`: the last sample before the transition left its old level; `endIndex`: the first past 90 % (or 10 %). */
type Transition = { direction: 1 | -1; proximalS: number; mesialS: number; distalS: number; startIndex: number; endIndex: number };

/** Measures a pulse train. Levels need only two samples; timing figures need two complete periods. */
export function measurePulses(input: PulseInput): PulseMeasurement {
  const { timeS, values } = checkInput(input);
  const n = values.length;

  let min = Infinity;
  let max = -Infinity;
  for (let i = 0; i < n; i += 1) {
    const v = values[i]!;
    if (v < min) min = v;
    if (v > max) max = v;
  }
  const empty = emptyMeasurement();
  if (!(max > min)) {
    return { ...empty, lowV: min, highV: max, amplitudeV: 0, reason: "The trace holds one constant value: there are no transitions to measure." };
  }

  const { low, high } = stateLevels(values, min, max);
  const amplitude = high - low;
  const levels = { lowV: low, highV: high, amplitudeV: amplitude };
  const band = STATE_TOLERANCE * amplitude;
  let nearStates = 0;
  for (let i = 0; i < n; i += 1) {
    const v = values[i]!;
    if (Math.abs(v - low) <= band || Math.abs(v - high) <= band) nearStates += 1;
  }
  if (!(amplitude > 0) || nearStates / n < MIN_STATE_OCCUPANCY) {
    return {
      ...empty,
      ...levels,
      reason: `The trace does not settle at two levels (only ${Math.round((100 * nearStates) / n)} % of samples lie near them), so it is not a pulse waveform that IEEE Std 181 figures describe.`,
    };
  }

  const referenceLevels = { low10: low + 0.1 * amplitude, mesial50: low + 0.5 * amplitude, high90: low + 0.9 * amplitude };
  const transitions = findTransitions(timeS, values, referenceLevels);
  const rises = transitions.filter((t) => t.direction === 1);
  const falls = transitions.filter((t) => t.direction === -1);
  const aberrations = measureAberrations(values, transitions, low, high, amplitude);

  const result: PulseMeasurement = {
    ...empty,
    ...levels,
    referenceLevels,
    riseTimeS: rises.length > 0 ? mean(rises.map((t) => t.distalS - t.proximalS)) : null,
    fallTimeS: falls.length > 0 ? mean(falls.map((t) => t.distalS - t.proximalS)) : null,
    overshootPct: aberrations.overshootPct,
    undershootPct: aberrations.undershootPct,
  };

  // Complete pulses: rising mesial instant, the falling one after it, then the next rising one.
  const periods: number[] = [];
  const durations: number[] = [];
  let markers: PulseMeasurement["markers"] = null;
  for (let i = 0; i + 2 < transitions.length; i += 1) {
    const a = transitions[i]!;
    const b = transitions[i + 1]!;
    const c = transitions[i + 2]!;
    if (a.direction !== 1 || b.direction !== -1 || c.direction !== 1) continue;
    periods.push(c.mesialS - a.mesialS);
    durations.push(b.mesialS - a.mesialS);
    markers ??= { pulseStartS: a.mesialS, pulseEndS: b.mesialS, nextPulseStartS: c.mesialS };
  }
  result.pulseCount = periods.length;
  result.markers = markers;
  if (periods.length < 2) {
    result.reason =
      `The capture holds ${periods.length} complete period${periods.length === 1 ? "" : "s"}; period, frequency and duty cycle need at least two. ` +
      "Capture a longer stretch of the signal (a slower time base).";
    if (rises.length === 0 || falls.length === 0) {
      result.reason += ` Only ${rises.length} rising and ${falls.length} falling transitions were found.`;
    }
    return result;
  }
  const periodS = mean(periods);
  result.periodS = periodS;
  result.frequencyHz = 1 / periodS;
  result.dutyCyclePct = 100 * mean(durations.map((d, i) => d / periods[i]!));
  return result;
}

function emptyMeasurement(): PulseMeasurement {
  return {
    lowV: null, highV: null, amplitudeV: null, frequencyHz: null, periodS: null, dutyCyclePct: null,
    riseTimeS: null, fallTimeS: null, overshootPct: null, undershootPct: null,
    pulseCount: 0, reason: null, referenceLevels: null, markers: null,
  };
}

function checkInput(input: PulseInput): { timeS: ArrayLike<number>; values: ArrayLike<number> } {
  if (typeof input !== "object" || input === null) throw new EngineeringInputError("input", "measurePulses needs { timeS, values }.");
  const { timeS, values } = input;
  if (!isNumberList(timeS)) throw new EngineeringInputError("timeS", "timeS must be an array of times in seconds.");
  if (!isNumberList(values)) throw new EngineeringInputError("values", "values must be an array of samples.");
  if (timeS.length !== values.length) {
    throw new EngineeringInputError("values", `timeS has ${timeS.length} samples but values has ${values.length}; they must match.`);
  }
  if (values.length < 2) throw new EngineeringInputError("values", "At least two samples are needed.");
  for (let i = 0; i < values.length; i += 1) {
    const t = timeS[i];
    const v = values[i];
    if (typeof t !== "number" || !Number.isFinite(t)) throw new EngineeringInputError("timeS", `timeS[${i}] is not a finite number.`);
    if (typeof v !== "number" || !Number.isFinite(v)) throw new EngineeringInputError("values", `values[${i}] is not a finite number.`);
    if (i > 0 && t < timeS[i - 1]!) throw new EngineeringInputError("timeS", `timeS[${i}] is earlier than timeS[${i - 1}]; times must increase.`);
  }
  if (!(timeS[values.length - 1]! > timeS[0]!)) throw new EngineeringInputError("timeS", "The times do not advance.");
  return { timeS, values };
}


/**
 * IEEE Std 181 histogram method: the low and high state levels are the modes of the lower and upper
 * halves of the histogram. Each mode is refined by mean-shift steps over a narrow window, so the level
 * is not quantised to a bin and symmetric noise around it averages out.
 */
function stateLevels(values: ArrayLike<number>, min: number, max: number): { low: number; high: number } {
  const n = values.length;
  const range = max - min;
  // One pass fills a fine histogram; the coarse one for the modes is its sum over groups of bins.
  const fine = new Uint32Array(HISTOGRAM_BINS * FINE_PER_BIN);
  const fineScale = fine.length / range;
  for (let i = 0; i < n; i += 1) {
    const b = Math.min(fine.length - 1, Math.floor((values[i]! - min) * fineScale));
    fine[b]! += 1;
  }
  const coarse = new Uint32Array(HISTOGRAM_BINS);
  for (let b = 0; b < fine.length; b += 1) coarse[Math.floor(b / FINE_PER_BIN)]! += fine[b]!;
  const half = HISTOGRAM_BINS / 2;
  let lowBin = 0;
  let highBin = HISTOGRAM_BINS - 1;
  for (let b = 0; b < half; b += 1) if (coarse[b]! > coarse[lowBin]!) lowBin = b;
  for (let b = HISTOGRAM_BINS - 1; b >= half; b -= 1) if (coarse[b]! > coarse[highBin]!) highBin = b;
  const fineWidth = range / fine.length;
  const window = MODE_WINDOW * range;
  const low = shiftToMode(fine, min, fineWidth, min + (lowBin + 0.5) * FINE_PER_BIN * fineWidth, window);
  const high = shiftToMode(fine, min, fineWidth, min + (highBin + 0.5) * FINE_PER_BIN * fineWidth, window);
  // The level is the median of the samples near the mode — taken as the mean of the samples in the fine
  // bin holding that median — so an ideal level comes out exact and the few samples of an edge that
  // fall near a level do not pull it.
  const lowBinFine = medianBin(fine, min, fineWidth, low, window);
  const highBinFine = medianBin(fine, min, fineWidth, high, window);
  let lowSum = 0;
  let lowCount = 0;
  let highSum = 0;
  let highCount = 0;
  for (let i = 0; i < n; i += 1) {
    const v = values[i]!;
    const b = Math.min(fine.length - 1, Math.floor((v - min) * fineScale));
    if (b === lowBinFine) {
      lowSum += v;
      lowCount += 1;
    } else if (b === highBinFine) {
      highSum += v;
      highCount += 1;
    }
  }
  return { low: lowCount > 0 ? lowSum / lowCount : low, high: highCount > 0 ? highSum / highCount : high };
}

function medianBin(fine: Uint32Array, min: number, width: number, centre: number, window: number): number {
  const from = Math.max(0, Math.floor((centre - window - min) / width));
  const to = Math.min(fine.length - 1, Math.floor((centre + window - min) / width));
  let total = 0;
  for (let b = from; b <= to; b += 1) total += fine[b]!;
  let seen = 0;
  for (let b = from; b <= to; b += 1) {
    seen += fine[b]!;
    if (seen * 2 >= total) return b;
  }
  return to;
}

/** Mean-shift steps over the fine histogram: the centre moves to the mean of the window until it settles. */
function shiftToMode(fine: Uint32Array, min: number, width: number, start: number, window: number): number {
  let centre = start;
  for (let step = 0; step < 20; step += 1) {
    const from = Math.max(0, Math.floor((centre - window - min) / width));
    const to = Math.min(fine.length - 1, Math.floor((centre + window - min) / width));
    let sum = 0;
    let count = 0;
    for (let b = from; b <= to; b += 1) {
      sum += fine[b]! * (min + (b + 0.5) * width);
      count += fine[b]!;
    }
    if (count === 0) break;
    const next = sum / count;
    if (Math.abs(next - centre) < width / 4) return next;
    centre = next;
  }
  return centre;
}

/**
 * Transitions with hysteresis between the 10 % and 90 % reference levels, so noise on a level never
 * counts as an edge. For a rising transition the proximal instant is the last upward crossing of the
 * 10 % level before the signal reaches 90 %, the distal instant the first crossing of 90 %; instants
 * are interpolated linearly between samples.
 */
function findTransitions(
  timeS: ArrayLike<number>,
  values: ArrayLike<number>,
  ref: { low10: number; mesial50: number; high90: number },
): Transition[] {
  const n = values.length;
  const out: Transition[] = [];
  let state: 0 | 1 | -1 = 0; // 0 until the signal has been seen at or beyond a reference level
  let lastAtLow = -1;
  let lastAtHigh = -1;
  for (let i = 0; i < n; i += 1) {
    const v = values[i]!;
    if (v <= ref.low10) {
      if (state === 1 && lastAtHigh >= 0) {
        out.push(transition(timeS, values, -1, lastAtHigh, i, ref));
      }
      state = -1;
      lastAtLow = i;
    } else if (v >= ref.high90) {
      if (state === -1 && lastAtLow >= 0) {
        out.push(transition(timeS, values, 1, lastAtLow, i, ref));
      }
      state = 1;
      lastAtHigh = i;
    }
  }
  return out;
}

function transition(
  timeS: ArrayLike<number>,
  values: ArrayLike<number>,
  direction: 1 | -1,
  lastBefore: number,
  firstAfter: number,
  ref: { low10: number; mesial50: number; high90: number },
): Transition {
  const proximalLevel = direction === 1 ? ref.low10 : ref.high90;
  const distalLevel = direction === 1 ? ref.high90 : ref.low10;
  const proximalS = crossing(timeS, values, lastBefore, proximalLevel);
  const distalS = crossing(timeS, values, firstAfter - 1, distalLevel);
  // The mesial instant: the last crossing of 50 % before the distal one (noise may cross it more than once).
  let j = firstAfter - 1;
  while (j > lastBefore && (direction === 1 ? values[j]! >= ref.mesial50 : values[j]! <= ref.mesial50)) j -= 1;
  const mesialS = crossing(timeS, values, j, ref.mesial50);
  return { direction, proximalS, mesialS, distalS, startIndex: lastBefore, endIndex: firstAfter };
}

/** The instant between samples i and i + 1 where the straight line between them meets `level`. */
function crossing(timeS: ArrayLike<number>, values: ArrayLike<number>, i: number, level: number): number {
  const v0 = values[i]!;
  const v1 = values[i + 1]!;
  const t0 = timeS[i]!;
  const t1 = timeS[i + 1]!;
  if (v1 === v0) return t0;
  const f = Math.min(1, Math.max(0, (level - v0) / (v1 - v0)));
  return t0 + f * (t1 - t0);
}

/**
 * Post-transition aberrations (IEEE Std 181): overshoot is the greatest excursion beyond the final
 * state level in the direction of the transition; undershoot the greatest excursion back short of it.
 * IEEE Std 181 leaves the region's length to the user: here it is the first half of the time between
 * the transition's end and the next transition's start (or the end of the capture), long enough for
 * ringing to show and short of the next edge's foot, which is not an aberration of this one.
 */
function measureAberrations(
  values: ArrayLike<number>,
  transitions: Transition[],
  low: number,
  high: number,
  amplitude: number,
): { overshootPct: number | null; undershootPct: number | null } {
  if (transitions.length === 0) return { overshootPct: null, undershootPct: null };
  let overshootSum = 0;
  let undershootSum = 0;
  let counted = 0;
  for (let k = 0; k < transitions.length; k += 1) {
    const t = transitions[k]!;
    const next = transitions[k + 1];
    // The region starts once the signal has reached its new level, so the last part of a finite edge is
    // not taken for undershoot.
    const regionEnd = next ? next.startIndex + 1 : values.length;
    const from = settledFrom(values, t.endIndex, regionEnd, t.direction, low, high, amplitude);
    if (from === -1) continue;
    const to = from + Math.max(1, Math.ceil((regionEnd - from) / 2));
    let peak = -Infinity;
    let dip = Infinity;
    for (let i = from; i < to; i += 1) {
      const v = t.direction === 1 ? values[i]! - high : low - values[i]!;
      if (v > peak) peak = v;
      if (v < dip) dip = v;
    }
    if (peak === -Infinity) continue;
    overshootSum += Math.max(0, peak) / amplitude;
    undershootSum += Math.max(0, -dip) / amplitude;
    counted += 1;
  }
  if (counted === 0) return { overshootPct: null, undershootPct: null };
  return { overshootPct: (100 * overshootSum) / counted, undershootPct: (100 * undershootSum) / counted };
}

/**
 * Where the transition has ended: the first sample at or beyond the new level, or — for a signal that
 * approaches it without reaching it — the first within SETTLED of it. -1 when neither happens.
 */
function settledFrom(values: ArrayLike<number>, from: number, until: number, direction: 1 | -1, low: number, high: number, amplitude: number): number {
  const near = SETTLED * amplitude;
  let within = -1;
  for (let i = from; i < until; i += 1) {
    const v = values[i]!;
    if (direction === 1 ? v >= high : v <= low) return i;
    if (within === -1 && (direction === 1 ? v >= high - near : v <= low + near)) within = i;
  }
  return within;
}

function mean(xs: number[]): number {
  let sum = 0;
  for (const x of xs) sum += x;
  return sum / xs.length;
}
