import type { MainsCalcInput } from "@/lib/validations/calc";
import { STORED_CHARGE_THRESHOLD_C } from "../constants";
import {
  busPeakVoltage,
  capacitorCharge,
  capacitorEnergy,
  dischargeCurve,
  dischargeTime,
  suggestBleeder,
  type BleederSuggestion,
  type DischargePoint,
} from "../mains";

export interface MainsResult {
  busPeakV: number;
  energyJ: number;
  chargeC: number;
  safeV: number;
  aboveSafeVoltage: boolean;
  /** above the 45 µC that makes accessible stored charge hazardous (IEC 61010-1, from memory) */
  chargeAboveThreshold: boolean;
  /** R·C of the declared bleeder; null without one */
  timeConstantS: number | null;
  /** with the declared bleeder; null without one */
  dischargeS: number | null;
  /** null when the bus never exceeds the safe voltage */
  suggestedBleeder: BleederSuggestion | null;
  /** V(t) through the declared bleeder, else the suggested one; null when neither exists */
  curve: { bleederOhm: number; source: "declared" | "suggested"; points: DischargePoint[] } | null;
}

export function calculateMains(input: MainsCalcInput): MainsResult {
  const busPeakV = busPeakVoltage(input.mainsVrms, input.tolerance);
  const c = input.capacitanceF;
  const chargeC = capacitorCharge(c, busPeakV);
  const aboveSafeVoltage = busPeakV > input.safeV;
  const suggestedBleeder = aboveSafeVoltage
    ? suggestBleeder({ capacitanceF: c, fromV: busPeakV, withinS: input.targetDischargeS, toV: input.safeV })
    : null;
  const declared = input.bleederOhm;
  const dischargeS =
    declared === undefined ? null : dischargeTime({ resistanceOhm: declared, capacitanceF: c, fromV: busPeakV, toV: input.safeV });
  const curveOhm = declared ?? suggestedBleeder?.ohms;
  return {
    busPeakV,
    energyJ: capacitorEnergy(c, busPeakV),
    chargeC,
    safeV: input.safeV,
    aboveSafeVoltage,
    chargeAboveThreshold: chargeC > STORED_CHARGE_THRESHOLD_C,
    timeConstantS: declared === undefined ? null : declared * c,
    dischargeS,
    suggestedBleeder,
    curve:
      curveOhm === undefined
        ? null
        : {
            bleederOhm: curveOhm,
            source: declared === undefined ? "suggested" : "declared",
            points: dischargeCurve({
              resistanceOhm: curveOhm,
              capacitanceF: c,
              fromV: busPeakV,
              toV: input.safeV,
              points: input.points,
            }),
          },
  };
}
