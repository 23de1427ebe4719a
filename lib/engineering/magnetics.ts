import { MU_0 } from "./constants";
import {
  finiteResult,
  requireNonNegative,
  requireObject,
  requirePositive,
  requireRange,
} from "./errors";

export interface InductanceFromAlInput {
  /** inductance factor in nH per turn² */
  alNh: number;
  turns: number;
}

/** L = AL·N², in H. */
export function inductanceFromAl(input: InductanceFromAlInput): number {
  const i = requireObject("input", input);
  const al = requirePositive("alNh", i.alNh);
  const n = requirePositive("turns", i.turns);
  return finiteResult("turns", al * 1e-9 * n * n);
}

export interface TurnsForInductanceInput {
  alNh: number;
  inductanceH: number;
}

/** The whole number of turns that reaches at least inductanceH: ⌈√(L/AL)⌉. */
export function turnsForInductance(input: TurnsForInductanceInput): number {
  const i = requireObject("input", input);
  const al = requirePositive("alNh", i.alNh);
  const l = requirePositive("inductanceH", i.inductanceH);
  const exact = finiteResult("inductanceH", Math.sqrt(l / (al * 1e-9)));
  const whole = Math.round(exact);
  // √(100 µH / 250 nH) is 20 on paper but may come out a hair above; that is 20 turns, not 21.
  if (Math.abs(exact - whole) <= 1e-9 * Math.max(1, exact)) return Math.max(1, whole);
  return Math.max(1, Math.ceil(exact));
}

export interface GappedInductanceInput {
  turns: number;
  /** effective core cross-section Ae, m² */
  coreAreaM2: number;
  /** total air gap lg, m (0 for an ungapped core) */
  gapM: number;
  /** effective magnetic path length le, m */
  pathM: number;
  relativePermeability: number;
}

/** L = μ0·N²·Ae / (lg + le/μr), in H: the gap and the core reluctance in series. */
export function gappedInductance(input: GappedInductanceInput): number {
  const i = requireObject("input", input);
  const n = requirePositive("turns", i.turns);
  const ae = requirePositive("coreAreaM2", i.coreAreaM2);
  const lg = requireNonNegative("gapM", i.gapM);
  const le = requirePositive("pathM", i.pathM);
  const mur = requireRange("relativePermeability", i.relativePermeability, 1, 1e7);
  return finiteResult("turns", (MU_0 * n * n * ae) / (lg + le / mur));
}

export interface PeakFluxDensityInput {
  inductanceH: number;
  peakCurrentA: number;
  turns: number;
  coreAreaM2: number;
}

/** B = L·I / (N·Ae), in T (from N·Φ = L·I). */
export function peakFluxDensity(input: PeakFluxDensityInput): number {
  const i = requireObject("input", input);
  const l = requirePositive("inductanceH", i.inductanceH);
  const current = requireNonNegative("peakCurrentA", i.peakCurrentA);
  const n = requirePositive("turns", i.turns);
  const ae = requirePositive("coreAreaM2", i.coreAreaM2);
  return finiteResult("peakCurrentA", (l * current) / (n * ae));
}

export interface StoredEnergyInput {
  inductanceH: number;
  currentA: number;
}

/** ½·L·I², in J. */
export function storedEnergy(input: StoredEnergyInput): number {
  const i = requireObject("input", input);
  const l = requireNonNegative("inductanceH", i.inductanceH);
  const current = requireNonNegative("currentA", i.currentA);
  return finiteResult("currentA", 0.5 * l * current * current);
}

export interface SaturationCurrentInput {
  inductanceH: number;
  turns: number;
  coreAreaM2: number;
  saturationT: number;
}

/** The current at which B reaches saturationT: I = B·N·Ae / L, in A. */
export function saturationCurrent(input: SaturationCurrentInput): number {
  const i = requireObject("input", input);
  const l = requirePositive("inductanceH", i.inductanceH);
  const n = requirePositive("turns", i.turns);
  const ae = requirePositive("coreAreaM2", i.coreAreaM2);
  const b = requirePositive("saturationT", i.saturationT);
  return finiteResult("saturationT", (b * n * ae) / l);
}

export interface FluxCurveInput {
  inductanceH: number;
  turns: number;
  coreAreaM2: number;
  /** the last current on the plot, A — typically the saturation current */
  toCurrentA: number;
  points?: number;
}

export interface FluxPoint {
  currentA: number;
  fluxT: number;
}

/**
 * B against I for a plot. The model is linear (constant L), which is what the figure of a
 * gapped choke is designed on; the plot marks saturation with a separate line.
 */
export function fluxCurve(input: FluxCurveInput): FluxPoint[] {
  const i = requireObject("input", input);
  const l = requirePositive("inductanceH", i.inductanceH);
  const n = requirePositive("turns", i.turns);
  const ae = requirePositive("coreAreaM2", i.coreAreaM2);
  const top = requirePositive("toCurrentA", i.toCurrentA);
  const points = Math.round(requireRange("points", i.points ?? 50, 2, 1000));
  const out: FluxPoint[] = [];
  for (let k = 0; k < points; k++) {
    const current = (top * k) / (points - 1);
    out.push({ currentA: current, fluxT: finiteResult("toCurrentA", (l * current) / (n * ae)) });
  }
  return out;
}
