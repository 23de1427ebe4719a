/**
 * Pure helpers behind the SVG charts: nice axis ticks, linear scales and SI tick labels.
 * No React here, so the maths is unit-tested on its own.
 */

export interface NiceTicks {
  /** the axis runs from min to max, both multiples of step */
  min: number;
  max: number;
  step: number;
  ticks: number[];
}

/**
 * The smallest "nice" step (1, 2 or 5 × 10ⁿ) not below `rough` — the 1-2-5 rule of
 * Heckbert's "Nice numbers for graph labels" (Graphics Gems, 1990), rounding up so an axis
 * never gets more intervals than asked for.
 */
export function niceStep(rough: number): number {
  if (!Number.isFinite(rough) || rough <= 0) return 1;
  const exponent = Math.floor(Math.log10(rough));
  const base = 10 ** exponent;
  const fraction = rough / base;
  // A hair of tolerance: 0.3 / 0.1 is 2.9999999999999996, which must count as 3, not 2.
  const nice = fraction <= 1 + 1e-9 ? 1 : fraction <= 2 + 1e-9 ? 2 : fraction <= 5 + 1e-9 ? 5 : 10;
  return nice * base;
}

function decimalsOf(step: number): number {
  return Math.min(20, Math.max(0, -Math.floor(Math.log10(step) + 1e-9)));
}

// 0.1 + 0.2 is 0.30000000000000004; a tick label must read 0.3.
function clean(value: number, decimals: number): number {
  const rounded = Number(value.toFixed(decimals));
  return Object.is(rounded, -0) ? 0 : rounded;
}

/**
 * Ticks for a data range: the range is widened to the enclosing multiples of a nice step, with
 * at most `intervals` steps. A degenerate range (one value) still gets a readable axis.
 */
export function niceTicks(lo: number, hi: number, intervals = 5): NiceTicks {
  let min = Number.isFinite(lo) ? lo : 0;
  let max = Number.isFinite(hi) ? hi : 1;
  if (max < min) [min, max] = [max, min];
  if (max === min) {
    const pad = min === 0 ? 1 : Math.abs(min) / 2;
    min -= min === 0 ? 0 : pad;
    max += pad;
  }
  const wanted = Math.max(1, Math.round(intervals));
  let step = niceStep((max - min) / wanted);
  let decimals = decimalsOf(step);
  let first = clean(Math.floor(min / step + 1e-9) * step, decimals);
  let last = clean(Math.ceil(max / step - 1e-9) * step, decimals);
  // Widening to whole steps can add an interval (0.5…5.5 in steps of 1 is 0…6); then take
  // the next nice step instead.
  while (Math.round((last - first) / step) > wanted) {
    step = niceStep(step * (1 + 1e-6));
    decimals = decimalsOf(step);
    first = clean(Math.floor(min / step + 1e-9) * step, decimals);
    last = clean(Math.ceil(max / step - 1e-9) * step, decimals);
  }
  const count = Math.round((last - first) / step);
  const ticks: number[] = [];
  for (let k = 0; k <= count; k++) ticks.push(clean(first + k * step, decimals));
  return { min: first, max: last, step, ticks };
}

export type LinearScale = (value: number) => number;

/** Maps [d0, d1] onto [r0, r1]; an empty domain maps everything to the middle of the range. */
export function linearScale(domain: readonly [number, number], range: readonly [number, number]): LinearScale {
  const [d0, d1] = domain;
  const [r0, r1] = range;
  const span = d1 - d0;
  if (span === 0 || !Number.isFinite(span)) return () => (r0 + r1) / 2;
  return (value) => r0 + ((value - d0) / span) * (r1 - r0);
}

// SI prefixes (SI Brochure, 9th ed., table 7) in engineering steps. components/ui/format.ts
// chooses a prefix per value; an axis needs one prefix shared by all its ticks, so 0.5 ms
// sits next to 1 ms rather than 500 µs next to 1 ms.
const PREFIXES: Record<number, string> = {
  [-12]: "p",
  [-9]: "n",
  [-6]: "µ",
  [-3]: "m",
  0: "",
  3: "k",
  6: "M",
  9: "G",
  12: "T",
};

// Units that never take a prefix, as in components/ui/format.ts, plus minutes and hours.
const UNPREFIXED = new Set(["", "%", "‰", "ppm", "°", "°C", "K", "dB", "dBm", "min", "h"]);

const MINUS = "−"; // U+2212, as ISO 80000-1 writes negative numbers

export interface TickLabelOptions {
  /** false keeps plain numbers, e.g. for a time axis in minutes */
  prefixes?: boolean;
}

/** The engineering exponent (a multiple of 3) that all ticks of an axis share. */
export function axisExponent(ticks: readonly number[], unit: string, options: TickLabelOptions = {}): number {
  if (options.prefixes === false || UNPREFIXED.has(unit)) return 0;
  const largest = Math.max(0, ...ticks.map((t) => (Number.isFinite(t) ? Math.abs(t) : 0)));
  if (largest === 0) return 0;
  const exponent = Math.floor(Math.log10(largest) / 3 + 1e-9) * 3;
  return Math.min(12, Math.max(-12, exponent));
}

/**
 * Tick labels with the unit and one SI prefix for the whole axis, as few decimals as the step
 * needs and no trailing zeros: [0, 0.0005, 0.001] s → ["0 s", "0.5 ms", "1 ms"].
 */
export function tickLabels(ticks: readonly number[], unit: string, options: TickLabelOptions = {}): string[] {
  const exponent = axisExponent(ticks, unit, options);
  const scale = 10 ** exponent;
  const steps = ticks
    .slice(1)
    .map((t, i) => Math.abs(t - (ticks[i] ?? 0)))
    .filter((d) => d > 0);
  const step = steps.length > 0 ? Math.min(...steps) / scale : 1;
  const decimals = decimalsOf(step);
  const prefix = PREFIXES[exponent] ?? "";
  return ticks.map((tick) => {
    const mantissa = clean(tick / scale, decimals);
    if (mantissa === 0) return unit === "" ? "0" : `0 ${unit}`;
    const text = `${mantissa < 0 ? MINUS : ""}${String(Math.abs(mantissa))}`;
    return unit === "" ? text : `${text} ${prefix}${unit}`;
  });
}

/** Evenly picks at most `count` items, always keeping the first and the last. */
export function sampleEvenly<T>(items: readonly T[], count: number): T[] {
  if (items.length <= count || count < 2) return [...items];
  const out: T[] = [];
  for (let k = 0; k < count; k++) {
    const item = items[Math.round((k * (items.length - 1)) / (count - 1))];
    if (item !== undefined) out.push(item);
  }
  return out;
}

/**
 * An SVG path through the points: a move to the first, then one relative line-to (`l`) carrying every
 * step after it. Points are snapped to 0.1 px and each step is taken between snapped points, so no
 * error builds up along the path. A trace of a thousand points sampled evenly then takes a few
 * characters a step (`.5-1.4`) instead of a dozen, which matters where the path is part of the page's
 * HTML. Number syntax is SVG's path grammar (SVG 1.1 §8.3.9): a leading zero may go, and a minus sign
 * separates two numbers by itself.
 */
export function linePath(points: readonly { x: number; y: number }[]): string {
  const snapped = points.filter((p) => Number.isFinite(p.x) && Number.isFinite(p.y)).map((p) => ({ x: Math.round(p.x * 10), y: Math.round(p.y * 10) }));
  const [first, ...rest] = snapped;
  if (!first) return "";
  const steps = rest.map((p, i) => {
    const from = snapped[i]!;
    return `${tenths(p.x - from.x, i > 0)}${tenths(p.y - from.y, true)}`;
  });
  const move = `M${tenths(first.x, false)} ${tenths(first.y, false)}`;
  return steps.length ? `${move}l${steps.join("")}` : move;
}

/** A count of tenths as the shortest path number, with a space before it when it follows another and has no sign. */
function tenths(count: number, afterNumber: boolean): string {
  const sign = count < 0 ? "-" : afterNumber ? " " : "";
  const whole = Math.floor(Math.abs(count) / 10);
  const tenth = Math.abs(count) % 10;
  if (tenth === 0) return `${sign}${whole}`;
  return `${sign}${whole === 0 ? "" : whole}.${tenth}`;
}
