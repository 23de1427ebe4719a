import "server-only";
import { readCaptureSamples, type CaptureDetail } from "@/db/queries/captures";
import { downsampleForPlot } from "@/lib/engineering";
import { windowRange } from "./blocks";
import { time12 } from "./packed-window";
import type { CaptureWindowView, WindowTrace } from "./types";
import type { TimeSpan } from "./window-params";

// Float32 samples printed as doubles carry digits they never had (15.000000953674316); seven
// significant digits are what Float32 holds. Times keep twelve (./packed-window.ts).
const value7 = (v: number) => Number(v.toPrecision(7));

/**
 * A window of a measured capture, downsampled with LTTB to at most `points` per channel. Only the
 * stored blocks overlapping the window are read; the trace includes one sample beyond each edge.
 */
export async function captureWindow(detail: CaptureDetail, window: TimeSpan, points: number, channel?: number): Promise<CaptureWindowView> {
  const channels = channel === undefined ? detail.channels.map((c) => c.index) : [channel];
  const raw = await readCaptureSamples(detail.capture, window.from, window.to, channels);
  const { start, end } = windowRange(raw.timeS, window.from, window.to);
  const timeS = raw.timeS.subarray(start, end);
  let inside = 0;
  for (const t of timeS) if (t >= window.from && t <= window.to) inside++;

  const traces: WindowTrace[] = channels.map((index) => {
    const meta = detail.channels.find((c) => c.index === index);
    const values = (raw.values.get(index) ?? new Float64Array(raw.timeS.length)).subarray(start, end);
    const reduced = timeS.length > points ? downsampleForPlot(timeS, values, points) : { timeS, values };
    return {
      index,
      name: meta?.name ?? `Channel ${index + 1}`,
      unit: meta?.unit ?? null,
      timeS: Array.from(reduced.timeS, time12),
      values: Array.from(reduced.values, value7),
    };
  });
  return { from: window.from, to: window.to, points, samplesInWindow: inside, traces };
}
