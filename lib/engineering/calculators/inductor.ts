import type { InductorCalcInput } from "@/lib/validations/calc";
import {
  fluxCurve,
  gappedInductance,
  inductanceFromAl,
  peakFluxDensity,
  saturationCurrent,
  storedEnergy,
  type FluxPoint,
} from "../magnetics";
import { CORE_MATERIALS, type CoreMaterial } from "../materials";

export type InductorVerdict = "within-design" | "above-design-max" | "saturates";

export interface InductorResult {
  method: "al" | "gap";
  inductanceH: number;
  relativePermeability: number | null;
  peakFluxT: number;
  storedEnergyJ: number;
  material: Pick<CoreMaterial, "id" | "label" | "saturationT" | "designMaxT">;
  /** where B reaches the lower end of the material's saturation range */
  saturationCurrentA: number;
  designMaxCurrentA: number;
  /** 1 − B/Bsat(min); negative when past saturation */
  marginToSaturation: number;
  /** 1 − B/Bdesign */
  marginToDesignMax: number;
  verdict: InductorVerdict;
  /** B against I from 0 to the larger of the rated and the saturation current */
  curve: FluxPoint[];
}

export function calculateInductor(input: InductorCalcInput): InductorResult {
  const material = CORE_MATERIALS[input.material];
  const mur = input.method === "gap" ? (input.relativePermeability ?? material.typicalRelativePermeability) : null;
  const inductanceH =
    input.method === "al"
      ? inductanceFromAl({ alNh: input.alNh, turns: input.turns })
      : gappedInductance({
          turns: input.turns,
          coreAreaM2: input.coreAreaM2,
          gapM: input.gapM,
          pathM: input.pathM,
          relativePermeability: mur ?? material.typicalRelativePermeability,
        });
  const shape = { inductanceH, turns: input.turns, coreAreaM2: input.coreAreaM2 };
  const peakFluxT = peakFluxDensity({ ...shape, peakCurrentA: input.ratedCurrentA });
  const saturationCurrentA = saturationCurrent({ ...shape, saturationT: material.saturationT.min });
  const designMaxCurrentA = saturationCurrent({ ...shape, saturationT: material.designMaxT });
  const verdict: InductorVerdict =
    peakFluxT <= material.designMaxT ? "within-design" : peakFluxT <= material.saturationT.min ? "above-design-max" : "saturates";
  return {
    method: input.method,
    inductanceH,
    relativePermeability: mur,
    peakFluxT,
    storedEnergyJ: storedEnergy({ inductanceH, currentA: input.ratedCurrentA }),
    material: { id: material.id, label: material.label, saturationT: material.saturationT, designMaxT: material.designMaxT },
    saturationCurrentA,
    designMaxCurrentA,
    marginToSaturation: 1 - peakFluxT / material.saturationT.min,
    marginToDesignMax: 1 - peakFluxT / material.designMaxT,
    verdict,
    curve: fluxCurve({ ...shape, toCurrentA: Math.max(saturationCurrentA, input.ratedCurrentA), points: input.points }),
  };
}
