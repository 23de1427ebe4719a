import { describe, expect, it } from "vitest";
import * as eng from "@/lib/engineering";
import { expectFieldError } from "./support";

type Case = {
  fn: string;
  field: string;
  call: (x: number) => unknown;
  /** zero has no physical answer for this argument */
  zeroInvalid: boolean;
};

// A sane call of every function, with one argument replaced by the bad value x.
const CASES: Case[] = [
  { fn: "busPeakVoltage", field: "mainsVrms", call: (x) => eng.busPeakVoltage(x), zeroInvalid: true },
  { fn: "busPeakVoltage", field: "tolerance", call: (x) => eng.busPeakVoltage(230, x), zeroInvalid: false },
  { fn: "capacitorEnergy", field: "capacitanceF", call: (x) => eng.capacitorEnergy(x, 100), zeroInvalid: false },
  { fn: "capacitorEnergy", field: "volts", call: (x) => eng.capacitorEnergy(1e-3, x), zeroInvalid: false },
  { fn: "capacitorCharge", field: "capacitanceF", call: (x) => eng.capacitorCharge(x, 100), zeroInvalid: false },
  { fn: "capacitorCharge", field: "volts", call: (x) => eng.capacitorCharge(1e-3, x), zeroInvalid: false },
  ...(["resistanceOhm", "capacitanceF", "fromV", "toV"] as const).map((field) => ({
    fn: "dischargeTime",
    field,
    call: (x: number) => eng.dischargeTime({ resistanceOhm: 47e3, capacitanceF: 1e-3, fromV: 358, toV: 60, [field]: x }),
    zeroInvalid: field !== "fromV",
  })),
  { fn: "preferredValue", field: "value", call: (x) => eng.preferredValue(x, { series: "E12", direction: "down" }), zeroInvalid: true },
  ...(["capacitanceF", "fromV", "withinS", "toV"] as const).map((field) => ({
    fn: "suggestBleeder",
    field,
    call: (x: number) => eng.suggestBleeder({ capacitanceF: 1e-3, fromV: 358, withinS: 60, toV: 60, [field]: x }),
    zeroInvalid: true,
  })),
  ...(["alNh", "turns"] as const).map((field) => ({
    fn: "inductanceFromAl",
    field,
    call: (x: number) => eng.inductanceFromAl({ alNh: 250, turns: 20, [field]: x }),
    zeroInvalid: true,
  })),
  ...(["alNh", "inductanceH"] as const).map((field) => ({
    fn: "turnsForInductance",
    field,
    call: (x: number) => eng.turnsForInductance({ alNh: 250, inductanceH: 1e-4, [field]: x }),
    zeroInvalid: true,
  })),
  ...(["turns", "coreAreaM2", "gapM", "pathM", "relativePermeability"] as const).map((field) => ({
    fn: "gappedInductance",
    field,
    call: (x: number) =>
      eng.gappedInductance({ turns: 20, coreAreaM2: 1e-4, gapM: 1e-3, pathM: 0.1, relativePermeability: 2000, [field]: x }),
    zeroInvalid: field !== "gapM",
  })),
  ...(["inductanceH", "peakCurrentA", "turns", "coreAreaM2"] as const).map((field) => ({
    fn: "peakFluxDensity",
    field,
    call: (x: number) => eng.peakFluxDensity({ inductanceH: 1e-4, peakCurrentA: 10, turns: 20, coreAreaM2: 1e-4, [field]: x }),
    zeroInvalid: field !== "peakCurrentA",
  })),
  ...(["inductanceH", "currentA"] as const).map((field) => ({
    fn: "storedEnergy",
    field,
    call: (x: number) => eng.storedEnergy({ inductanceH: 1e-4, currentA: 10, [field]: x }),
    zeroInvalid: false,
  })),
  ...(["volts", "frequencyHz", "peakFluxT", "coreAreaM2"] as const).map((field) => ({
    fn: "transformerTurns",
    field,
    call: (x: number) =>
      eng.transformerTurns({ volts: 230, frequencyHz: 50, peakFluxT: 1.2, coreAreaM2: 1e-3, waveform: "sine", [field]: x }),
    zeroInvalid: true,
  })),
  ...(["busVolts", "onTimeS", "fluxSwingT", "coreAreaM2"] as const).map((field) => ({
    fn: "forwardTurns",
    field,
    call: (x: number) => eng.forwardTurns({ busVolts: 340, onTimeS: 4e-6, fluxSwingT: 0.2, coreAreaM2: 1.5e-4, [field]: x }),
    zeroInvalid: true,
  })),
  { fn: "skinDepth", field: "frequencyHz", call: (x) => eng.skinDepth({ frequencyHz: x }), zeroInvalid: true },
  ...(["lengthM", "areaM2"] as const).map((field) => ({
    fn: "conductorResistance",
    field,
    call: (x: number) => eng.conductorResistance({ material: "copper", lengthM: 1, areaM2: 1e-6, [field]: x }),
    zeroInvalid: field === "areaM2",
  })),
  { fn: "awgDiameter", field: "gauge", call: (x) => eng.awgDiameter(x === 0 ? 41 : x - 10), zeroInvalid: true },
  { fn: "conventionalLoadVoltage", field: "currentA", call: (x) => eng.conventionalLoadVoltage(x), zeroInvalid: false },
  ...(["ratedA", "ratedDutyPct", "targetDutyPct"] as const).map((field) => ({
    fn: "currentAtDutyCycle",
    field,
    call: (x: number) => eng.currentAtDutyCycle({ ratedA: 160, ratedDutyPct: 60, targetDutyPct: 100, [field]: x }),
    zeroInvalid: true,
  })),
  ...(["currentA", "areaM2"] as const).map((field) => ({
    fn: "currentDensity",
    field,
    call: (x: number) => eng.currentDensity({ currentA: 10, areaM2: 1e-6, [field]: x }),
    zeroInvalid: field === "areaM2",
  })),
  ...(["resistanceOhm", "capacitanceF", "fromV"] as const).map((field) => ({
    fn: "dischargeCurve",
    field,
    call: (x: number) => eng.dischargeCurve({ resistanceOhm: 47e3, capacitanceF: 1e-3, fromV: 358, [field]: x }),
    zeroInvalid: field !== "fromV",
  })),
  ...(["inductanceH", "turns", "coreAreaM2", "toCurrentA"] as const).map((field) => ({
    fn: "fluxCurve",
    field,
    call: (x: number) => eng.fluxCurve({ inductanceH: 1e-4, turns: 20, coreAreaM2: 1e-4, toCurrentA: 20, [field]: x }),
    zeroInvalid: true,
  })),
  { fn: "convertUnit", field: "value", call: (x) => (x < 0 ? eng.convertUnit(Number.NaN, "V", "mV") : eng.convertUnit(x, "V", "mV")), zeroInvalid: false },
  { fn: "classifyReading", field: "value", call: (x) => (x < 0 ? eng.classifyReading({ value: Number.NaN, min: 0, max: 1 }) : eng.classifyReading({ value: x, min: 0, max: 1 })), zeroInvalid: false },
];

describe("every function rejects bad input with EngineeringInputError naming the field", () => {
  for (const c of CASES) {
    const negativeMeaningful = c.fn === "convertUnit" || c.fn === "classifyReading";
    it(`${c.fn}: ${c.field}`, () => {
      for (const bad of [Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY]) {
        expectFieldError(() => c.call(bad), c.field);
      }
      if (!negativeMeaningful) expectFieldError(() => c.call(-1), c.field);
      if (c.zeroInvalid) expectFieldError(() => c.call(0), c.field);
      else expect(Number.isFinite(c.call(0) as number) || typeof c.call(0) === "object").toBe(true);
    });
  }

  it("rejects unknown enum values and non-numbers from JavaScript callers", () => {
    const untyped = eng as unknown as Record<string, (...args: unknown[]) => unknown>;
    expectFieldError(() => untyped.transformerTurns!({ volts: 1, frequencyHz: 1, peakFluxT: 1, coreAreaM2: 1, waveform: "triangle" }), "waveform");
    expectFieldError(() => untyped.conductorResistance!({ material: "silver", lengthM: 1, areaM2: 1 }), "material");
    expectFieldError(() => untyped.conventionalLoadVoltage!(100, "gas"), "process");
    expectFieldError(() => untyped.noLoadVoltageLimit!({ kind: "dc", environment: "underwater" }), "environment");
    expectFieldError(() => untyped.preferredValue!(10, { series: "E6", direction: "up" }), "series");
    expectFieldError(() => untyped.busPeakVoltage!("230"), "mainsVrms");
    expectFieldError(() => untyped.awgDiameter!("5/0"), "gauge");
    expectFieldError(() => untyped.awgDiameter!(10.5), "gauge");
    expectFieldError(() => untyped.dischargeTime!(undefined), "input");
  });

  it("refuses results that would overflow rather than return Infinity", () => {
    expectFieldError(() => eng.capacitorEnergy(1e300, 1e300), "capacitanceF");
    expectFieldError(() => eng.inductanceFromAl({ alNh: 1e300, turns: 1e300 }), "turns");
  });

  it("keeps temperatures inside the range the linear α model is used for", () => {
    expectFieldError(() => eng.skinDepth({ frequencyHz: 1e3, temperatureC: -300 }), "temperatureC");
    expectFieldError(() => eng.conductorResistance({ material: "copper", lengthM: 1, areaM2: 1e-6, temperatureC: 900 }), "temperatureC");
    expect(eng.conductorResistance({ material: "copper", lengthM: 1, areaM2: 1e-6, temperatureC: -40 })).toBeGreaterThan(0);
  });
});
