import { calculateInductor, type InductorResult } from "@/lib/engineering/calculators";
import {
  CORE_MATERIAL_IDS,
  CORE_MATERIALS,
  inductanceFromAl,
  peakFluxDensity,
  turnsForInductance,
  type CoreMaterialId,
} from "@/lib/engineering";
import { inductorCalcSchema, quantity } from "@/lib/validations/calc";
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
import type { ResultStatus } from "./result-list";

export const INDUCTOR_FIELDS = [
  "alNh",
  "turns",
  "coreAreaM2",
  "gapM",
  "pathM",
  "relativePermeability",
  "ratedCurrentA",
  "targetInductanceH",
] as const;
export type InductorField = (typeof INDUCTOR_FIELDS)[number];
export type InductorMethod = "al" | "gap";
export type InductorValues = Record<InductorField | "method" | "material", string>;

export const INDUCTOR_SPECS: Record<InductorField, NumberSpec> = {
  alNh: { label: "AL", unit: "nH/N²", toSi: 1 },
  turns: { label: "Turns", unit: "", toSi: 1 },
  coreAreaM2: { label: "Core area Ae", unit: "mm²", toSi: 1e-6 },
  gapM: { label: "Air gap", unit: "mm", toSi: 1e-3 },
  pathM: { label: "Magnetic path length", unit: "mm", toSi: 1e-3 },
  relativePermeability: { label: "Relative permeability", unit: "", toSi: 1 },
  ratedCurrentA: { label: "Rated peak current", unit: "A", toSi: 1 },
  targetInductanceH: { label: "Target inductance", unit: "µH", toSi: 1e-6 },
};

export const CORE_MATERIAL_OPTIONS = CORE_MATERIAL_IDS.map((id) => ({ value: id, label: CORE_MATERIALS[id].label }));

// An invented welder output choke: a gapped Mn-Zn ferrite E-core of 240 mm², 24 turns.
export const INDUCTOR_DEFAULTS: InductorValues = {
  method: "al",
  material: "mnzn-ferrite",
  alNh: "160",
  turns: "24",
  coreAreaM2: "240",
  gapM: "2",
  pathM: "100",
  relativePermeability: "",
  ratedCurrentA: "15",
  targetInductanceH: "100",
};

// The workbench's own range for the target; the API has no such field.
const targetSchema = quantity("Target inductance", { min: 1e-9, max: 10 }).optional();

/** Below this margin to the design maximum the figure is shown as a caution. */
export const FLUX_MARGIN_CAUTION = 0.1;

export interface TargetTurns {
  inductanceH: number;
  turns: number;
  /** inductance with those whole turns */
  reachedH: number;
  peakFluxT: number;
  marginToDesignMax: number;
}

export interface InductorFigures extends InductorResult {
  ratedCurrentA: number;
  turns: number;
  /** L/N² of this core and gap, nH per turn² */
  effectiveAlNh: number;
  target: TargetTurns | null;
}

export function isInductorMethod(value: string): value is InductorMethod {
  return value === "al" || value === "gap";
}

export function evaluateInductor(values: InductorValues): Outcome<InductorFigures, InductorField> {
  const common = {
    turns: readSi(values.turns, INDUCTOR_SPECS.turns),
    coreAreaM2: readSi(values.coreAreaM2, INDUCTOR_SPECS.coreAreaM2),
    material: values.material,
    ratedCurrentA: readSi(values.ratedCurrentA, INDUCTOR_SPECS.ratedCurrentA),
    points: 60,
  };
  const body =
    values.method === "gap"
      ? {
          method: "gap",
          ...common,
          gapM: readSi(values.gapM, INDUCTOR_SPECS.gapM),
          pathM: readSi(values.pathM, INDUCTOR_SPECS.pathM),
          relativePermeability: readSi(values.relativePermeability, INDUCTOR_SPECS.relativePermeability),
        }
      : { method: "al", ...common, alNh: readSi(values.alNh, INDUCTOR_SPECS.alNh) };

  const parsed = inductorCalcSchema.safeParse(body);
  const target = targetSchema.safeParse(readSi(values.targetInductanceH, INDUCTOR_SPECS.targetInductanceH));
  const schemaErrors = parsed.success
    ? {}
    : errorsFromZod<InductorField>(parsed.error, { specs: INDUCTOR_SPECS }).fieldErrors;
  const targetErrors: FieldErrors<InductorField> = target.success
    ? {}
    : { targetInductanceH: target.error.issues.map((issue) => issueMessage(issue, INDUCTOR_SPECS.targetInductanceH)) };
  const fieldErrors = mergeErrors(schemaErrors, targetErrors);
  if (!parsed.success || !target.success) {
    return { ok: false, fieldErrors, message: invalidMessage(countErrors(fieldErrors)) };
  }

  const input = parsed.data;
  const targetH = target.data;
  return compute(
    () => {
      const result = calculateInductor(input);
      const effectiveAlNh = (result.inductanceH / (input.turns * input.turns)) * 1e9;
      return {
        ...result,
        ratedCurrentA: input.ratedCurrentA,
        turns: input.turns,
        effectiveAlNh,
        target:
          targetH === undefined
            ? null
            : turnsFor(targetH, effectiveAlNh, input.ratedCurrentA, input.coreAreaM2, result.material.designMaxT),
      };
    },
    {
      alNh: "alNh",
      turns: "turns",
      coreAreaM2: "coreAreaM2",
      gapM: "gapM",
      pathM: "pathM",
      inductanceH: "targetInductanceH",
    },
  );
}

// Turns for the target on the same core and gap: L grows with N², so AL = L/N² carries over.
function turnsFor(
  targetH: number,
  alNh: number,
  currentA: number,
  coreAreaM2: number,
  designMaxT: number,
): TargetTurns {
  const turns = turnsForInductance({ alNh, inductanceH: targetH });
  const reachedH = inductanceFromAl({ alNh, turns });
  const peakFluxT = peakFluxDensity({ inductanceH: reachedH, peakCurrentA: currentA, turns, coreAreaM2 });
  return { inductanceH: targetH, turns, reachedH, peakFluxT, marginToDesignMax: 1 - peakFluxT / designMaxT };
}

/** The word and tone of a peak flux density against the core's design maximum and saturation. */
export function fluxStatus(
  peakFluxT: number,
  material: { designMaxT: number; saturationT: { min: number } },
): ResultStatus {
  if (peakFluxT > material.saturationT.min) return { word: "Saturates", tone: "stop" };
  if (peakFluxT > material.designMaxT) return { word: "Above design maximum", tone: "caution" };
  if (1 - peakFluxT / material.designMaxT < FLUX_MARGIN_CAUTION) return { word: "Under 10 % margin", tone: "caution" };
  return { word: "Within design maximum", tone: "clear" };
}

export function coreMaterial(id: string): (typeof CORE_MATERIALS)[CoreMaterialId] | undefined {
  return (CORE_MATERIALS as Record<string, (typeof CORE_MATERIALS)[CoreMaterialId] | undefined>)[id];
}
