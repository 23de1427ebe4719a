import { calculateWeldingOutput, type LoadPoint, type WeldingOutputResult } from "@/lib/engineering/calculators";
import { WELDING_PROCESSES, conventionalLoadVoltage, type WeldingProcess } from "@/lib/engineering";
import { CALC_LIMITS, quantity, weldingOutputCalcSchema } from "@/lib/validations/calc";
import {
  compute,
  countErrors,
  errorsFromZod,
  invalidMessage,
  issueMessage,
  mergeErrors,
  readSi,
  type FieldErrors,
  type NumberSpec,
  type Outcome,
} from "./live-input";

export const WELDING_FIELDS = [
  "openCircuitV",
  "ratedA",
  "ratedDutyPct",
  "targetDutyPct",
  "minCurrentA",
  "maxCurrentA",
] as const;
export type WeldingField = (typeof WELDING_FIELDS)[number];
export type WeldingValues = Record<WeldingField | "process" | "ocvKind" | "environment", string>;

export const WELDING_SPECS: Record<WeldingField, NumberSpec> = {
  openCircuitV: { label: "Open-circuit voltage", unit: "V", toSi: 1 },
  ratedA: { label: "Rated current", unit: "A", toSi: 1 },
  ratedDutyPct: { label: "Rated duty cycle", unit: "%", toSi: 1 },
  targetDutyPct: { label: "Duty cycle to convert to", unit: "%", toSi: 1 },
  minCurrentA: { label: "Lowest output current", unit: "A", toSi: 1 },
  maxCurrentA: { label: "Highest output current", unit: "A", toSi: 1 },
};

export const PROCESS_LABELS: Record<WeldingProcess, string> = {
  mma: "MMA (stick electrode)",
  tig: "TIG",
  mig: "MIG/MAG",
};
export const PROCESS_OPTIONS = WELDING_PROCESSES.map((id) => ({ value: id, label: PROCESS_LABELS[id] }));

export const ENVIRONMENT_LABELS = {
  normal: "Normal",
  "increased-hazard": "Increased hazard of electric shock",
} as const;

// An invented 160 A inverter stick welder: 62 V DC open circuit, 60 % duty at 160 A, 20–160 A.
export const WELDING_DEFAULTS: WeldingValues = {
  process: "mma",
  ocvKind: "dc",
  environment: "normal",
  openCircuitV: "62",
  ratedA: "160",
  ratedDutyPct: "60",
  targetDutyPct: "100",
  minCurrentA: "20",
  maxCurrentA: "160",
};

const minCurrentSchema = quantity("Lowest output current", CALC_LIMITS.weldingCurrentA);

export interface WeldingFigures extends WeldingOutputResult {
  minCurrentA: number;
  maxCurrentA: number;
  minLoadV: number;
  maxLoadV: number;
  /** the load line over the output range, for the plot */
  outputRange: LoadPoint[];
  /** the duty-cycle current is more than the source can deliver */
  dutyAboveOutput: boolean;
  limitLabel: string;
}

const RANGE_POINTS = 21;

export function evaluateWeldingOutput(values: WeldingValues): Outcome<WeldingFigures, WeldingField> {
  const maxCurrentA = readSi(values.maxCurrentA, WELDING_SPECS.maxCurrentA);
  const body = {
    process: values.process,
    ocvKind: values.ocvKind,
    environment: values.environment,
    openCircuitV: readSi(values.openCircuitV, WELDING_SPECS.openCircuitV),
    ratedA: readSi(values.ratedA, WELDING_SPECS.ratedA),
    ratedDutyPct: readSi(values.ratedDutyPct, WELDING_SPECS.ratedDutyPct),
    targetDutyPct: readSi(values.targetDutyPct, WELDING_SPECS.targetDutyPct) ?? Number.NaN,
    // Required here: the output range is part of the question, not an optional plot limit.
    maxCurrentA: maxCurrentA ?? Number.NaN,
    points: 41,
  };
  const parsed = weldingOutputCalcSchema.safeParse(body);
  const min = minCurrentSchema.safeParse(readSi(values.minCurrentA, WELDING_SPECS.minCurrentA) ?? Number.NaN);

  const schemaErrors = parsed.success
    ? {}
    : errorsFromZod<WeldingField>(parsed.error, { specs: WELDING_SPECS }).fieldErrors;
  const ownErrors: FieldErrors<WeldingField> = {};
  if (!min.success)
    ownErrors.minCurrentA = min.error.issues.map((issue) => issueMessage(issue, WELDING_SPECS.minCurrentA));
  else if (maxCurrentA !== undefined && min.data >= maxCurrentA) {
    ownErrors.minCurrentA = ["Lowest output current must be below the highest."];
  }
  const fieldErrors = mergeErrors(schemaErrors, ownErrors);
  if (!parsed.success || !min.success || countErrors(fieldErrors) > 0) {
    return { ok: false, fieldErrors, message: invalidMessage(countErrors(fieldErrors)) };
  }

  const input = parsed.data;
  const minA = min.data;
  const maxA = input.maxCurrentA ?? input.ratedA;
  return compute(
    () => {
      // The line runs to whichever is larger, so the rated current is always on it.
      const result = calculateWeldingOutput({ ...input, maxCurrentA: Math.max(maxA, input.ratedA) });
      const outputRange: LoadPoint[] = [];
      for (let k = 0; k < RANGE_POINTS; k++) {
        const currentA = minA + ((maxA - minA) * k) / (RANGE_POINTS - 1);
        outputRange.push({ currentA, volts: conventionalLoadVoltage(currentA, input.process) });
      }
      return {
        ...result,
        minCurrentA: minA,
        maxCurrentA: maxA,
        minLoadV: conventionalLoadVoltage(minA, input.process),
        maxLoadV: conventionalLoadVoltage(maxA, input.process),
        outputRange,
        dutyAboveOutput: result.dutyCycle.currentA > maxA,
        limitLabel: result.ocv.kind === "dc" ? "DC limit (peak)" : "AC limit (RMS)",
      };
    },
    { ratedA: "ratedA", ratedDutyPct: "ratedDutyPct", targetDutyPct: "targetDutyPct", currentA: "maxCurrentA" },
  );
}
