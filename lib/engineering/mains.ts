import { SAFE_VOLTAGE_V } from "./constants";
import {
  EngineeringInputError,
  finiteResult,
  requireNonNegative,
  requireObject,
  requirePositive,
  requireRange,
} from "./errors";
import { preferredValue } from "./preferred-values";

/** DC bus peak behind a bridge rectifier and bulk capacitor: √2·Vrms·(1 + tolerance), in V. */
export function busPeakVoltage(mainsVrms: number, tolerance = 0.1): number {
  const vrms = requirePositive("mainsVrms", mainsVrms);
  const tol = requireRange("tolerance", tolerance, 0, 1);
  return finiteResult("mainsVrms", Math.SQRT2 * vrms * (1 + tol));
}

/** ½·C·V², in J. */
export function capacitorEnergy(capacitanceF: number, volts: number): number {
  const c = requireNonNegative("capacitanceF", capacitanceF);
  const v = requireNonNegative("volts", volts);
  return finiteResult("capacitanceF", 0.5 * c * v * v);
}

/** C·V, in C. */
export function capacitorCharge(capacitanceF: number, volts: number): number {
  const c = requireNonNegative("capacitanceF", capacitanceF);
  const v = requireNonNegative("volts", volts);
  return finiteResult("capacitanceF", c * v);
}

export interface DischargeTimeInput {
  resistanceOhm: number;
  capacitanceF: number;
  fromV: number;
  /** the level counted as safe; 60 V DC by default */
  toV?: number;
}

/** Time for an RC discharge from fromV to toV: R·C·ln(fromV/toV), in s; 0 when already there. */
export function dischargeTime(input: DischargeTimeInput): number {
  const i = requireObject("input", input);
  const r = requirePositive("resistanceOhm", i.resistanceOhm);
  const c = requirePositive("capacitanceF", i.capacitanceF);
  const from = requireNonNegative("fromV", i.fromV);
  const to = requirePositive("toV", i.toV ?? SAFE_VOLTAGE_V);
  if (from <= to) return 0;
  return finiteResult("resistanceOhm", r * c * Math.log(from / to));
}

export interface SuggestBleederInput {
  capacitanceF: number;
  fromV: number;
  /** the time the bus must reach toV within, s */
  withinS: number;
  toV?: number;
}

export interface BleederSuggestion {
  ohms: number;
  /** dissipation at fromV, V²/R — the worst case, at switch-on */
  watts: number;
  /** the actual discharge time with this resistor */
  dischargeS: number;
}

/**
 * The largest E12 resistance that brings the bus to toV within withinS. The largest value
 * wastes the least power while still meeting the time.
 */
export function suggestBleeder(input: SuggestBleederInput): BleederSuggestion {
  const i = requireObject("input", input);
  const c = requirePositive("capacitanceF", i.capacitanceF);
  const from = requirePositive("fromV", i.fromV);
  const within = requirePositive("withinS", i.withinS);
  const to = requirePositive("toV", i.toV ?? SAFE_VOLTAGE_V);
  if (from <= to) {
    throw new EngineeringInputError(
      "fromV",
      `fromV (${from} V) is already at or below ${to} V, so no bleeder is needed to reach it.`,
    );
  }
  const maxOhms = finiteResult("withinS", within / (c * Math.log(from / to)));
  let ohms = preferredValue(maxOhms, { series: "E12", direction: "down" });
  let seconds = dischargeTime({ resistanceOhm: ohms, capacitanceF: c, fromV: from, toV: to });
  // preferredValue treats values within 1e-12 as equal; step down if that tipped us over.
  while (seconds > within) {
    ohms = preferredValue(ohms * (1 - 1e-9), { series: "E12", direction: "down" });
    seconds = dischargeTime({ resistanceOhm: ohms, capacitanceF: c, fromV: from, toV: to });
  }
  return { ohms, watts: finiteResult("fromV", (from * from) / ohms), dischargeS: seconds };
}

export interface DischargeCurveInput {
  resistanceOhm: number;
  capacitanceF: number;
  fromV: number;
  /** number of samples including both ends, 2–1000; 50 by default */
  points?: number;
  /** the safe level, used only to choose the default span */
  toV?: number;
  /** end of the plot; by default 1.5 × the time to toV, or 3 time constants if already below */
  untilS?: number;
}

export interface DischargePoint {
  timeS: number;
  volts: number;
}

/** V(t) = V0·e^(−t/RC), sampled evenly for a plot. */
export function dischargeCurve(input: DischargeCurveInput): DischargePoint[] {
  const i = requireObject("input", input);
  const r = requirePositive("resistanceOhm", i.resistanceOhm);
  const c = requirePositive("capacitanceF", i.capacitanceF);
  const from = requireNonNegative("fromV", i.fromV);
  const to = requirePositive("toV", i.toV ?? SAFE_VOLTAGE_V);
  const points = Math.round(requireRange("points", i.points ?? 50, 2, 1000));
  const tau = finiteResult("resistanceOhm", r * c);
  const toSafe = dischargeTime({ resistanceOhm: r, capacitanceF: c, fromV: from, toV: to });
  const until =
    i.untilS === undefined ? (toSafe > 0 ? 1.5 * toSafe : 3 * tau) : requirePositive("untilS", i.untilS);
  const out: DischargePoint[] = [];
  for (let k = 0; k < points; k++) {
    const t = (until * k) / (points - 1);
    out.push({ timeS: t, volts: from * Math.exp(-t / tau) });
  }
  return out;
}
