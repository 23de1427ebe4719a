import * as math from "mathjs";
import { describe, expect, it } from "vitest";
import {
  MU_0,
  fluxCurve,
  gappedInductance,
  inductanceFromAl,
  peakFluxDensity,
  saturationCurrent,
  storedEnergy,
  turnsForInductance,
} from "@/lib/engineering";
import { expectRelClose } from "./support";

describe("μ0", () => {
  it("equals the CODATA value mathjs ships (math.magneticConstant)", () => {
    expectRelClose(MU_0, math.magneticConstant.toNumber("N/A^2"), 1e-12);
  });

  it("is within 1e-9 of the pre-2019 exact 4π·10⁻⁷ (SI brochure)", () => {
    expectRelClose(MU_0, 4 * Math.PI * 1e-7, 1e-9);
  });
});

describe("inductanceFromAl and turnsForInductance", () => {
  it("L = AL·N²: 20 turns on AL 250 nH is 100 µH (definition of AL, nH/turn²)", () => {
    expectRelClose(inductanceFromAl({ alNh: 250, turns: 20 }), 100e-6, 1e-12);
  });

  it("rounds turns up to a whole turn, and not past an exact answer", () => {
    expect(turnsForInductance({ alNh: 250, inductanceH: 100e-6 })).toBe(20);
    expect(turnsForInductance({ alNh: 250, inductanceH: 101e-6 })).toBe(21); // √404 = 20.1
    expect(turnsForInductance({ alNh: 2500, inductanceH: 1e-9 })).toBe(1);
  });

  it("the AL of an ungapped core is μ0·μr·Ae/le (Erickson & Maksimović, ch. 13)", () => {
    const ae = 1.25e-4;
    const le = 0.0984;
    const mur = 2000;
    const alNh = ((MU_0 * mur * ae) / le) * 1e9;
    expectRelClose(inductanceFromAl({ alNh, turns: 30 }), gappedInductance({ turns: 30, coreAreaM2: ae, gapM: 0, pathM: le, relativePermeability: mur }), 1e-12);
  });
});

describe("gappedInductance (Erickson & Maksimović, ch. 13)", () => {
  it("approaches μ0·N²·Ac/lg when the gap dominates", () => {
    // 20 turns, 1.5 cm², 1 mm gap: 4π·10⁻⁷·400·1.5e-4/1e-3 = 75.4 µH
    const l = gappedInductance({ turns: 20, coreAreaM2: 1.5e-4, gapM: 1e-3, pathM: 0.1, relativePermeability: 1e7 });
    expectRelClose(l, 75.4e-6, 1e-3);
  });

  it("adds the core reluctance le/μr in series with the gap", () => {
    // lg + le/μr = 1 mm + 100 mm / 2000 = 1.05 mm
    const l = gappedInductance({ turns: 20, coreAreaM2: 1.5e-4, gapM: 1e-3, pathM: 0.1, relativePermeability: 2000 });
    expectRelClose(l, (4 * Math.PI * 1e-7 * 400 * 1.5e-4) / 1.05e-3, 1e-6);
  });
});

describe("peakFluxDensity", () => {
  it("for a gapped core equals μ0·N·I/lg (Erickson & Maksimović, ch. 13: B = μ0 n i / lg)", () => {
    const turns = 20;
    const coreAreaM2 = 1.5e-4;
    const gapM = 1e-3;
    const l = gappedInductance({ turns, coreAreaM2, gapM, pathM: 0.1, relativePermeability: 1e7 });
    const b = peakFluxDensity({ inductanceH: l, peakCurrentA: 10, turns, coreAreaM2 });
    expectRelClose(b, (MU_0 * turns * 10) / gapM, 1e-5); // 0.251 T
  });

  it("is L·I/(N·Ae) from the flux linkage N·Φ = L·I (McLyman, ch. 8)", () => {
    expectRelClose(peakFluxDensity({ inductanceH: 100e-6, peakCurrentA: 15, turns: 20, coreAreaM2: 2.5e-4 }), 0.3, 1e-12);
  });
});

describe("storedEnergy and saturationCurrent", () => {
  it("½LI²: 100 µH at 20 A stores 20 mJ", () => {
    expectRelClose(storedEnergy({ inductanceH: 100e-6, currentA: 20 }), 0.02, 1e-12);
  });

  it("saturation current is where B·N·Ae = L·I, and B at that current is the saturation figure", () => {
    const shape = { inductanceH: 100e-6, turns: 20, coreAreaM2: 2.5e-4 };
    const isat = saturationCurrent({ ...shape, saturationT: 0.35 });
    expectRelClose(isat, 17.5, 1e-12);
    expectRelClose(peakFluxDensity({ ...shape, peakCurrentA: isat }), 0.35, 1e-12);
  });
});

describe("fluxCurve", () => {
  it("is a straight line from 0 to B(toCurrentA)", () => {
    const shape = { inductanceH: 100e-6, turns: 20, coreAreaM2: 2.5e-4 };
    const curve = fluxCurve({ ...shape, toCurrentA: 20, points: 5 });
    expect(curve.map((p) => p.currentA)).toEqual([0, 5, 10, 15, 20]);
    expect(curve[0]!.fluxT).toBe(0);
    expectRelClose(curve[4]!.fluxT, 0.4, 1e-12);
    expectRelClose(curve[2]!.fluxT, 0.2, 1e-12);
  });
});
