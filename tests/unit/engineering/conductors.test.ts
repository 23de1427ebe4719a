import { describe, expect, it } from "vitest";
import {
  awgDiameter,
  conductorResistance,
  conductorResistivity,
  currentDensity,
  skinDepth,
} from "@/lib/engineering";
import { expectRelClose } from "./support";

describe("conductorResistance", () => {
  it("copper: 1 m of 1 mm² is 1/58 Ω = 0.017241 Ω at 20 °C (IEC 60028)", () => {
    expectRelClose(conductorResistance({ material: "copper", lengthM: 1, areaM2: 1e-6 }), 0.017241, 5e-5); // published to 5 figures
  });

  it("copper rises by α = 0.00393/K: ×1.2162 at 75 °C (IEC 60028)", () => {
    const r75 = conductorResistance({ material: "copper", lengthM: 1, areaM2: 1e-6, temperatureC: 75 });
    expectRelClose(r75, 0.017241 * (1 + 0.00393 * 55), 5e-5);
  });

  it("aluminium: 0.028264 Ω per m·mm² at 20 °C, α = 0.00403/K (IEC 60889)", () => {
    expectRelClose(conductorResistance({ material: "aluminium", lengthM: 1, areaM2: 1e-6 }), 0.028264, 1e-9);
    const r90 = conductorResistance({ material: "aluminium", lengthM: 1000, areaM2: 100e-6, temperatureC: 90 });
    expectRelClose(r90, (0.028264 * 1000 * (1 + 0.00403 * 70)) / 100, 1e-9);
  });

  it("scales with length over area (R = ρl/A)", () => {
    const base = conductorResistance({ material: "copper", lengthM: 2, areaM2: 2e-6 });
    expectRelClose(conductorResistance({ material: "copper", lengthM: 4, areaM2: 2e-6 }), 2 * base, 1e-12);
    expectRelClose(conductorResistance({ material: "copper", lengthM: 2, areaM2: 4e-6 }), base / 2, 1e-12);
  });

  it("exposes the resistivity it uses (IEC 60028: 1.7241e-8 Ω·m)", () => {
    expectRelClose(conductorResistivity("copper"), 1.7241e-8, 1e-4);
  });
});

describe("skinDepth", () => {
  it("copper at 100 °C is ≈ 7.5/√f cm (Erickson & Maksimović, ch. 13 shortcut)", () => {
    for (const f of [1e3, 25e3, 100e3, 1e6]) {
      const deltaCm = skinDepth({ frequencyHz: f, material: "copper", temperatureC: 100 }) * 100;
      expectRelClose(deltaCm, 7.5 / Math.sqrt(f), 0.02);
    }
  });

  it("copper at 20 °C is ≈ 6.6/√f cm (common textbook figure)", () => {
    expectRelClose(skinDepth({ frequencyHz: 50 }) * 100, 6.6 / Math.sqrt(50), 0.01); // ≈ 9.3 mm at 50 Hz
  });

  it("grows with resistivity: aluminium is √(ρAl/ρCu) deeper (δ ∝ √ρ)", () => {
    const ratio = skinDepth({ frequencyHz: 1e4, material: "aluminium" }) / skinDepth({ frequencyHz: 1e4 });
    expectRelClose(ratio, Math.sqrt(0.028264 * 58), 1e-9);
  });

  it("halves when frequency quadruples (δ ∝ 1/√f)", () => {
    expectRelClose(skinDepth({ frequencyHz: 4e4 }), skinDepth({ frequencyHz: 1e4 }) / 2, 1e-12);
  });
});

describe("awgDiameter (ASTM B258)", () => {
  it("matches the named table entries: AWG 10 = 2.588 mm, 40 = 0.0799 mm, 0000 = 11.684 mm", () => {
    expect(awgDiameter(10) * 1e3).toBeCloseTo(2.588, 3);
    expect(awgDiameter(40) * 1e3).toBeCloseTo(0.0799, 4);
    expect(awgDiameter("0000") * 1e3).toBeCloseTo(11.684, 3);
  });

  it("is 0.127 mm (5 mil) at AWG 36 and 0.46 in at 0000, the two anchors of the definition", () => {
    expect(awgDiameter(36)).toBeCloseTo(0.127e-3, 12);
    expectRelClose(awgDiameter(-3), 0.46 * 25.4e-3, 1e-12);
  });

  it("matches other table rows to their rounding (ASTM B258: AWG 14 1.628 mm, 20 0.8128 mm, 30 0.2540 mm)", () => {
    expectRelClose(awgDiameter(14) * 1e3, 1.628, 2e-3);
    expectRelClose(awgDiameter(20) * 1e3, 0.8128, 2e-3);
    expectRelClose(awgDiameter(30) * 1e3, 0.254, 3e-3);
  });

  it("accepts aught sizes as strings and as numbers", () => {
    expect(awgDiameter("4/0")).toBe(awgDiameter(-3));
    expect(awgDiameter("000")).toBe(awgDiameter("3/0"));
    expect(awgDiameter("00")).toBe(awgDiameter(-1));
    expect(awgDiameter("0")).toBe(awgDiameter("1/0"));
    expect(awgDiameter("1/0")).toBe(awgDiameter(0));
  });

  it("steps by 92^(1/39) per gauge: six gauges halve the diameter (≈ 2.0×, ASTM B258)", () => {
    expectRelClose(awgDiameter(10) / awgDiameter(16), 92 ** (6 / 39), 1e-12);
    expectRelClose(awgDiameter(10) / awgDiameter(16), 2, 0.01);
  });
});

describe("currentDensity", () => {
  it("is I/A in A/m²: 10 A in 2 mm² is 5 A/mm² = 5e6 A/m²", () => {
    expectRelClose(currentDensity({ currentA: 10, areaM2: 2e-6 }), 5e6, 1e-12);
  });
});
