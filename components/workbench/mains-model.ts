import { calculateMains, type MainsResult } from "@/lib/engineering/calculators";
import { SAFE_VOLTAGE_V } from "@/lib/engineering";
import { mainsCalcSchema } from "@/lib/validations/calc";
import {
  compute,
  countErrors,
  errorsFromZod,
  invalidMessage,
  readSi,
  type NumberSpec,
  type Outcome,
} from "./live-input";

export const MAINS_FIELDS = ["mainsVrms", "tolerance", "capacitanceF", "bleederOhm", "targetDischargeS"] as const;
export type MainsField = (typeof MAINS_FIELDS)[number];
export type MainsValues = Record<MainsField | "preset", string>;

export const MAINS_SPECS: Record<MainsField, NumberSpec> = {
  mainsVrms: { label: "Mains voltage", unit: "V", toSi: 1 },
  tolerance: { label: "Tolerance", unit: "%", toSi: 0.01 },
  capacitanceF: { label: "Bus capacitance", unit: "µF", toSi: 1e-6 },
  bleederOhm: { label: "Bleeder resistance", unit: "kΩ", toSi: 1e3 },
  targetDischargeS: { label: "Target discharge time", unit: "s", toSi: 1 },
};

/**
 * Nominal voltages of IEC 60038 (table 1, from memory) with its ±10 % supply tolerance; the
 * bus is sized for the top of the band. 400 V is three-phase line to line, whose bridge
 * charges the bus to √2 × 400 V as well.
 */
export const MAINS_PRESETS = [
  { id: "230", label: "230 V ±10 % (single phase)", vrms: "230", tolerancePct: "10" },
  { id: "120", label: "120 V ±10 % (single phase, 60 Hz systems)", vrms: "120", tolerancePct: "10" },
  { id: "400", label: "400 V ±10 % (three-phase bridge, line to line)", vrms: "400", tolerancePct: "10" },
] as const;
export const CUSTOM_PRESET = "custom";

// An invented but plausible example: a 230 V inverter bus of 680 µF with a 100 kΩ bleeder.
export const MAINS_DEFAULTS: MainsValues = {
  preset: "230",
  mainsVrms: "230",
  tolerance: "10",
  capacitanceF: "680",
  bleederOhm: "100",
  targetDischargeS: "60",
};

export interface MainsFigures extends MainsResult {
  targetDischargeS: number;
  /** V0²/R of the declared bleeder at the bus peak; null without one */
  declaredBleederWatts: number | null;
  /** the declared bleeder takes longer than the target */
  waitTooLong: boolean;
}

/** The preset whose voltage and tolerance the fields hold, or "custom". */
export function presetFor(vrms: string, tolerancePct: string): string {
  const match = MAINS_PRESETS.find((p) => p.vrms === vrms.trim() && p.tolerancePct === tolerancePct.trim());
  return match?.id ?? CUSTOM_PRESET;
}

export function evaluateMains(values: MainsValues): Outcome<MainsFigures, MainsField> {
  const body = {
    mainsVrms: readSi(values.mainsVrms, MAINS_SPECS.mainsVrms),
    tolerance: readSi(values.tolerance, MAINS_SPECS.tolerance),
    capacitanceF: readSi(values.capacitanceF, MAINS_SPECS.capacitanceF),
    bleederOhm: readSi(values.bleederOhm, MAINS_SPECS.bleederOhm),
    targetDischargeS: readSi(values.targetDischargeS, MAINS_SPECS.targetDischargeS),
    safeV: SAFE_VOLTAGE_V,
    points: 80,
  };
  // An empty tolerance would silently become the schema's default of 10 %; here it must be typed.
  if (body.tolerance === undefined) body.tolerance = Number.NaN;
  const parsed = mainsCalcSchema.safeParse(body);
  if (!parsed.success) {
    const { fieldErrors } = errorsFromZod<MainsField>(parsed.error, { specs: MAINS_SPECS });
    return { ok: false, fieldErrors, message: invalidMessage(countErrors(fieldErrors)) };
  }
  const input = parsed.data;
  return compute(
    () => {
      const result = calculateMains(input);
      const declared = input.bleederOhm;
      return {
        ...result,
        targetDischargeS: input.targetDischargeS,
        declaredBleederWatts: declared === undefined ? null : (result.busPeakV * result.busPeakV) / declared,
        waitTooLong: result.dischargeS !== null && result.dischargeS > input.targetDischargeS,
      };
    },
    { capacitanceF: "capacitanceF", resistanceOhm: "bleederOhm", withinS: "targetDischargeS", mainsVrms: "mainsVrms" },
  );
}
