// Derived figures of a magnetic. The worked example is a gapped ferrite choke worked by hand from
// the gapped-inductor relations in McLyman, "Transformer and Inductor Design Handbook", ch. 8
// (L = μ0·N²·Ae / (lg + le/μr), B = μ0·N·I / (lg + le/μr); from memory), each figure recomputed
// here with mathjs units and its CODATA μ0 so the check does not lean on lib/engineering.
import * as math from "mathjs";
import { describe, expect, it } from "vitest";
import { deriveMagnetic } from "@/lib/listings/derived";
import type { MagneticFigures } from "@/lib/validations/listings";

const rel = (actual: number | null | undefined, expected: number, tolerance = 1e-6) => {
  expect(actual).not.toBeNull();
  expect(Math.abs((actual as number) - expected) / Math.abs(expected)).toBeLessThan(tolerance);
};

// 20 turns on a ferrite core with Ae 125 mm², le 107 mm and a 1 mm gap, μr 2000 (the material's
// typical value in lib/engineering), 10 A, 4 mm² copper in 20 strands, 60 mm mean turn, 100 kHz.
const choke: MagneticFigures = {
  coreMaterial: "mnzn-ferrite",
  coreAreaM2: 125e-6,
  pathLengthM: 0.107,
  gapM: 1e-3,
  meanTurnLengthM: 0.06,
  windings: [{ name: "main", role: "winding", turns: 20, material: "copper", areaM2: 4e-6, strands: 20, currentA: 10 }],
  ratedCurrentA: 10,
  switchingFrequencyHz: 100e3,
};

describe("a gapped ferrite choke (worked example)", () => {
  const d = deriveMagnetic("choke", choke);
  const reluctanceLength = math.evaluate("1 mm + 107 mm / 2000");

  it("inductance ≈ 59.6 µH from the gap geometry", () => {
    const expected = math.evaluate("magneticConstant * 20^2 * 125 mm^2 / L", { L: reluctanceLength }).toNumber("H");
    rel(d.inductanceH, expected);
    rel(d.inductanceH, 59.64e-6, 1e-3); // by hand: 6.2832e-8 H·m / 1.0535e-3 m
    expect(d.inductanceBasis).toBe("gap");
  });

  it("peak flux density at the rated 10 A ≈ 0.239 T, within the 0.3 T design maximum of ferrite", () => {
    const expected = math.evaluate("magneticConstant * 20 * 10 A / L", { L: reluctanceLength }).toNumber("T");
    rel(d.peakFluxT, expected);
    rel(d.peakFluxT, 0.2386, 1e-3);
    expect(d.verdict).toBe("within-design");
    // Margins against lib/engineering's ferrite figures: Bsat(min) 0.35 T, design maximum 0.3 T.
    rel(d.marginToSaturation, 1 - expected / 0.35);
    rel(d.marginToDesignMax, 1 - expected / 0.3);
  });

  it("winding resistance, copper loss and current density from IEC 60028 copper (1/58 Ω·mm²/m)", () => {
    const w = d.windings[0]!;
    const r = math.evaluate("(1/58 ohm mm^2 / m) * 20 * 60 mm / 4 mm^2").toNumber("ohm");
    rel(w.resistanceOhm, r); // 5.17 mΩ
    rel(w.resistanceOhm, 5.172e-3, 1e-3);
    rel(w.copperLossW, 10 ** 2 * r); // 0.517 W
    rel(d.totalCopperLossW, 10 ** 2 * r);
    rel(w.currentDensityAPerM2, 2.5e6); // 10 A over 4 mm² = 2.5 A/mm²
  });

  it("skin depth at 100 kHz ≈ 0.209 mm, beside a strand radius of 0.252 mm", () => {
    const w = d.windings[0]!;
    // δ = √(ρ/(π·f·μ0)); the "66/√f mm" rule for copper at 20 °C gives 0.209 mm at 100 kHz (common practice).
    const delta = math.evaluate("sqrt((1/58 ohm mm^2 / m) / (pi * 100 kHz * magneticConstant))").toNumber("m");
    rel(w.skinDepthM, delta);
    rel(w.skinDepthM, 66e-3 / Math.sqrt(100e3), 5e-3);
    const radius = Math.sqrt((4 * 0.2e-6) / Math.PI) / 2; // one strand of 0.2 mm²
    rel(w.radiusToSkinDepth, radius / delta);
    expect(w.radiusToSkinDepth).toBeGreaterThan(1);
  });

  it("a choke has no turns ratio", () => {
    expect(d.turnsRatios).toEqual([]);
  });
});

describe("the other ways in", () => {
  it("takes the inductance from AL when the datasheet gives one: 250 nH × 20² = 100 µH (definition of AL)", () => {
    const d = deriveMagnetic("choke", { ...choke, alNh: 250 });
    rel(d.inductanceH, 100e-6, 1e-12);
    expect(d.inductanceBasis).toBe("al");
  });

  it("flags a choke driven past the lower end of ferrite's saturation range", () => {
    const d = deriveMagnetic("choke", { ...choke, ratedCurrentA: 20 }); // B ≈ 0.477 T > 0.35 T
    expect(d.verdict).toBe("saturates");
    expect(d.marginToSaturation).toBeLessThan(0);
  });

  it("leaves resistance and copper loss out when the mean turn length is unknown", () => {
    const { meanTurnLengthM: _dropped, ...noMlt } = choke;
    const d = deriveMagnetic("choke", noMlt);
    expect(d.windings[0]?.resistanceOhm).toBeNull();
    expect(d.totalCopperLossW).toBeNull();
  });

  it("a transformer: turns ratio N1/N2 and the flux from the square-wave EMF equation V = 4·f·N·Ae·B (McLyman ch. 1)", () => {
    const d = deriveMagnetic("transformer", {
      ...choke,
      primaryVoltageV: 160, // half of a 320 V bus across the primary of a half bridge
      switchingFrequencyHz: 50e3,
      windings: [
        { name: "primary", role: "primary", turns: 28, material: "copper", areaM2: 2e-6, strands: 10, currentA: 6 },
        { name: "secondary", role: "secondary", turns: 5, material: "copper", areaM2: 12e-6, strands: 60, currentA: 30 },
      ],
    });
    expect(d.turnsRatios).toEqual([{ secondary: "secondary", ratio: 28 / 5 }]);
    rel(d.peakFluxT, math.evaluate("160 V / (4 * 50 kHz * 28 * 125 mm^2)").toNumber("T")); // 0.229 T
    expect(d.inductanceWinding).toBe("primary");
    expect(d.fluxBasis).toBe("primary-volt-seconds");
  });

  it("a current transformer: ratio Nsec/Npri, inductance of the secondary, no flux figure (it depends on the burden)", () => {
    const d = deriveMagnetic("current-transformer", {
      ...choke,
      alNh: 2000,
      windings: [
        { name: "primary", role: "primary", turns: 1, material: "copper", areaM2: 10e-6, strands: 1, currentA: 30 },
        { name: "sense", role: "secondary", turns: 100, material: "copper", areaM2: 0.05e-6, strands: 1, currentA: 0.3 },
      ],
    });
    expect(d.turnsRatios).toEqual([{ secondary: "sense", ratio: 100 }]);
    rel(d.inductanceH, 2000e-9 * 100 ** 2); // 20 mH on the secondary
    expect(d.peakFluxT).toBeNull();
    expect(d.verdict).toBeNull();
  });
});
