// The viewer's zoom and pan: the anchored zoom keeps the time under the pointer where it is
// (the point's share of the window is unchanged), and no window leaves the capture or gets
// narrower than a few samples. Checked against the arithmetic of a linear axis.
import { describe, expect, it } from "vitest";
import { centreOn, keepInside, minimumSpan, nearestIndex, panBy, rangeSpan, valueDomain, zoomAround } from "@/components/captures/viewer-math";

const bounds = { from: 0, to: 1e-3 };

/** Equal to a femtosecond: the windows are sums of binary fractions. */
function expectSpan(actual: { from: number; to: number }, expected: { from: number; to: number }) {
  expect(actual.from).toBeCloseTo(expected.from, 15);
  expect(actual.to).toBeCloseTo(expected.to, 15);
}

describe("zoom", () => {
  it("keeps the anchor at its share of the window", () => {
    const view = { from: 0, to: 1e-3 };
    const next = zoomAround(view, bounds, 0.5, 2.5e-4, 1e-9);
    expect(next.to - next.from).toBeCloseTo(5e-4, 15);
    // 2.5e-4 was a quarter of the way in, and still is.
    expect((2.5e-4 - next.from) / (next.to - next.from)).toBeCloseTo(0.25, 12);
  });

  it("stops at the whole capture and at the narrowest window", () => {
    expect(zoomAround({ from: 2e-4, to: 8e-4 }, bounds, 4, 5e-4, 1e-9)).toEqual(bounds);
    const narrow = zoomAround({ from: 4e-4, to: 4.1e-4 }, bounds, 1e-6, 4.05e-4, 1e-6);
    expect(narrow.to - narrow.from).toBeCloseTo(1e-6, 15);
  });

  it("narrows to eight samples at most, or a millionth of a long capture", () => {
    expect(minimumSpan(bounds, 1e-7)).toBeCloseTo(8e-7, 15);
    expect(minimumSpan({ from: 0, to: 10 }, null)).toBeCloseTo(1e-5, 12);
  });
});

describe("pan and ranges", () => {
  it("pans by a share of the window and stops at the capture's ends", () => {
    expectSpan(panBy({ from: 2e-4, to: 4e-4 }, bounds, 0.5), { from: 3e-4, to: 5e-4 });
    expectSpan(panBy({ from: 1e-4, to: 3e-4 }, bounds, -1), { from: 0, to: 2e-4 });
    expect(keepInside({ from: 9e-4, to: 1.2e-3 }, bounds).to).toBe(1e-3);
  });

  it("takes a dragged range either way round, widened about its middle when too narrow", () => {
    expectSpan(rangeSpan(6e-4, 2e-4, bounds, 1e-6), { from: 2e-4, to: 6e-4 });
    const widened = rangeSpan(5e-4, 5e-4, bounds, 1e-5);
    expect(widened.to - widened.from).toBeCloseTo(1e-5, 15);
    expect((widened.from + widened.to) / 2).toBeCloseTo(5e-4, 15);
    expectSpan(centreOn(1e-3, 2e-4, bounds), { from: 8e-4, to: 1e-3 });
  });

  it("finds the nearest sample and pads the value axis by 8 %", () => {
    expect(nearestIndex([0, 1, 2, 3], 2.4)).toBe(2);
    expect(nearestIndex([0, 1, 2, 3], 2.6)).toBe(3);
    expect(nearestIndex([], 1)).toBe(-1);
    const [lo, hi] = valueDomain([{ minValue: 0, maxValue: 15 }, { minValue: -1, maxValue: 12 }]);
    expect(lo).toBeCloseTo(-1 - 16 * 0.08, 12);
    expect(hi).toBeCloseTo(15 + 16 * 0.08, 12);
  });
});
