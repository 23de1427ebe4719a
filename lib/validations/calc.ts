/**
 * Request schemas of the public calculator endpoints (POST, JSON, SI units throughout).
 * Responses are the result types in lib/engineering/calculators/ (MainsResult, …); an
 * invalid body gets 422 { error: "invalid_input", message, fieldErrors: { "a.b": [..] } }.
 *
 * POST /api/calc/mains
 *   { mainsVrms, tolerance = 0.1, capacitanceF, bleederOhm?, safeV = 60,
 *     targetDischargeS = 60, points = 60 }
 *   → { busPeakV, energyJ, chargeC, safeV, aboveSafeVoltage, chargeAboveThreshold,
 *       timeConstantS | null, dischargeS | null, suggestedBleeder { ohms, watts, dischargeS } | null,
 *       curve { bleederOhm, source: "declared" | "suggested", points [{ timeS, volts }] } | null }
 * POST /api/calc/inductor
 *   { method: "al", alNh, turns, coreAreaM2, material, ratedCurrentA, points = 50 }
 *   | { method: "gap", turns, coreAreaM2, gapM, pathM, relativePermeability?, material,
 *       ratedCurrentA, points = 50 }   (relativePermeability defaults to the material's typical)
 *   → { method, inductanceH, peakFluxT, storedEnergyJ, material { id, label, saturationT, designMaxT },
 *       saturationCurrentA, designMaxCurrentA, marginToSaturation, marginToDesignMax,
 *       verdict: "within-design" | "above-design-max" | "saturates", curve [{ currentA, fluxT }] }
 * POST /api/calc/transformer
 *   { mode: "sine" | "square", primaryV, frequencyHz, peakFluxT, coreAreaM2, secondaryV? }
 *   | { mode: "forward", busVolts, onTimeS, fluxSwingT, coreAreaM2, secondaryV? }
 *   → { mode, waveformFactor | null, voltSecondsVs | null, primaryTurns, primaryTurnsRounded,
 *       fluxAtRoundedTurnsT, secondaryTurns | null, secondaryTurnsRounded | null, turnsRatio | null }
 * POST /api/calc/winding
 *   { material = "copper", lengthM, currentA, temperatureC = 20, frequencyHz?, strands = 1,
 *     awg? | areaM2? (exactly one; areaM2 is per strand) }
 *   → { material, temperatureC, resistivityOhmM, strandDiameterM, totalAreaM2, resistanceOhm,
 *       copperLossW, currentDensityAPerM2, currentDensityAPerMm2, skinDepthM | null,
 *       diameterToSkinDepth | null }
 * POST /api/calc/welding-output
 *   { process = "mma", openCircuitV, ocvKind = "dc", environment = "normal", ratedA,
 *     ratedDutyPct, targetDutyPct = 100, maxCurrentA?, points = 40 }
 *   → { process, ratedLoadV, loadLine [{ currentA, volts }], ocv { declaredV, kind, environment,
 *       basis, limitV, limitPeakV, limitRmsV | null, withinLimit, marginV },
 *       dutyCycle { ratedA, ratedDutyPct, targetDutyPct, currentA, continuousA } }
 */
import { z } from "zod";
import { CONDUCTOR_MATERIAL_IDS, CORE_MATERIAL_IDS } from "@/lib/engineering/materials";
import { WELDING_PROCESSES } from "@/lib/engineering/welding";

/** The validated ranges; property tests draw from these. */
export const CALC_LIMITS = {
  mainsVrms: { min: 1, max: 1000 }, // IEC 60038 low voltage reaches 1000 V AC
  tolerance: { min: 0, max: 0.5 },
  capacitanceF: { min: 1e-9, max: 1 },
  bleederOhm: { min: 1, max: 1e9 },
  safeV: { min: 1, max: 120 },
  targetDischargeS: { min: 0.1, max: 86_400 },
  points: { min: 2, max: 500 },
  alNh: { min: 0.1, max: 1e6 },
  turns: { min: 1, max: 10_000 },
  coreAreaM2: { min: 1e-8, max: 0.1 },
  gapM: { min: 0, max: 0.1 },
  pathM: { min: 1e-4, max: 10 },
  relativePermeability: { min: 1, max: 1e6 },
  currentA: { min: 1e-6, max: 1e4 },
  volts: { min: 1e-3, max: 1e5 },
  frequencyHz: { min: 1, max: 1e8 },
  fluxT: { min: 1e-3, max: 3 },
  onTimeS: { min: 1e-9, max: 1 },
  lengthM: { min: 1e-4, max: 1e5 },
  areaM2: { min: 1e-12, max: 1e-2 },
  temperatureC: { min: -50, max: 250 },
  strands: { min: 1, max: 10_000 },
  openCircuitV: { min: 0, max: 1000 },
  weldingCurrentA: { min: 1, max: 2000 },
  dutyPct: { min: 1, max: 100 },
} as const;

type Limit = { min: number; max: number };

export function quantity(label: string, limit: Limit, options: { exclusiveMin?: boolean; int?: boolean } = {}) {
  let schema = z.number({ error: `${label} must be a number.` });
  if (options.int) schema = schema.int({ error: `${label} must be a whole number.` });
  schema = options.exclusiveMin
    ? schema.gt(limit.min, { error: `${label} must be greater than ${limit.min}.` })
    : schema.gte(limit.min, { error: `${label} must be at least ${limit.min}.` });
  return schema.lte(limit.max, { error: `${label} must be at most ${limit.max}.` });
}

const L = CALC_LIMITS;
const points = (fallback: number) => quantity("points", L.points, { int: true }).default(fallback);

export const mainsCalcSchema = z.object({
  mainsVrms: quantity("Mains voltage", L.mainsVrms),
  tolerance: quantity("Tolerance", L.tolerance).default(0.1),
  capacitanceF: quantity("Bus capacitance", L.capacitanceF),
  bleederOhm: quantity("Bleeder resistance", L.bleederOhm).optional(),
  safeV: quantity("Safe voltage", L.safeV).default(60),
  targetDischargeS: quantity("Target discharge time", L.targetDischargeS).default(60),
  points: points(60),
});
export type MainsCalcInput = z.output<typeof mainsCalcSchema>;

const coreMaterial = z.enum(CORE_MATERIAL_IDS, { error: `material must be one of: ${CORE_MATERIAL_IDS.join(", ")}.` });
const inductorCommon = {
  turns: quantity("Turns", L.turns, { int: true }),
  coreAreaM2: quantity("Core area", L.coreAreaM2),
  material: coreMaterial,
  ratedCurrentA: quantity("Rated current", L.currentA),
  points: points(50),
};

export const inductorCalcSchema = z.discriminatedUnion("method", [
  z.object({ method: z.literal("al"), alNh: quantity("AL", L.alNh), ...inductorCommon }),
  z.object({
    method: z.literal("gap"),
    gapM: quantity("Air gap", L.gapM),
    pathM: quantity("Magnetic path length", L.pathM),
    relativePermeability: quantity("Relative permeability", L.relativePermeability).optional(),
    ...inductorCommon,
  }),
], { error: 'method must be "al" or "gap".' });
export type InductorCalcInput = z.output<typeof inductorCalcSchema>;

const secondaryV = quantity("Secondary voltage", L.volts).optional();
export const transformerCalcSchema = z.discriminatedUnion("mode", [
  z.object({
    mode: z.enum(["sine", "square"]),
    primaryV: quantity("Primary voltage", L.volts),
    frequencyHz: quantity("Frequency", L.frequencyHz),
    peakFluxT: quantity("Peak flux density", L.fluxT),
    coreAreaM2: quantity("Core area", L.coreAreaM2),
    secondaryV,
  }),
  z.object({
    mode: z.literal("forward"),
    busVolts: quantity("Bus voltage", L.volts),
    onTimeS: quantity("On-time", L.onTimeS),
    fluxSwingT: quantity("Flux swing", L.fluxT),
    coreAreaM2: quantity("Core area", L.coreAreaM2),
    secondaryV,
  }),
], { error: 'mode must be "sine", "square" or "forward".' });
export type TransformerCalcInput = z.output<typeof transformerCalcSchema>;

export const AWG_AUGHT_SIZES = ["0000", "000", "00", "0", "4/0", "3/0", "2/0", "1/0"] as const;
export const awgGaugeSchema = z.union(
  [z.number().int().gte(-3).lte(40), z.enum(AWG_AUGHT_SIZES)],
  { error: "awg must be a whole gauge from -3 to 40, or one of 0000, 000, 00, 0, 4/0, 3/0, 2/0, 1/0." },
);

export const windingCalcSchema = z
  .object({
    material: z.enum(CONDUCTOR_MATERIAL_IDS, { error: "material must be copper or aluminium." }).default("copper"),
    lengthM: quantity("Wire length", L.lengthM),
    currentA: quantity("Current", { min: 0, max: L.currentA.max }),
    temperatureC: quantity("Temperature", L.temperatureC).default(20),
    frequencyHz: quantity("Frequency", L.frequencyHz).optional(),
    strands: quantity("Strands", L.strands, { int: true }).default(1),
    awg: awgGaugeSchema.optional(),
    areaM2: quantity("Conductor area", L.areaM2).optional(),
  })
  .refine((v) => (v.awg === undefined) !== (v.areaM2 === undefined), {
    path: ["areaM2"],
    error: "Give either an AWG size or a conductor area (one of them, not both).",
  });
export type WindingCalcInput = z.output<typeof windingCalcSchema>;

export const weldingOutputCalcSchema = z
  .object({
    process: z.enum(WELDING_PROCESSES, { error: "process must be mma, tig or mig." }).default("mma"),
    openCircuitV: quantity("Open-circuit voltage", L.openCircuitV),
    ocvKind: z.enum(["dc", "ac"], { error: "ocvKind must be dc or ac." }).default("dc"),
    environment: z.enum(["normal", "increased-hazard"], { error: "environment must be normal or increased-hazard." }).default("normal"),
    ratedA: quantity("Rated current", L.weldingCurrentA),
    ratedDutyPct: quantity("Rated duty cycle", L.dutyPct),
    targetDutyPct: quantity("Target duty cycle", L.dutyPct).default(100),
    maxCurrentA: quantity("Largest current on the plot", L.weldingCurrentA).optional(),
    points: points(40),
  });
export type WeldingOutputCalcInput = z.output<typeof weldingOutputCalcSchema>;
