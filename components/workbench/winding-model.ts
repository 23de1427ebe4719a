import { calculateWinding, type WindingResult } from "@/lib/engineering/calculators";
import { CONDUCTOR_MATERIAL_IDS, CONDUCTOR_MATERIALS, awgDiameter, awgNumber } from "@/lib/engineering";
import { AWG_AUGHT_SIZES, windingCalcSchema } from "@/lib/validations/calc";
import {
  compute,
  countErrors,
  errorsFromZod,
  invalidMessage,
  readSi,
  type NumberSpec,
  type Outcome,
} from "./live-input";

export const WINDING_FIELDS = [
  "awg",
  "diameterMm",
  "areaMm2",
  "strands",
  "lengthM",
  "currentA",
  "temperatureC",
  "frequencyHz",
] as const;
export type WindingField = (typeof WINDING_FIELDS)[number];
export type WireSizeBy = "awg" | "diameter" | "area";
export type WindingValues = Record<WindingField | "material" | "sizeBy", string>;

const SHARED_SPECS = {
  lengthM: { label: "Wire length", unit: "m", toSi: 1 },
  currentA: { label: "Current", unit: "A", toSi: 1 },
  temperatureC: { label: "Winding temperature", unit: "°C", toSi: 1 },
  frequencyHz: { label: "Switching frequency", unit: "kHz", toSi: 1e3 },
  strands: { label: "Strands", unit: "", toSi: 1 },
} satisfies Record<string, NumberSpec>;

const AREA_SPEC: NumberSpec = {
  label: "Conductor area",
  unit: "mm²",
  toSi: 1e-6,
  invalidMessage: "Enter the area of one strand in mm².",
};
// Area limits of the schema come back as the diameter of a round wire of that area.
const DIAMETER_SPEC: NumberSpec = {
  label: "Strand diameter",
  unit: "mm",
  toSi: 1e-3,
  fromSi: (areaM2) => Math.sqrt((4 * areaM2) / Math.PI) * 1e3,
  invalidMessage: "Enter the bare diameter of one strand in mm.",
};
const AWG_SPEC: NumberSpec = {
  label: "AWG size",
  unit: "",
  toSi: 1,
  invalidMessage: "Enter an AWG size from 0000 (4/0) to 40, for example 18.",
};

export const MATERIAL_OPTIONS = CONDUCTOR_MATERIAL_IDS.map((id) => ({
  value: id,
  label: CONDUCTOR_MATERIALS[id].label,
}));

// An invented welder primary: 20 strands of 0.5 mm enamelled copper, 3 m long, 12 A RMS,
// running hot at 100 °C and switched at 40 kHz.
export const WINDING_DEFAULTS: WindingValues = {
  material: "copper",
  sizeBy: "diameter",
  awg: "24",
  diameterMm: "0.5",
  areaMm2: "0.2",
  strands: "20",
  lengthM: "3",
  currentA: "12",
  temperatureC: "100",
  frequencyHz: "40",
};

/** Above this the figure is a caution: 3–5 A/mm² is usual for continuous duty (common practice). */
export const CURRENT_DENSITY_CAUTION_A_PER_MM2 = 5;

export interface AwgSize {
  gauge: number;
  label: string;
  diameterM: number;
}

export interface WindingFigures extends WindingResult {
  sizeBy: WireSizeBy;
  strands: number;
  currentA: number;
  /** the gauge entered, or the nearest one to the diameter or area entered */
  awg: AwgSize;
  awgIsNearest: boolean;
  /** strand radius over skin depth; above 1 the copper in the middle carries little AC current */
  radiusToSkinDepth: number | null;
}

export function awgLabel(gauge: number): string {
  return gauge >= 1 ? String(gauge) : `${"0".repeat(1 - gauge)} (${1 - gauge}/0)`;
}

/** The AWG size (ASTM B258) whose diameter is nearest, on a ratio scale, to the given one. */
export function nearestAwg(diameterM: number): AwgSize {
  let best: AwgSize = { gauge: 40, label: "40", diameterM: awgDiameter(40) };
  for (let gauge = -3; gauge <= 40; gauge++) {
    const d = awgDiameter(gauge);
    if (Math.abs(Math.log(d / diameterM)) < Math.abs(Math.log(best.diameterM / diameterM))) {
      best = { gauge, label: awgLabel(gauge), diameterM: d };
    }
  }
  return best;
}

function readAwg(text: string): number | string | undefined {
  const trimmed = text.trim();
  if (trimmed === "") return undefined;
  if ((AWG_AUGHT_SIZES as readonly string[]).includes(trimmed)) return trimmed;
  if (/^-?\d+$/.test(trimmed)) return Number(trimmed);
  return trimmed;
}

export function isWireSizeBy(value: string): value is WireSizeBy {
  return value === "awg" || value === "diameter" || value === "area";
}

export function evaluateWinding(values: WindingValues): Outcome<WindingFigures, WindingField> {
  const sizeBy: WireSizeBy = isWireSizeBy(values.sizeBy) ? values.sizeBy : "awg";
  const diameterM = readSi(values.diameterMm, DIAMETER_SPEC);
  const areaM2 =
    sizeBy === "area"
      ? readSi(values.areaMm2, AREA_SPEC)
      : sizeBy === "diameter" && diameterM !== undefined
        ? (Math.PI * diameterM * diameterM) / 4
        : undefined;
  const body = {
    material: values.material,
    lengthM: readSi(values.lengthM, SHARED_SPECS.lengthM),
    currentA: readSi(values.currentA, SHARED_SPECS.currentA),
    temperatureC: readSi(values.temperatureC, SHARED_SPECS.temperatureC) ?? Number.NaN,
    frequencyHz: readSi(values.frequencyHz, SHARED_SPECS.frequencyHz),
    strands: readSi(values.strands, SHARED_SPECS.strands) ?? Number.NaN,
    awg: sizeBy === "awg" ? readAwg(values.awg) : undefined,
    areaM2,
  };
  const sizeField: WindingField = sizeBy === "awg" ? "awg" : sizeBy === "diameter" ? "diameterMm" : "areaMm2";
  const sizeSpec = sizeBy === "awg" ? AWG_SPEC : sizeBy === "diameter" ? DIAMETER_SPEC : AREA_SPEC;
  const parsed = windingCalcSchema.safeParse(body);
  if (!parsed.success) {
    const { fieldErrors } = errorsFromZod<WindingField>(parsed.error, {
      specs: { ...SHARED_SPECS, awg: AWG_SPEC, areaM2: sizeSpec },
      fieldOf: { areaM2: sizeField },
    });
    return { ok: false, fieldErrors, message: invalidMessage(countErrors(fieldErrors)) };
  }
  const input = parsed.data;
  return compute(
    () => {
      const result = calculateWinding(input);
      const awg =
        input.awg !== undefined
          ? { gauge: awgNumber(input.awg), label: awgLabel(awgNumber(input.awg)), diameterM: result.strandDiameterM }
          : nearestAwg(result.strandDiameterM);
      return {
        ...result,
        sizeBy,
        strands: input.strands,
        currentA: input.currentA,
        awg,
        awgIsNearest: input.awg === undefined,
        radiusToSkinDepth: result.diameterToSkinDepth === null ? null : result.diameterToSkinDepth / 2,
      };
    },
    { lengthM: "lengthM", areaM2: sizeField, frequencyHz: "frequencyHz", temperatureC: "temperatureC", gauge: "awg" },
  );
}
