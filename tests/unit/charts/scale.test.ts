import fc from "fast-check";
import { unit as mathUnit } from "mathjs";
import { makeAbsolute, parseSVG } from "svg-path-parser";
import { describe, expect, it } from "vitest";
import {
  axisExponent,
  linePath,
  linearScale,
  niceStep,
  niceTicks,
  sampleEvenly,
  tickLabels,
} from "@/components/charts/scale";

// "Nice" steps follow the 1-2-5 rule of P. S. Heckbert, "Nice numbers for graph labels",
// Graphics Gems (1990): a step is 1, 2 or 5 times a power of ten, and the axis runs between
// multiples of it that enclose the data ("loose labelling").
const isOneTwoFive = (step: number) => {
  const mantissa = step / 10 ** Math.floor(Math.log10(step) + 1e-9);
  return [1, 2, 5].some((m) => Math.abs(mantissa - m) < 1e-9);
};

describe("niceStep", () => {
  it.each([
    [0.3, 0.5],
    [1, 1],
    [1.2, 2],
    [19.5, 20],
    [71.6, 100],
    [0.0007, 0.001],
    [3.4e-6, 5e-6],
  ])("rounds %s up to the 1-2-5 step %s (Heckbert 1990)", (rough, expected) => {
    expect(niceStep(rough)).toBeCloseTo(expected, 12);
  });

  it("never returns a step smaller than asked for, and always a 1-2-5 step", () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-12, max: 1e12, noNaN: true }), (rough) => {
        const step = niceStep(rough);
        expect(step).toBeGreaterThanOrEqual(rough * (1 - 1e-9));
        expect(step).toBeLessThanOrEqual(rough * 10);
        expect(isOneTwoFive(step)).toBe(true);
      }),
    );
  });
});

describe("niceTicks", () => {
  it("labels a 230 V +10 % bus (357.8 V, PRODUCT.md) in steps of 100 V from 0 to 400 V", () => {
    // Worked by hand with Heckbert's rule: 357.8 / 5 = 71.6 → step 100 → 0 … 400.
    expect(niceTicks(0, 357.8, 5)).toEqual({ min: 0, max: 400, step: 100, ticks: [0, 100, 200, 300, 400] });
  });

  it("gives clean decimals: 0 to 1 in ten steps is exactly 0, 0.1, …, 1", () => {
    // Same ticks as d3-array's documented ticks(0, 1, 10) (from memory); 0.1 + 0.2 must read 0.3.
    expect(niceTicks(0, 1, 10).ticks).toEqual([0, 0.1, 0.2, 0.3, 0.4, 0.5, 0.6, 0.7, 0.8, 0.9, 1]);
  });

  it("handles millisecond and microtesla ranges without float noise", () => {
    expect(niceTicks(0, 0.0015, 3).ticks).toEqual([0, 0.0005, 0.001, 0.0015]);
    expect(niceTicks(-0.3, 0.3, 6).ticks).toEqual([-0.3, -0.2, -0.1, 0, 0.1, 0.2, 0.3]);
  });

  it("widens a single value into a readable axis", () => {
    expect(niceTicks(0, 0).ticks.length).toBeGreaterThan(1);
    const around = niceTicks(60, 60);
    expect(around.min).toBeLessThan(60);
    expect(around.max).toBeGreaterThan(60);
  });

  it("encloses any range with at most the asked-for intervals of a 1-2-5 step (Heckbert's loose labelling)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: -1e6, max: 1e6, noNaN: true }),
        // Spans from a thousandth to a thousand times the offset: what a chart axis sees.
        fc.double({ min: 1e-3, max: 1e3, noNaN: true }),
        fc.integer({ min: 2, max: 12 }),
        (lo, fraction, intervals) => {
          const hi = lo + (Math.abs(lo) + 1e-3) * fraction;
          const t = niceTicks(lo, hi, intervals);
          expect(t.min).toBeLessThanOrEqual(lo + Math.abs(t.step) * 1e-6);
          expect(t.max).toBeGreaterThanOrEqual(hi - Math.abs(t.step) * 1e-6);
          expect(t.ticks.length - 1).toBeLessThanOrEqual(intervals);
          expect(isOneTwoFive(t.step)).toBe(true);
          for (const tick of t.ticks) {
            const multiple = tick / t.step;
            expect(Math.abs(multiple - Math.round(multiple))).toBeLessThan(1e-6);
          }
        },
      ),
    );
  });
});

describe("tickLabels", () => {
  // SI Brochure (BIPM, 9th ed. 2019) table 7 prefixes and §5.4.3 space between number and unit.
  it.each([
    [[0, 100, 200, 300, 400], "V", ["0 V", "100 V", "200 V", "300 V", "400 V"]],
    [[0, 0.0005, 0.001, 0.0015], "s", ["0 s", "0.5 ms", "1 ms", "1.5 ms"]],
    [[0, 0.1, 0.2, 0.3, 0.4], "T", ["0 T", "100 mT", "200 mT", "300 mT", "400 mT"]],
    [[0, 500, 1000, 1500], "Ω", ["0 Ω", "0.5 kΩ", "1 kΩ", "1.5 kΩ"]],
    [[0, 2e-6, 4e-6], "H", ["0 H", "2 µH", "4 µH"]],
  ])("%j %s → one prefix for the axis", (ticks, unit, expected) => {
    expect(tickLabels(ticks, unit)).toEqual(expected);
  });

  it("reads back as the tick values when parsed by mathjs", () => {
    // Cross-check against mathjs's own unit parser (it spells micro "u" and ohm "ohm").
    const ticks = [0, 0.0002, 0.0004, 0.0006];
    const labels = tickLabels(ticks, "s");
    labels.forEach((label, i) => {
      const parsed = mathUnit(label.replace("µ", "u")).toNumber("s");
      expect(parsed).toBeCloseTo(ticks[i] ?? NaN, 12);
    });
    const ohms = tickLabels([0, 2_000_000, 4_000_000], "Ω");
    expect(ohms).toEqual(["0 Ω", "2 MΩ", "4 MΩ"]);
    expect(mathUnit(ohms[1]?.replace("Ω", "ohm") ?? "").toNumber("ohm")).toBe(2_000_000);
  });

  it("writes negative ticks with the minus sign of ISO 80000-1", () => {
    expect(tickLabels([-0.2, 0, 0.2], "A")).toEqual(["−200 mA", "0 A", "200 mA"]);
  });

  it("never prefixes per cent, degrees Celsius or minutes, and keeps plain numbers on request", () => {
    // SI Brochure §5.4.7: % takes no prefix; °C is never prefixed in practice.
    expect(tickLabels([0, 5000, 10000], "%")).toEqual(["0 %", "5000 %", "10000 %"]);
    expect(tickLabels([0, 10, 20], "min")).toEqual(["0 min", "10 min", "20 min"]);
    expect(tickLabels([0, 2000, 4000], "s", { prefixes: false })).toEqual(["0 s", "2000 s", "4000 s"]);
    expect(axisExponent([0, 2000, 4000], "s")).toBe(3);
  });
});

describe("linearScale", () => {
  it("maps the domain onto the range, including SVG's downward y", () => {
    const y = linearScale([0, 400], [300, 20]);
    expect(y(0)).toBe(300);
    expect(y(400)).toBe(20);
    expect(y(200)).toBe(160);
    expect(y(60)).toBeCloseTo(300 - (60 / 400) * 280, 12);
  });

  it("does not divide by zero on an empty domain", () => {
    expect(linearScale([5, 5], [0, 100])(5)).toBe(50);
  });
});

describe("sampleEvenly and linePath", () => {
  it("keeps the first and last point and at most the asked-for count", () => {
    const items = Array.from({ length: 100 }, (_, i) => i);
    const picked = sampleEvenly(items, 12);
    expect(picked).toHaveLength(12);
    expect(picked[0]).toBe(0);
    expect(picked[11]).toBe(99);
    expect(sampleEvenly([1, 2, 3], 12)).toEqual([1, 2, 3]);
  });

  it("draws a move followed by relative line segments and skips non-finite points", () => {
    expect(
      linePath([
        { x: 0, y: 1 },
        { x: 1.06, y: 2 },
        { x: Number.NaN, y: 3 },
        { x: 3, y: 0.5 },
        { x: 3.5, y: 0.5 },
      ]),
    ).toBe("M0 1l1.1 1 1.9-1.5 .5 0");
    expect(linePath([{ x: 2, y: 3 }])).toBe("M2 3");
    expect(linePath([])).toBe("");
  });

  it("reads back, through an independent SVG path parser, as the points snapped to 0.1 px (fast-check)", () => {
    // svg-path-parser (npm) implements the SVG 1.1 path data grammar; makeAbsolute resolves the
    // relative steps. Every point is where it was drawn to within the 0.05 px of the snap, however
    // long the path: the steps are taken between snapped points, so rounding does not add up.
    const point = fc.record({ x: fc.double({ min: -2000, max: 2000, noNaN: true }), y: fc.double({ min: -2000, max: 2000, noNaN: true }) });
    fc.assert(
      fc.property(fc.array(point, { minLength: 1, maxLength: 400 }), (points) => {
        const commands = makeAbsolute(parseSVG(linePath(points)));
        expect(commands).toHaveLength(points.length);
        expect(commands[0]?.code).toBe("M");
        commands.forEach((command, i) => {
          if (i > 0) expect(command.code).toBe("L");
          const drawn = command as { x: number; y: number };
          expect(Math.abs(drawn.x - points[i]!.x)).toBeLessThanOrEqual(0.05 + 1e-9);
          expect(Math.abs(drawn.y - points[i]!.y)).toBeLessThanOrEqual(0.05 + 1e-9);
        });
      }),
      { numRuns: 300 },
    );
  });
});
