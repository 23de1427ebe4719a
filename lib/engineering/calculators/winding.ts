import type { WindingCalcInput } from "@/lib/validations/calc";
import { awgDiameter, conductorResistance, conductorResistivity, currentDensity, skinDepth } from "../conductors";
import type { ConductorMaterialId } from "../materials";

export interface WindingResult {
  material: ConductorMaterialId;
  temperatureC: number;
  resistivityOhmM: number;
  strandDiameterM: number;
  totalAreaM2: number;
  /** DC resistance at temperatureC; skin and proximity effects come on top */
  resistanceOhm: number;
  /** I²·R with the DC resistance */
  copperLossW: number;
  currentDensityAPerM2: number;
  currentDensityAPerMm2: number;
  skinDepthM: number | null;
  /** strand diameter over skin depth; much above 2 and AC resistance climbs */
  diameterToSkinDepth: number | null;
}

export function calculateWinding(input: WindingCalcInput): WindingResult {
  const strandDiameterM =
    input.awg !== undefined ? awgDiameter(input.awg) : Math.sqrt((4 * (input.areaM2 ?? 0)) / Math.PI);
  const strandAreaM2 = input.awg !== undefined ? (Math.PI * strandDiameterM ** 2) / 4 : (input.areaM2 ?? 0);
  const totalAreaM2 = strandAreaM2 * input.strands;
  const resistanceOhm = conductorResistance({
    material: input.material,
    lengthM: input.lengthM,
    areaM2: totalAreaM2,
    temperatureC: input.temperatureC,
  });
  const j = currentDensity({ currentA: input.currentA, areaM2: totalAreaM2 });
  const delta =
    input.frequencyHz === undefined
      ? null
      : skinDepth({ frequencyHz: input.frequencyHz, material: input.material, temperatureC: input.temperatureC });
  return {
    material: input.material,
    temperatureC: input.temperatureC,
    resistivityOhmM: conductorResistivity(input.material, input.temperatureC),
    strandDiameterM,
    totalAreaM2,
    resistanceOhm,
    copperLossW: input.currentA ** 2 * resistanceOhm,
    currentDensityAPerM2: j,
    currentDensityAPerMm2: j / 1e6,
    skinDepthM: delta,
    diameterToSkinDepth: delta === null ? null : strandDiameterM / delta,
  };
}
