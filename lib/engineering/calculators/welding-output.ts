import type { WeldingOutputCalcInput } from "@/lib/validations/calc";
import { conventionalLoadVoltage, currentAtDutyCycle, noLoadVoltageLimit, type OutputKind, type WeldingEnvironment, type WeldingProcess } from "../welding";

export interface LoadPoint {
  currentA: number;
  volts: number;
}

export interface WeldingOutputResult {
  process: WeldingProcess;
  /** conventional load voltage at the rated current */
  ratedLoadV: number;
  /** the standard's load line from 0 A to maxCurrentA (the rated current by default) */
  loadLine: LoadPoint[];
  ocv: {
    declaredV: number;
    kind: OutputKind;
    environment: WeldingEnvironment;
    /** DC OCV is compared as a peak, AC OCV as RMS */
    basis: "peak" | "rms";
    limitV: number;
    limitPeakV: number;
    limitRmsV: number | null;
    withinLimit: boolean;
    /** limit − declared; negative when over */
    marginV: number;
  };
  dutyCycle: {
    ratedA: number;
    ratedDutyPct: number;
    targetDutyPct: number;
    currentA: number;
    /** the equal-heating current at 100 % */
    continuousA: number;
  };
}

export function calculateWeldingOutput(input: WeldingOutputCalcInput): WeldingOutputResult {
  const limit = noLoadVoltageLimit({ kind: input.ocvKind, environment: input.environment });
  const basis = input.ocvKind === "ac" ? "rms" : "peak";
  const limitV = basis === "rms" ? (limit.rmsV ?? limit.peakV) : limit.peakV;
  const top = input.maxCurrentA ?? input.ratedA;
  const loadLine: LoadPoint[] = [];
  for (let k = 0; k < input.points; k++) {
    const currentA = (top * k) / (input.points - 1);
    loadLine.push({ currentA, volts: conventionalLoadVoltage(currentA, input.process) });
  }
  const duty = { ratedA: input.ratedA, ratedDutyPct: input.ratedDutyPct };
  return {
    process: input.process,
    ratedLoadV: conventionalLoadVoltage(input.ratedA, input.process),
    loadLine,
    ocv: {
      declaredV: input.openCircuitV,
      kind: input.ocvKind,
      environment: input.environment,
      basis,
      limitV,
      limitPeakV: limit.peakV,
      limitRmsV: limit.rmsV ?? null,
      withinLimit: input.openCircuitV <= limitV,
      marginV: limitV - input.openCircuitV,
    },
    dutyCycle: {
      ...duty,
      targetDutyPct: input.targetDutyPct,
      currentA: currentAtDutyCycle({ ...duty, targetDutyPct: input.targetDutyPct }),
      continuousA: currentAtDutyCycle({ ...duty, targetDutyPct: 100 }),
    },
  };
}
