import {
  finiteResult,
  requireNonNegative,
  requireObject,
  requireOneOf,
  requirePositive,
  requireRange,
} from "./errors";

export const WELDING_PROCESSES = ["mma", "tig", "mig"] as const;
export type WeldingProcess = (typeof WELDING_PROCESSES)[number];

interface LoadLine {
  interceptV: number;
  slopeVPerA: number;
  /** above this current the line is flat at capV */
  kneeA: number;
  capV: number;
}

// IEC 60974-1 conventional load voltage U2 against conventional welding current I2 (from memory).
const LOAD_LINES: Record<WeldingProcess, LoadLine> = {
  mma: { interceptV: 20, slopeVPerA: 0.04, kneeA: 600, capV: 44 }, // U2 = 20 + 0.04·I2, 44 V above 600 A
  tig: { interceptV: 10, slopeVPerA: 0.04, kneeA: 600, capV: 34 }, // U2 = 10 + 0.04·I2, 34 V above 600 A
  mig: { interceptV: 14, slopeVPerA: 0.05, kneeA: 600, capV: 44 }, // MIG/MAG: U2 = 14 + 0.05·I2, 44 V above 600 A
};

/** The arc-welding standard's conventional load voltage at a welding current, in V. */
export function conventionalLoadVoltage(currentA: number, process: WeldingProcess = "mma"): number {
  const current = requireNonNegative("currentA", currentA);
  const line = LOAD_LINES[requireOneOf("process", process, WELDING_PROCESSES)];
  if (current > line.kneeA) return line.capV;
  return finiteResult("currentA", line.interceptV + line.slopeVPerA * current);
}

export interface DutyCycleInput {
  ratedA: number;
  /** the duty cycle the rating is given at, % of the standard's 10-minute cycle */
  ratedDutyPct: number;
  targetDutyPct: number;
}

/**
 * Equal heating: I²·X is constant, so I_target = I_rated·√(X_rated / X_target).
 *
 * Interpretation of "never above the rated current's own thermal basis at 100 %": both duty
 * cycles must lie in (0, 100] — a duty cycle above 100 % does not exist, so it is rejected
 * instead of extrapolated. The thermal basis is the continuous current I100 = I·√(X/100); the
 * result always equals I100·√(100/X_target), so a shorter duty cycle may give more than the
 * rated current (that is the point of the conversion), a longer one less, and 100 % gives I100.
 * The conversion says nothing about the source's maximum output current, which bounds any
 * result in practice.
 */
export function currentAtDutyCycle(input: DutyCycleInput): number {
  const i = requireObject("input", input);
  const rated = requirePositive("ratedA", i.ratedA);
  const ratedDuty = requirePositive("ratedDutyPct", i.ratedDutyPct);
  const targetDuty = requirePositive("targetDutyPct", i.targetDutyPct);
  requireRange("ratedDutyPct", ratedDuty, 0, 100);
  requireRange("targetDutyPct", targetDuty, 0, 100);
  return finiteResult("ratedA", rated * Math.sqrt(ratedDuty / targetDuty));
}

export type OutputKind = "dc" | "ac";
export type WeldingEnvironment = "normal" | "increased-hazard";

export interface NoLoadVoltageLimit {
  peakV: number;
  rmsV?: number;
}

// IEC 60974-1 rated no-load voltage limits (from memory). An AC source must meet both figures.
const NO_LOAD_LIMITS: Record<WeldingEnvironment, Record<OutputKind, NoLoadVoltageLimit>> = {
  normal: { dc: { peakV: 113 }, ac: { peakV: 113, rmsV: 80 } },
  "increased-hazard": { dc: { peakV: 113 }, ac: { peakV: 68, rmsV: 48 } },
};

export interface NoLoadVoltageLimitInput {
  kind: OutputKind;
  environment: WeldingEnvironment;
}

/** The highest open-circuit voltage the arc-welding standard allows for the environment. */
export function noLoadVoltageLimit(input: NoLoadVoltageLimitInput): NoLoadVoltageLimit {
  const i = requireObject("input", input);
  const kind = requireOneOf("kind", i.kind, ["dc", "ac"] as const);
  const environment = requireOneOf("environment", i.environment, ["normal", "increased-hazard"] as const);
  return { ...NO_LOAD_LIMITS[environment][kind] };
}
