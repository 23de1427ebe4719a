/**
 * Material data for the engineering formulas, each figure with its source beside it.
 * Resistivities are at 20 °C; the linear coefficient α gives ρ(T) = ρ20·(1 + α·(T − 20)).
 */

export const CONDUCTOR_MATERIAL_IDS = ["copper", "aluminium"] as const;
export type ConductorMaterialId = (typeof CONDUCTOR_MATERIAL_IDS)[number];

export interface ConductorMaterial {
  id: ConductorMaterialId;
  label: string;
  /** Ω·m at 20 °C */
  resistivity20OhmM: number;
  /** per kelvin, at 20 °C */
  temperatureCoefficientPerK: number;
  relativePermeability: number;
  source: string;
}

export const CONDUCTOR_MATERIALS: Record<ConductorMaterialId, ConductorMaterial> = {
  copper: {
    id: "copper",
    label: "Copper (annealed)",
    // IEC 60028: international annealed copper standard, 1/58 Ω·mm²/m at 20 °C, α20 = 0.00393/K.
    resistivity20OhmM: 1e-6 / 58,
    temperatureCoefficientPerK: 0.00393,
    relativePermeability: 1,
    source: "IEC 60028 (1/58 Ω·mm²/m, α = 0.00393/K at 20 °C)",
  },
  aluminium: {
    id: "aluminium",
    label: "Aluminium (hard-drawn)",
    // IEC 60889: hard-drawn aluminium wire for overhead conductors, 0.028264 Ω·mm²/m, α20 = 0.00403/K.
    resistivity20OhmM: 0.028264e-6,
    temperatureCoefficientPerK: 0.00403,
    relativePermeability: 1,
    source: "IEC 60889 (0.028264 Ω·mm²/m, α = 0.00403/K at 20 °C)",
  },
};

export const CORE_MATERIAL_IDS = [
  "mnzn-ferrite",
  "iron-powder",
  "silicon-steel",
  "amorphous",
  "nanocrystalline",
] as const;
export type CoreMaterialId = (typeof CORE_MATERIAL_IDS)[number];

export interface CoreMaterial {
  id: CoreMaterialId;
  label: string;
  /** saturation flux density range across typical grades, T */
  saturationT: { min: number; max: number };
  /** a conservative peak flux density to design a choke or transformer to, T */
  designMaxT: number;
  /** a typical relative permeability of the bulk material (a gap lowers the effective value) */
  typicalRelativePermeability: number;
  source: string;
}

// The saturation ranges are typical datasheet ranges as tabulated in McLyman, "Transformer
// and Inductor Design Handbook", ch. 2–3 (from memory). The design maxima are common
// practice: well below the lower end of the range, leaving room for temperature (ferrite
// loses roughly a quarter of its Bsat by 100 °C) and for grade-to-grade spread.
export const CORE_MATERIALS: Record<CoreMaterialId, CoreMaterial> = {
  "mnzn-ferrite": {
    id: "mnzn-ferrite",
    label: "Mn-Zn ferrite",
    saturationT: { min: 0.35, max: 0.5 }, // ≈0.5 T at 25 °C, ≈0.35–0.4 T at 100 °C; typical datasheet range, from memory
    designMaxT: 0.3, // common practice for chokes; transformers are loss-limited to 0.1–0.2 T at tens of kHz
    typicalRelativePermeability: 2000, // typical datasheet range 1500–3000 for power grades
    source: "McLyman ch. 2 material table; typical datasheet range (from memory)",
  },
  "iron-powder": {
    id: "iron-powder",
    label: "Iron powder",
    saturationT: { min: 1.0, max: 1.4 }, // typical datasheet range, from memory; saturation is soft
    designMaxT: 0.8, // common practice: permeability already falls well before the nominal Bsat
    typicalRelativePermeability: 75, // distributed gap; typical datasheet range 10–100
    source: "McLyman ch. 2 material table; typical datasheet range (from memory)",
  },
  "silicon-steel": {
    id: "silicon-steel",
    label: "Silicon-steel laminations",
    saturationT: { min: 1.5, max: 2.0 }, // grain-oriented and non-oriented grades, from memory
    designMaxT: 1.4, // common practice for 50/60 Hz mains transformers (1.2–1.6 T)
    typicalRelativePermeability: 4000, // typical datasheet range 1000–10000
    source: "McLyman ch. 2 material table; typical datasheet range (from memory)",
  },
  amorphous: {
    id: "amorphous",
    label: "Amorphous (iron-based)",
    saturationT: { min: 1.5, max: 1.6 }, // typical datasheet range, from memory
    designMaxT: 1.2, // common practice
    typicalRelativePermeability: 10000, // uncut tape cores; cut cores are gapped far lower
    source: "McLyman ch. 2 material table; typical datasheet range (from memory)",
  },
  nanocrystalline: {
    id: "nanocrystalline",
    label: "Nanocrystalline",
    saturationT: { min: 1.2, max: 1.25 }, // typical datasheet range, from memory
    designMaxT: 1.0, // common practice
    typicalRelativePermeability: 30000, // typical datasheet range 15000–100000
    source: "McLyman ch. 2 material table; typical datasheet range (from memory)",
  },
};
