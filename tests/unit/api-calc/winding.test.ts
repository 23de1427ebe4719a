import { describe, expect, it } from "vitest";
import { POST } from "@/app/api/calc/winding/route";
import { expectRelClose } from "../engineering/support";
import { call } from "./request";

describe("POST /api/calc/winding", () => {
  it("AWG 14 copper, 5 m at 10 A and 100 °C, 50 kHz (ASTM B258; IEC 60028; Erickson & Maksimović ch. 13)", async () => {
    const { status, json } = await call(POST, { lengthM: 5, currentA: 10, awg: 14, temperatureC: 100, frequencyHz: 50e3 });
    expect(status).toBe(200);
    expectRelClose(json.strandDiameterM, 1.628e-3, 2e-3); // ASTM B258 table: 1.628 mm
    const area = (Math.PI * json.strandDiameterM ** 2) / 4;
    expectRelClose(json.totalAreaM2, area, 1e-12);
    const rho100 = (1e-6 / 58) * (1 + 0.00393 * 80);
    expectRelClose(json.resistanceOhm, (rho100 * 5) / area, 1e-9);
    expectRelClose(json.copperLossW, 100 * json.resistanceOhm, 1e-12);
    expectRelClose(json.currentDensityAPerMm2, 10 / (area * 1e6), 1e-9); // ≈ 4.8 A/mm²
    expectRelClose(json.skinDepthM * 100, 7.5 / Math.sqrt(50e3), 0.02); // 7.5/√f cm at 100 °C
    expectRelClose(json.diameterToSkinDepth, json.strandDiameterM / json.skinDepthM, 1e-12);
  });

  it("area and strands for litz: 100 strands of 0.05 mm² carry 10 A at 2 A/mm²", async () => {
    const { json } = await call(POST, { lengthM: 2, currentA: 10, areaM2: 0.05e-6, strands: 100 });
    expectRelClose(json.totalAreaM2, 5e-6, 1e-12);
    expectRelClose(json.currentDensityAPerMm2, 2, 1e-12);
    expectRelClose(json.resistanceOhm, (2 / 58) / 5, 1e-9); // IEC 60028 at 20 °C
    expect(json.skinDepthM).toBeNull();
  });

  it("aluminium uses 0.028264 Ω·mm²/m (IEC 60889)", async () => {
    const { json } = await call(POST, { material: "aluminium", lengthM: 1, currentA: 1, areaM2: 1e-6 });
    expectRelClose(json.resistanceOhm, 0.028264, 1e-9);
  });

  it("answers 422 unless exactly one of awg and areaM2 is given", async () => {
    const both = await call(POST, { lengthM: 1, currentA: 1, awg: 14, areaM2: 1e-6 });
    expect(both.status).toBe(422);
    expect(both.json.fieldErrors.areaM2[0]).toMatch(/either an AWG size or a conductor area/);
    expect((await call(POST, { lengthM: 1, currentA: 1 })).status).toBe(422);
    const badGauge = await call(POST, { lengthM: 1, currentA: 1, awg: "5/0" });
    expect(Object.keys(badGauge.json.fieldErrors)).toEqual(["awg"]);
  });

  it("accepts aught gauges as strings (ASTM B258: 4/0 = 11.684 mm)", async () => {
    const { json } = await call(POST, { lengthM: 1, currentA: 100, awg: "4/0" });
    expect(json.strandDiameterM * 1e3).toBeCloseTo(11.684, 3);
  });
});
