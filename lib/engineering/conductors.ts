import { MU_0 } from "./constants";
import {
  EngineeringInputError,
  finiteResult,
  requireNonNegative,
  requireObject,
  requireOneOf,
  requirePositive,
  requireRange,
} from "./errors";
import { CONDUCTOR_MATERIAL_IDS, CONDUCTOR_MATERIALS, type ConductorMaterialId } from "./materials";

// The linear α model is only meant for the range windings and cables see; outside it the
// answer would be fiction (and far enough below −234 °C, negative).
const MIN_TEMPERATURE_C = -200;
const MAX_TEMPERATURE_C = 500;

/** ρ(T) = ρ20·(1 + α·(T − 20)), in Ω·m. */
export function conductorResistivity(material: ConductorMaterialId, temperatureC = 20): number {
  const id = requireOneOf("material", material, CONDUCTOR_MATERIAL_IDS);
  const t = requireRange("temperatureC", temperatureC, MIN_TEMPERATURE_C, MAX_TEMPERATURE_C);
  const m = CONDUCTOR_MATERIALS[id];
  return m.resistivity20OhmM * (1 + m.temperatureCoefficientPerK * (t - 20));
}

export interface SkinDepthInput {
  frequencyHz: number;
  material?: ConductorMaterialId;
  temperatureC?: number;
}

/** δ = √(ρ / (π·f·μ0·μr)), in m. */
export function skinDepth(input: SkinDepthInput): number {
  const i = requireObject("input", input);
  const f = requirePositive("frequencyHz", i.frequencyHz);
  const id = requireOneOf("material", i.material ?? "copper", CONDUCTOR_MATERIAL_IDS);
  const rho = conductorResistivity(id, (i.temperatureC as number | undefined) ?? 20);
  const mur = CONDUCTOR_MATERIALS[id].relativePermeability;
  return finiteResult("frequencyHz", Math.sqrt(rho / (Math.PI * f * MU_0 * mur)));
}

export interface ConductorResistanceInput {
  material: ConductorMaterialId;
  lengthM: number;
  areaM2: number;
  temperatureC?: number;
}

/** DC resistance R = ρ(T)·l/A, in Ω. */
export function conductorResistance(input: ConductorResistanceInput): number {
  const i = requireObject("input", input);
  const id = requireOneOf("material", i.material, CONDUCTOR_MATERIAL_IDS);
  const length = requireNonNegative("lengthM", i.lengthM);
  const area = requirePositive("areaM2", i.areaM2);
  const rho = conductorResistivity(id, (i.temperatureC as number | undefined) ?? 20);
  return finiteResult("lengthM", (rho * length) / area);
}

/** AWG sizes above 0 are written with zeros: 00 is gauge −1, 0000 (4/0) is gauge −3. */
const AUGHT_GAUGES: Record<string, number> = {
  "0": 0,
  "00": -1,
  "000": -2,
  "0000": -3,
  "1/0": 0,
  "2/0": -1,
  "3/0": -2,
  "4/0": -3,
};

export type AwgGauge = number | string;

export function awgNumber(gauge: AwgGauge): number {
  let n: number | undefined;
  if (typeof gauge === "number") n = gauge;
  else if (typeof gauge === "string") {
    const text = gauge.trim();
    n = AUGHT_GAUGES[text] ?? (/^[1-9]\d?$/.test(text) ? Number(text) : undefined);
  }
  if (n === undefined || !Number.isInteger(n) || n < -3 || n > 40) {
    throw new EngineeringInputError(
      "gauge",
      "gauge must be a whole AWG size from 0000 (or 4/0, or −3) to 40.",
    );
  }
  return n;
}

/** Bare-wire diameter from ASTM B258: d = 0.127 mm · 92^((36 − n)/39), in m. */
export function awgDiameter(gauge: AwgGauge): number {
  const n = awgNumber(gauge);
  return 0.127e-3 * 92 ** ((36 - n) / 39);
}

export interface CurrentDensityInput {
  currentA: number;
  areaM2: number;
}

/**
 * J = I/A in A/m² (SI like everything here). Divide by 1e6 for the A/mm² figure winding
 * practice quotes — commonly 3–5 A/mm² for transformers, more for short-duty welder windings.
 */
export function currentDensity(input: CurrentDensityInput): number {
  const i = requireObject("input", input);
  const current = requireNonNegative("currentA", i.currentA);
  const area = requirePositive("areaM2", i.areaM2);
  return finiteResult("currentA", current / area);
}
