import { describe, expect, it } from "vitest";
import {
  CONDUCTOR_MATERIALS,
  CORE_MATERIAL_IDS,
  CORE_MATERIALS,
  SAFE_VOLTAGE_V,
  STORED_CHARGE_THRESHOLD_C,
} from "@/lib/engineering";

describe("conductor data", () => {
  it("copper is 1/58 Ω·mm²/m with α 0.00393/K (IEC 60028)", () => {
    expect(CONDUCTOR_MATERIALS.copper.resistivity20OhmM * 1e6).toBeCloseTo(1 / 58, 12);
    expect(CONDUCTOR_MATERIALS.copper.temperatureCoefficientPerK).toBe(0.00393);
  });

  it("aluminium is 0.028264 Ω·mm²/m with α 0.00403/K (IEC 60889)", () => {
    expect(CONDUCTOR_MATERIALS.aluminium.resistivity20OhmM * 1e6).toBeCloseTo(0.028264, 12);
    expect(CONDUCTOR_MATERIALS.aluminium.temperatureCoefficientPerK).toBe(0.00403);
  });
});

describe("core material data (McLyman ch. 2 tables; typical datasheet ranges, from memory)", () => {
  it("has every material keyed by its stable id", () => {
    expect(Object.keys(CORE_MATERIALS).sort()).toEqual([...CORE_MATERIAL_IDS].sort());
    for (const id of CORE_MATERIAL_IDS) expect(CORE_MATERIALS[id].id).toBe(id);
  });

  it("designs below the lower end of each saturation range, and names its source", () => {
    for (const m of Object.values(CORE_MATERIALS)) {
      expect(m.saturationT.min).toBeLessThanOrEqual(m.saturationT.max);
      expect(m.designMaxT).toBeLessThan(m.saturationT.min);
      expect(m.source).toMatch(/McLyman|datasheet/);
    }
  });

  it("orders the materials as the handbooks do: ferrite lowest, silicon steel highest", () => {
    const bsat = (id: keyof typeof CORE_MATERIALS) => CORE_MATERIALS[id].saturationT.max;
    expect(bsat("mnzn-ferrite")).toBeLessThanOrEqual(0.55); // ≈0.5 T at 25 °C
    expect(bsat("nanocrystalline")).toBeLessThan(bsat("amorphous"));
    expect(bsat("amorphous")).toBeLessThan(bsat("silicon-steel"));
    expect(bsat("silicon-steel")).toBeGreaterThanOrEqual(1.8);
  });
});

describe("hazard thresholds", () => {
  it("safe voltage is 60 V DC (IEC 62368-1 ES1, IEC 61010-1; IEC 60204-1 discharge target — from memory)", () => {
    expect(SAFE_VOLTAGE_V).toBe(60);
  });

  it("hazardous stored charge starts above 45 µC (IEC 61010-1, from memory)", () => {
    expect(STORED_CHARGE_THRESHOLD_C).toBe(45e-6);
  });
});
