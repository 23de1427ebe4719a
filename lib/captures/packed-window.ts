import type { CaptureWindowView, WindowTrace } from "./types";

// The capture pages hand their first window to the viewer inside the page itself (the RSC payload
// beside the HTML), so its size is part of every first view. A downsampled trace of an evenly sampled
// capture keeps samples of the capture's own time grid: each time is the first one plus a whole number
// of sample intervals. Sent as the gaps between those numbers (mostly 1–9), the times take about a
// fifth of the bytes that twelve-digit times take, and read back as exactly the same numbers.

/** Times carry twelve significant digits: enough to tell a million samples apart, and free of Float noise. */
export const time12 = (t: number) => Number(t.toPrecision(12));

/** Times as `origin + (sum of gaps so far) × stepS`, each rounded with `time12`. */
export type TimeGrid = { origin: number; stepS: number; gaps: number[] };
export type PackedTrace = Omit<WindowTrace, "timeS"> & { timeS: number[] | TimeGrid };
export type PackedWindowView = Omit<CaptureWindowView, "traces"> & { traces: PackedTrace[] };

/**
 * The window with each trace's times on the capture's grid where they all are, checked point by point:
 * a trace whose times do not read back exactly (an uneven capture, no interval known) keeps its list.
 */
export function packWindow(view: CaptureWindowView, sampleIntervalS: number | null): PackedWindowView {
  return { ...view, traces: view.traces.map((trace) => ({ ...trace, timeS: onGrid(trace.timeS, sampleIntervalS) ?? trace.timeS })) };
}

export function unpackWindow(packed: PackedWindowView): CaptureWindowView {
  return { ...packed, traces: packed.traces.map((trace) => ({ ...trace, timeS: Array.isArray(trace.timeS) ? trace.timeS : gridTimes(trace.timeS) })) };
}

function onGrid(timeS: readonly number[], stepS: number | null): TimeGrid | null {
  const origin = timeS[0];
  if (origin === undefined || stepS === null || !(stepS > 0) || !Number.isFinite(stepS)) return null;
  const gaps: number[] = [];
  let count = 0;
  for (const [i, t] of timeS.entries()) {
    const next = Math.round((t - origin) / stepS);
    if (i > 0 && next <= count) return null;
    if (time12(origin + next * stepS) !== t) return null;
    if (i > 0) gaps.push(next - count);
    count = next;
  }
  return { origin, stepS, gaps };
}

function gridTimes({ origin, stepS, gaps }: TimeGrid): number[] {
  const times = [time12(origin)];
  let count = 0;
  for (const gap of gaps) {
    count += gap;
    times.push(time12(origin + count * stepS));
  }
  return times;
}
