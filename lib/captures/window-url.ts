// What the capture viewer needs to ask for a window, without the query schema (and so without Zod)
// that the route parses it with (./window-params.ts).

/** Enough for a plot a few thousand pixels wide; LTTB needs at least the two end points. */
export const MIN_POINTS = 2;
export const MAX_POINTS = 5000;
export const DEFAULT_POINTS = 1200;

export type TimeSpan = { from: number; to: number };

/** The URL the viewer asks for a window. */
export function windowUrl(captureId: string, window: TimeSpan, points: number, channel?: number): string {
  const params = new URLSearchParams({ from: String(window.from), to: String(window.to), points: String(points) });
  if (channel !== undefined) params.set("channel", String(channel));
  return `/api/captures/${encodeURIComponent(captureId)}/window?${params.toString()}`;
}
