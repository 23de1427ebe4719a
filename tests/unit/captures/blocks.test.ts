// The stored form of a capture's samples: evenly spaced or not, the round trip through the
// little-endian Float32/Float64 blocks, and the index range of a window. Float32 keeps a 24-bit
// significand (IEEE 754-2019, binary32), so a value comes back within 2⁻²⁴ of itself, relatively.
import { describe, expect, it } from "vitest";
import { BLOCK_SAMPLES, decodeFloat32, decodeFloat64, encodeBlocks, lowerBound, spacingOf, TIME_SERIES, windowRange } from "@/lib/captures/blocks";

describe("spacing", () => {
  it("is even for times printed with few digits around a steady clock", () => {
    // 0.1 µs steps printed to 4 significant digits wander by less than 1 % of a step.
    const times = Array.from({ length: 5000 }, (_, i) => Number((i * 1e-7).toPrecision(4)));
    expect(spacingOf(times)).toEqual({ evenly: true, startS: 0, intervalS: (times[4999]! - 0) / 4999 });
  });

  it("is uneven when a sample is a quarter of a step off, or times run backwards", () => {
    const times = Array.from({ length: 100 }, (_, i) => i * 1e-6);
    times[50] = 50.25e-6;
    expect(spacingOf(times)).toEqual({ evenly: false });
    expect(spacingOf([3, 2, 1])).toEqual({ evenly: false });
  });
});

describe("blocks", () => {
  const n = BLOCK_SAMPLES * 2 + 17;
  const times = Float64Array.from({ length: n }, (_, i) => i * 1e-8);
  const ch0 = Float64Array.from({ length: n }, (_, i) => Math.sin(i / 100) * 15);
  const ch1 = Float64Array.from({ length: n }, (_, i) => (i % 7) * 1e-3);

  it("split every channel into fixed blocks that carry their first and last time", () => {
    const blocks = encodeBlocks(times, [{ values: ch0 }, { values: ch1 }], { evenly: true, startS: 0, intervalS: 1e-8 });
    expect(blocks.map((b) => [b.series, b.block, b.firstIndex, b.sampleCount])).toEqual([
      [0, 0, 0, BLOCK_SAMPLES],
      [1, 0, 0, BLOCK_SAMPLES],
      [0, 1, BLOCK_SAMPLES, BLOCK_SAMPLES],
      [1, 1, BLOCK_SAMPLES, BLOCK_SAMPLES],
      [0, 2, 2 * BLOCK_SAMPLES, 17],
      [1, 2, 2 * BLOCK_SAMPLES, 17],
    ]);
    expect(blocks[4]).toMatchObject({ firstTimeS: times[2 * BLOCK_SAMPLES], lastTimeS: times[n - 1] });
    // 4 bytes a sample.
    expect(blocks[0]!.data.length).toBe(BLOCK_SAMPLES * 4);
  });

  it("give the values back within Float32's precision, and uneven times exactly as Float64", () => {
    const blocks = encodeBlocks(times, [{ values: ch0 }], { evenly: false });
    const back = new Float64Array(n);
    const backTimes = new Float64Array(n);
    for (const b of blocks) {
      if (b.series === TIME_SERIES) decodeFloat64(b.data, backTimes, b.firstIndex);
      else decodeFloat32(b.data, back, b.firstIndex);
    }
    expect(Array.from(backTimes)).toEqual(Array.from(times));
    for (let i = 0; i < n; i += 997) expect(Math.abs(back[i]! - ch0[i]!)).toBeLessThanOrEqual(Math.abs(ch0[i]!) * 2 ** -24 + 1e-45);
    // Little-endian: 1.0f is 00 00 80 3F (IEEE 754 binary32, sign 0, exponent 127, fraction 0).
    const one = encodeBlocks([0], [{ values: [1] }], { evenly: true, startS: 0, intervalS: 0 })[0]!.data;
    expect([...one]).toEqual([0x00, 0x00, 0x80, 0x3f]);
  });
});

describe("window range", () => {
  const times = [0, 1, 2, 3, 4, 5, 6, 7, 8, 9];

  it("holds every sample inside the window and one beyond each edge", () => {
    expect(lowerBound(times, 2.5)).toBe(3);
    expect(windowRange(times, 2.5, 5.5)).toEqual({ start: 2, end: 7 });
    // Edges on samples: the edge samples and one beyond.
    expect(windowRange(times, 2, 5)).toEqual({ start: 1, end: 7 });
    // At the ends of the capture there is nothing beyond.
    expect(windowRange(times, 0, 9)).toEqual({ start: 0, end: 10 });
  });

  it("still has two samples for a window narrower than one step", () => {
    const { start, end } = windowRange(times, 4.2, 4.3);
    expect(end - start).toBeGreaterThanOrEqual(2);
    expect(times[start]).toBeLessThanOrEqual(4.2);
    expect(times[end - 1]).toBeGreaterThanOrEqual(4.3);
  });
});
