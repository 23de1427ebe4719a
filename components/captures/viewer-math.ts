// The viewer's zoom and pan as pure functions of a time window, so they are unit-tested apart
// from the pointer and key handling that calls them.

export type Span = { from: number; to: number };

/** The narrowest window the viewer zooms to: a few samples, so the trace stays readable. */
export function minimumSpan(bounds: Span, sampleIntervalS: number | null): number {
  const total = bounds.to - bounds.from;
  const bySamples = sampleIntervalS && sampleIntervalS > 0 ? 8 * sampleIntervalS : 0;
  return Math.min(total, Math.max(bySamples, total * 1e-6));
}

/** Moves a window of unchanged width inside the bounds (it never leaves the capture). */
export function keepInside(view: Span, bounds: Span): Span {
  const width = Math.min(view.to - view.from, bounds.to - bounds.from);
  let from = view.from;
  if (from < bounds.from) from = bounds.from;
  if (from + width > bounds.to) from = bounds.to - width;
  return { from, to: from + width };
}

/**
 * Zooms by `factor` (< 1 in, > 1 out) keeping the time `anchor` where it is on screen — under the
 * pointer for the wheel, the middle for the buttons and keys.
 */
export function zoomAround(view: Span, bounds: Span, factor: number, anchor: number, minSpan: number): Span {
  const width = view.to - view.from;
  const total = bounds.to - bounds.from;
  const next = Math.min(total, Math.max(minSpan, width * factor));
  const at = Math.min(view.to, Math.max(view.from, anchor));
  const share = width > 0 ? (at - view.from) / width : 0.5;
  return keepInside({ from: at - share * next, to: at - share * next + next }, bounds);
}

/** Pans by a fraction of the window's width (negative: earlier). */
export function panBy(view: Span, bounds: Span, fraction: number): Span {
  const shift = (view.to - view.from) * fraction;
  return keepInside({ from: view.from + shift, to: view.to + shift }, bounds);
}

/** The window a dragged range selects, widened about its middle to the narrowest allowed. */
export function rangeSpan(a: number, b: number, bounds: Span, minSpan: number): Span {
  const from = Math.max(bounds.from, Math.min(a, b));
  const to = Math.min(bounds.to, Math.max(a, b));
  if (to - from >= minSpan) return { from, to };
  const middle = (from + to) / 2;
  return keepInside({ from: middle - minSpan / 2, to: middle + minSpan / 2 }, bounds);
}

/** A window of the given width centred on a time (a pin, a marker), inside the bounds. */
export function centreOn(time: number, width: number, bounds: Span): Span {
  return keepInside({ from: time - width / 2, to: time + width / 2 }, bounds);
}

export function sameSpan(a: Span, b: Span): boolean {
  const width = Math.max(b.to - b.from, Number.MIN_VALUE);
  return Math.abs(a.from - b.from) / width < 1e-9 && Math.abs(a.to - b.to) / width < 1e-9;
}

/** The value axis of a unit group: the channels' whole-capture range with a margin, steady while zooming. */
export function valueDomain(ranges: readonly { minValue: number; maxValue: number }[]): [number, number] {
  const lo = Math.min(...ranges.map((r) => r.minValue));
  const hi = Math.max(...ranges.map((r) => r.maxValue));
  if (!Number.isFinite(lo) || !Number.isFinite(hi)) return [0, 1];
  const pad = (hi - lo) * 0.08 || Math.abs(hi) * 0.1 || 1;
  return [lo - pad, hi + pad];
}

/** The sample nearest to a time in a sorted trace (for the readout under the pointer). */
export function nearestIndex(times: readonly number[], t: number): number {
  let lo = 0;
  let hi = times.length - 1;
  if (hi < 0) return -1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if ((times[mid] ?? 0) < t) lo = mid;
    else hi = mid;
  }
  return Math.abs((times[lo] ?? 0) - t) <= Math.abs((times[hi] ?? 0) - t) ? lo : hi;
}
