/**
 * What a magnetic's own figures imply, computed with lib/engineering: shown to buyers on the
 * listing page and to the seller beside the form, and stored (inductance, rated current) so kits'
 * requirements can be matched. Pure; every figure SI.
 */
import {
  CONDUCTOR_MATERIALS,
  CORE_MATERIALS,
  conductorResistance,
  currentDensity,
  gappedInductance,
  inductanceFromAl,
  peakFluxDensity,
  skinDepth,
  WAVEFORM_FACTORS,
  type ConductorMaterialId,
  type CoreMaterialId,
} from "@/lib/engineering";
import type { MagneticSubtype } from "@/db/schema/listings";
import type { MagneticFigures, Winding } from "@/lib/validations/listings";

export type FluxVerdict = "within-design" | "above-design-max" | "saturates";

export interface WindingFigures {
  name: string;
  role: Winding["role"];
  turns: number;
  material: ConductorMaterialId;
  /** DC resistance at 20 °C; null without a mean turn length */
  resistanceOhm: number | null;
  /** I²·R with the DC resistance; null without a resistance */
  copperLossW: number | null;
  currentDensityAPerM2: number;
  /** diameter of one strand, m */
  strandDiameterM: number;
  skinDepthM: number;
  /** strand radius over skin depth; above 1 the AC resistance climbs well above the DC figure */
  radiusToSkinDepth: number;
}

export interface MagneticDerived {
  /** which winding the inductance belongs to (the primary, the secondary of a CT, or the only one) */
  inductanceWinding: string;
  inductanceH: number;
  inductanceBasis: "al" | "gap";
  /** null for current transformers, whose flux depends on the burden rather than on these figures */
  peakFluxT: number | null;
  fluxBasis: "rated-current" | "primary-volt-seconds" | null;
  material: { id: CoreMaterialId; label: string; saturationMinT: number; designMaxT: number };
  /** 1 − B/Bsat(min); negative when past saturation */
  marginToSaturation: number | null;
  /** 1 − B/Bdesign */
  marginToDesignMax: number | null;
  verdict: FluxVerdict | null;
  windings: WindingFigures[];
  /** the sum over windings that have a resistance; null when none has */
  totalCopperLossW: number | null;
  /** transformers: primary turns over each secondary's; current transformers: secondary over primary */
  turnsRatios: { secondary: string; ratio: number }[];
}

/** The winding whose inductance matters: a transformer's primary, a CT's secondary, otherwise the first. */
export function inductanceWinding(subtype: MagneticSubtype, windings: readonly Winding[]): Winding | undefined {
  if (subtype === "transformer") return windings.find((w) => w.role === "primary") ?? windings[0];
  if (subtype === "current-transformer") return windings.find((w) => w.role === "secondary") ?? windings.at(-1);
  return windings[0];
}

function windingFigures(w: Winding, meanTurnLengthM: number | undefined, frequencyHz: number): WindingFigures {
  const resistanceOhm =
    meanTurnLengthM === undefined
      ? null
      : conductorResistance({ material: w.material, lengthM: w.turns * meanTurnLengthM, areaM2: w.areaM2 });
  const strandAreaM2 = w.areaM2 / w.strands;
  const strandDiameterM = Math.sqrt((4 * strandAreaM2) / Math.PI);
  const delta = skinDepth({ frequencyHz, material: w.material });
  return {
    name: w.name,
    role: w.role,
    turns: w.turns,
    material: w.material,
    resistanceOhm,
    copperLossW: resistanceOhm === null ? null : w.currentA ** 2 * resistanceOhm,
    currentDensityAPerM2: currentDensity({ currentA: w.currentA, areaM2: w.areaM2 }),
    strandDiameterM,
    skinDepthM: delta,
    radiusToSkinDepth: strandDiameterM / 2 / delta,
  };
}

function turnsRatios(subtype: MagneticSubtype, windings: readonly Winding[]): MagneticDerived["turnsRatios"] {
  const primary = windings.find((w) => w.role === "primary");
  if (!primary) return [];
  const secondaries = windings.filter((w) => w.role === "secondary");
  if (subtype === "transformer") return secondaries.map((s) => ({ secondary: s.name, ratio: primary.turns / s.turns }));
  if (subtype === "current-transformer") return secondaries.map((s) => ({ secondary: s.name, ratio: s.turns / primary.turns }));
  return [];
}

export function deriveMagnetic(subtype: MagneticSubtype, f: MagneticFigures): MagneticDerived {
  const material = CORE_MATERIALS[f.coreMaterial];
  const main = inductanceWinding(subtype, f.windings);
  if (!main) throw new Error("a magnetic needs at least one winding");
  const inductanceBasis = f.alNh !== undefined ? "al" : "gap";
  const inductanceH =
    f.alNh !== undefined
      ? inductanceFromAl({ alNh: f.alNh, turns: main.turns })
      : gappedInductance({
          turns: main.turns,
          coreAreaM2: f.coreAreaM2,
          gapM: f.gapM,
          pathM: f.pathLengthM,
          relativePermeability: material.typicalRelativePermeability,
        });

  // A choke's flux follows its current (N·Φ = L·I); a transformer's follows the volt-seconds on
  // its primary (B = V / (4·f·N·Ae) for a square wave); a CT's depends on its burden.
  let peakFluxT: number | null = null;
  let fluxBasis: MagneticDerived["fluxBasis"] = null;
  if (subtype === "choke") {
    peakFluxT = peakFluxDensity({ inductanceH, peakCurrentA: f.ratedCurrentA, turns: main.turns, coreAreaM2: f.coreAreaM2 });
    fluxBasis = "rated-current";
  } else if (subtype === "transformer" && f.primaryVoltageV !== undefined) {
    peakFluxT = f.primaryVoltageV / (WAVEFORM_FACTORS.square * f.switchingFrequencyHz * main.turns * f.coreAreaM2);
    fluxBasis = "primary-volt-seconds";
  }

  const windings = f.windings.map((w) => windingFigures(w, f.meanTurnLengthM, f.switchingFrequencyHz));
  const losses = windings.flatMap((w) => (w.copperLossW === null ? [] : [w.copperLossW]));
  return {
    inductanceWinding: main.name,
    inductanceH,
    inductanceBasis,
    peakFluxT,
    fluxBasis,
    material: { id: material.id, label: material.label, saturationMinT: material.saturationT.min, designMaxT: material.designMaxT },
    marginToSaturation: peakFluxT === null ? null : 1 - peakFluxT / material.saturationT.min,
    marginToDesignMax: peakFluxT === null ? null : 1 - peakFluxT / material.designMaxT,
    verdict:
      peakFluxT === null
        ? null
        : peakFluxT <= material.designMaxT
          ? "within-design"
          : peakFluxT <= material.saturationT.min
            ? "above-design-max"
            : "saturates",
    windings,
    totalCopperLossW: losses.length === 0 ? null : losses.reduce((a, b) => a + b, 0),
    turnsRatios: turnsRatios(subtype, f.windings),
  };
}

/** The conductor's label, for tables of windings. */
export function conductorLabel(id: ConductorMaterialId): string {
  return CONDUCTOR_MATERIALS[id].label;
}
