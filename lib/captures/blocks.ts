// How a parsed capture is kept for the viewer: fixed blocks of samples in capture_blocks.
//
// Why blocks of binary floats in PostgreSQL rather than the CSV or one big value: a zoomed window
// reads only the blocks it overlaps (a range on the primary key, each block carrying its first and
// last time), so zooming never parses the CSV again and never reads more than a block beyond the
// window at either end. The rows go wherever the database goes (backups, a second app instance),
// with no extra file store to keep in step, and a deleted capture takes its blocks with it.
//
// Channels are Float32: 24 bits of mantissa, more than the 8–16 bits a scope's converter
// resolves, at half the size of Float64. Times are the exception: a million samples need more
// than 24 bits to stay apart, so when a capture is not evenly spaced its times are kept as
// Float64 in series −1; when it is (the usual case) sample i is at start + i · interval and no
// times are stored at all. Bytes are little-endian whatever the machine.

export const BLOCK_SAMPLES = 65_536;
export const TIME_SERIES = -1;

export type SampleBlock = {
  series: number;
  block: number;
  firstIndex: number;
  sampleCount: number;
  firstTimeS: number;
  lastTimeS: number;
  data: Buffer;
};

export type Spacing = { evenly: true; startS: number; intervalS: number } | { evenly: false };

/**
 * Evenly spaced when every time is within 1 % of an interval of start + i · interval (the span
 * over the count): CSV times are printed with few digits, so they jitter a little around the
 * instrument's clock, and the reconstructed time is then the better one.
 */
export function spacingOf(timeS: ArrayLike<number>): Spacing {
  const n = timeS.length;
  if (n < 2) return n === 1 ? { evenly: true, startS: timeS[0] ?? 0, intervalS: 0 } : { evenly: false };
  const startS = timeS[0] ?? 0;
  const intervalS = ((timeS[n - 1] ?? 0) - startS) / (n - 1);
  if (!(intervalS > 0)) return { evenly: false };
  const tolerance = 0.01 * intervalS;
  for (let i = 0; i < n; i++) {
    if (Math.abs((timeS[i] ?? 0) - (startS + i * intervalS)) > tolerance) return { evenly: false };
  }
  return { evenly: true, startS, intervalS };
}

export function timeAt(spacing: Extract<Spacing, { evenly: true }>, index: number): number {
  return spacing.startS + index * spacing.intervalS;
}

function float32Le(values: ArrayLike<number>, from: number, to: number): Buffer {
  const out = Buffer.allocUnsafe((to - from) * 4);
  for (let i = from; i < to; i++) out.writeFloatLE(values[i] ?? 0, (i - from) * 4);
  return out;
}

function float64Le(values: ArrayLike<number>, from: number, to: number): Buffer {
  const out = Buffer.allocUnsafe((to - from) * 8);
  for (let i = from; i < to; i++) out.writeDoubleLE(values[i] ?? 0, (i - from) * 8);
  return out;
}

export function decodeFloat32(data: Buffer, into: Float64Array, offset: number): void {
  const count = Math.floor(data.length / 4);
  for (let i = 0; i < count; i++) into[offset + i] = data.readFloatLE(i * 4);
}

export function decodeFloat64(data: Buffer, into: Float64Array, offset: number): void {
  const count = Math.floor(data.length / 8);
  for (let i = 0; i < count; i++) into[offset + i] = data.readDoubleLE(i * 8);
}

/** Every block of a parsed capture: the channels' values, and the times when they are not evenly spaced. */
export function encodeBlocks(timeS: ArrayLike<number>, channels: readonly { values: ArrayLike<number> }[], spacing: Spacing): SampleBlock[] {
  const n = timeS.length;
  const blocks: SampleBlock[] = [];
  for (let block = 0, first = 0; first < n; block++, first += BLOCK_SAMPLES) {
    const end = Math.min(n, first + BLOCK_SAMPLES);
    const firstTimeS = timeS[first] ?? 0;
    const lastTimeS = timeS[end - 1] ?? firstTimeS;
    const common = { block, firstIndex: first, sampleCount: end - first, firstTimeS, lastTimeS };
    channels.forEach((channel, series) => blocks.push({ ...common, series, data: float32Le(channel.values, first, end) }));
    if (!spacing.evenly) blocks.push({ ...common, series: TIME_SERIES, data: float64Le(timeS, first, end) });
  }
  return blocks;
}

/** The first index whose time is ≥ t (binary search; `times` ascending). */
export function lowerBound(times: ArrayLike<number>, t: number): number {
  let lo = 0;
  let hi = times.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if ((times[mid] ?? 0) < t) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/**
 * The index range to draw for a window: every sample inside it plus one on either side, so the
 * trace runs to the plot's edges instead of stopping short of them.
 */
export function windowRange(times: ArrayLike<number>, from: number, to: number): { start: number; end: number } {
  const start = Math.max(0, lowerBound(times, from) - 1);
  const end = Math.min(times.length, lowerBound(times, to) + (times[lowerBound(times, to)] === to ? 2 : 1));
  return { start, end: Math.max(end, Math.min(times.length, start + 2)) };
}
