import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  busPeakVoltage,
  dischargeTime,
  gappedInductance,
  inductanceFromAl,
  preferredValue,
  suggestBleeder,
  E12_SERIES,
} from "@/lib/engineering";
import {
  calculateInductor,
  calculateMains,
  calculateTransformer,
  calculateWeldingOutput,
  calculateWinding,
} from "@/lib/engineering/calculators";
import {
  CALC_LIMITS as L,
  inductorCalcSchema,
  mainsCalcSchema,
  transformerCalcSchema,
  weldingOutputCalcSchema,
  windingCalcSchema,
} from "@/lib/validations/calc";
import { allNumbersFinite } from "./support";

/** Log-uniform across a validated range (the ranges span many decades); 0 when the range allows it. */
function within(limit: { min: number; max: number }): fc.Arbitrary<number> {
  const lo = limit.min > 0 ? limit.min : Math.min(1e-6, limit.max);
  const logUniform = fc
    .double({ min: Math.log10(lo), max: Math.log10(limit.max), noNaN: true })
    .map((e) => Math.min(limit.max, Math.max(lo, 10 ** e)));
  return limit.min === 0 ? fc.oneof(fc.constant(0), logUniform) : logUniform;
}
const wholeWithin = (limit: { min: number; max: number }) => fc.integer({ min: limit.min, max: limit.max });

describe("physical laws hold for any valid input (fast-check)", () => {
  it("inductance grows with N²: k times the turns gives k² times the inductance", () => {
    fc.assert(
      fc.property(within(L.alNh), wholeWithin(L.turns), fc.integer({ min: 2, max: 10 }), (alNh, turns, k) => {
        const ratio = inductanceFromAl({ alNh, turns: k * turns }) / inductanceFromAl({ alNh, turns });
        expect(ratio).toBeCloseTo(k * k, 9);
      }),
    );
    fc.assert(
      fc.property(wholeWithin(L.turns), within(L.coreAreaM2), within(L.gapM), within(L.pathM), within(L.relativePermeability), (turns, coreAreaM2, gapM, pathM, relativePermeability) => {
        const shape = { coreAreaM2, gapM, pathM, relativePermeability };
        const ratio = gappedInductance({ ...shape, turns: 2 * turns }) / gappedInductance({ ...shape, turns });
        expect(ratio).toBeCloseTo(4, 9);
      }),
    );
  });

  it("discharge time grows with R and with C", () => {
    fc.assert(
      fc.property(within(L.bleederOhm), within(L.capacitanceF), within(L.mainsVrms), fc.double({ min: 1.01, max: 10, noNaN: true }), (r, c, vrms, k) => {
        const fromV = busPeakVoltage(vrms) + 61; // always above the 60 V target
        const base = dischargeTime({ resistanceOhm: r, capacitanceF: c, fromV });
        expect(base).toBeGreaterThan(0);
        expect(dischargeTime({ resistanceOhm: r * k, capacitanceF: c, fromV })).toBeGreaterThan(base);
        expect(dischargeTime({ resistanceOhm: r, capacitanceF: c * k, fromV })).toBeGreaterThan(base);
      }),
    );
  });

  it("a suggested bleeder always meets its time, and the next E12 value up would not", () => {
    fc.assert(
      fc.property(within(L.capacitanceF), within(L.mainsVrms), within(L.targetDischargeS), (c, vrms, withinS) => {
        const fromV = busPeakVoltage(vrms) + 61;
        const b = suggestBleeder({ capacitanceF: c, fromV, withinS });
        expect(b.dischargeS).toBeLessThanOrEqual(withinS);
        expect(b.dischargeS).toBe(dischargeTime({ resistanceOhm: b.ohms, capacitanceF: c, fromV }));
        const nextUp = preferredValue(b.ohms * 1.0001, { series: "E12", direction: "up" });
        expect(dischargeTime({ resistanceOhm: nextUp, capacitanceF: c, fromV })).toBeGreaterThan(withinS);
        expect(b.watts).toBeCloseTo((fromV * fromV) / b.ohms, 6);
      }),
    );
  });

  it("preferred values bracket the input and come from the IEC 60063 table", () => {
    const mantissa = (v: number) => Math.round(v / 10 ** (Math.floor(Math.log10(v) + 1e-12) - 1));
    fc.assert(
      fc.property(fc.double({ min: 1e-12, max: 1e12, noNaN: true }), (v) => {
        const down = preferredValue(v, { series: "E12", direction: "down" });
        const up = preferredValue(v, { series: "E12", direction: "up" });
        const nearest = preferredValue(v, { series: "E12", direction: "nearest" });
        expect(down).toBeLessThanOrEqual(v * (1 + 1e-12));
        expect(up).toBeGreaterThanOrEqual(v * (1 - 1e-12));
        expect([down, up]).toContain(nearest);
        expect(E12_SERIES as readonly number[]).toContain(mantissa(down));
        expect(E12_SERIES as readonly number[]).toContain(mantissa(up));
      }),
    );
  });
});

describe("no input within the validated ranges yields NaN or Infinity (fast-check)", () => {
  it("mains calculator", () => {
    fc.assert(
      fc.property(
        fc.record({
          mainsVrms: within(L.mainsVrms),
          tolerance: within(L.tolerance),
          capacitanceF: within(L.capacitanceF),
          bleederOhm: fc.option(within(L.bleederOhm), { nil: undefined }),
          safeV: within(L.safeV),
          targetDischargeS: within(L.targetDischargeS),
          points: wholeWithin(L.points),
        }),
        (body) => {
          expect(allNumbersFinite(calculateMains(mainsCalcSchema.parse(body)))).toBe(true);
        },
      ),
      { numRuns: 200 },
    );
  });

  it("inductor calculator, by AL and by gap", () => {
    const common = {
      turns: wholeWithin(L.turns),
      coreAreaM2: within(L.coreAreaM2),
      material: fc.constantFrom("mnzn-ferrite", "iron-powder", "silicon-steel", "amorphous", "nanocrystalline"),
      ratedCurrentA: within(L.currentA),
      points: wholeWithin(L.points),
    };
    const al = fc.record({ method: fc.constant("al"), alNh: within(L.alNh), ...common });
    const gap = fc.record({
      method: fc.constant("gap"),
      gapM: within(L.gapM),
      pathM: within(L.pathM),
      relativePermeability: fc.option(within(L.relativePermeability), { nil: undefined }),
      ...common,
    });
    fc.assert(
      fc.property(fc.oneof(al, gap), (body) => {
        expect(allNumbersFinite(calculateInductor(inductorCalcSchema.parse(body)))).toBe(true);
      }),
      { numRuns: 200 },
    );
  });

  it("transformer calculator, all three modes", () => {
    const secondaryV = fc.option(within(L.volts), { nil: undefined });
    const emf = fc.record({
      mode: fc.constantFrom("sine", "square"),
      primaryV: within(L.volts),
      frequencyHz: within(L.frequencyHz),
      peakFluxT: within(L.fluxT),
      coreAreaM2: within(L.coreAreaM2),
      secondaryV,
    });
    const forward = fc.record({
      mode: fc.constant("forward"),
      busVolts: within(L.volts),
      onTimeS: within(L.onTimeS),
      fluxSwingT: within(L.fluxT),
      coreAreaM2: within(L.coreAreaM2),
      secondaryV,
    });
    fc.assert(
      fc.property(fc.oneof(emf, forward), (body) => {
        expect(allNumbersFinite(calculateTransformer(transformerCalcSchema.parse(body)))).toBe(true);
      }),
      { numRuns: 200 },
    );
  });

  it("winding calculator", () => {
    fc.assert(
      fc.property(
        fc.record({
          material: fc.constantFrom("copper", "aluminium"),
          lengthM: within(L.lengthM),
          currentA: within({ min: 0, max: L.currentA.max }),
          temperatureC: fc.double({ min: L.temperatureC.min, max: L.temperatureC.max, noNaN: true }),
          frequencyHz: fc.option(within(L.frequencyHz), { nil: undefined }),
          strands: wholeWithin(L.strands),
        }),
        fc.oneof(
          fc.record({ awg: fc.oneof(fc.integer({ min: -3, max: 40 }), fc.constantFrom("0000", "2/0", "0")) }),
          fc.record({ areaM2: within(L.areaM2) }),
        ),
        (body, size) => {
          expect(allNumbersFinite(calculateWinding(windingCalcSchema.parse({ ...body, ...size })))).toBe(true);
        },
      ),
      { numRuns: 200 },
    );
  });

  it("welding-output calculator", () => {
    fc.assert(
      fc.property(
        fc.record({
          process: fc.constantFrom("mma", "tig", "mig"),
          openCircuitV: within(L.openCircuitV),
          ocvKind: fc.constantFrom("dc", "ac"),
          environment: fc.constantFrom("normal", "increased-hazard"),
          ratedA: within(L.weldingCurrentA),
          ratedDutyPct: within(L.dutyPct),
          targetDutyPct: within(L.dutyPct),
          maxCurrentA: fc.option(within(L.weldingCurrentA), { nil: undefined }),
          points: wholeWithin(L.points),
        }),
        (body) => {
          expect(allNumbersFinite(calculateWeldingOutput(weldingOutputCalcSchema.parse(body)))).toBe(true);
        },
      ),
      { numRuns: 200 },
    );
  });
});
