import { describe, expect, it } from "vitest";
import { POST } from "@/app/api/calc/inductor/route";
import { expectRelClose } from "../engineering/support";
import { call } from "./request";

describe("POST /api/calc/inductor", () => {
  it("by AL: 20 turns on AL 250 nH is 100 µH; at 15 A on 2.5 cm² B = 0.3 T (L·I/(N·Ae), McLyman ch. 8)", async () => {
    const { status, json } = await call(POST, {
      method: "al",
      alNh: 250,
      turns: 20,
      coreAreaM2: 2.5e-4,
      material: "iron-powder",
      ratedCurrentA: 15,
    });
    expect(status).toBe(200);
    expectRelClose(json.inductanceH, 100e-6, 1e-12);
    expectRelClose(json.peakFluxT, 0.3, 1e-12);
    expectRelClose(json.storedEnergyJ, 0.5 * 100e-6 * 225, 1e-12);
    // iron powder: saturation from 1.0 T, design max 0.8 T (typical datasheet range, from memory)
    expect(json.verdict).toBe("within-design");
    expectRelClose(json.saturationCurrentA, 50, 1e-12);
    expectRelClose(json.marginToSaturation, 0.7, 1e-12);
    expect(json.curve).toHaveLength(50);
    expectRelClose(json.curve.at(-1).currentA, 50, 1e-12); // the plot runs up to saturation
    expectRelClose(json.curve.at(-1).fluxT, 1.0, 1e-12);
  });

  it("by gap: B = μ0·N·I/lg and the ferrite saturates (Erickson & Maksimović ch. 13)", async () => {
    const { json } = await call(POST, {
      method: "gap",
      turns: 20,
      coreAreaM2: 1.5e-4,
      gapM: 1e-3,
      pathM: 0.1,
      relativePermeability: 1e6,
      material: "mnzn-ferrite",
      ratedCurrentA: 20,
    });
    expectRelClose(json.inductanceH, 75.4e-6, 1e-3);
    expectRelClose(json.peakFluxT, (4e-7 * Math.PI * 20 * 20) / 1e-3, 1e-3); // 0.503 T
    expect(json.verdict).toBe("saturates");
    expect(json.marginToSaturation).toBeLessThan(0);
    expectRelClose(json.curve.at(-1).currentA, 20, 1e-12); // rated current is past saturation
  });

  it("by gap without μr uses the material's typical permeability", async () => {
    const { json } = await call(POST, {
      method: "gap",
      turns: 20,
      coreAreaM2: 1.5e-4,
      gapM: 0.5e-3,
      pathM: 0.1,
      material: "mnzn-ferrite",
      ratedCurrentA: 7,
    });
    expect(json.relativePermeability).toBe(2000);
    expectRelClose(json.inductanceH, (4e-7 * Math.PI * 400 * 1.5e-4) / (0.5e-3 + 0.1 / 2000), 1e-6);
    // B = μ0·N·I/(lg + le/μr) = 0.32 T: over the 0.3 T design figure, under the 0.35 T saturation
    expectRelClose(json.peakFluxT, (4e-7 * Math.PI * 20 * 7) / 0.55e-3, 1e-6);
    expect(json.verdict).toBe("above-design-max");
  });

  it("answers 422 for an unknown method, material or a fractional turn", async () => {
    const a = await call(POST, { method: "guess" });
    expect(a.status).toBe(422);
    expect(a.json.fieldErrors.method).toBeDefined();
    const b = await call(POST, { method: "al", alNh: 250, turns: 20.5, coreAreaM2: 1e-4, material: "cheese", ratedCurrentA: 1 });
    expect(b.status).toBe(422);
    expect(Object.keys(b.json.fieldErrors).sort()).toEqual(["material", "turns"]);
  });
});
