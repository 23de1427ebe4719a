import { describe, expect, it } from "vitest";
import { POST } from "@/app/api/calc/mains/route";
import { expectRelClose } from "../engineering/support";
import { call } from "./request";

describe("POST /api/calc/mains", () => {
  it("answers the worked example: 357.8 V, 64 J, 0.358 C, 83.9 s through 47 kΩ (IEC 60038 230 V +10 %)", async () => {
    const { status, json } = await call(POST, { mainsVrms: 230, capacitanceF: 1000e-6, bleederOhm: 47e3 });
    expect(status).toBe(200);
    expectRelClose(json.busPeakV, 357.8, 1e-4);
    expectRelClose(json.energyJ, 64, 1e-3);
    expectRelClose(json.chargeC, 0.3578, 1e-4);
    expectRelClose(json.dischargeS, 83.9, 1e-3);
    expect(json.timeConstantS).toBeCloseTo(47, 9);
    expect(json.aboveSafeVoltage).toBe(true);
    expect(json.chargeAboveThreshold).toBe(true); // > 45 µC (IEC 61010-1, from memory)
    expect(json.curve.source).toBe("declared");
    expect(json.curve.bleederOhm).toBe(47e3);
    expect(json.curve.points).toHaveLength(60);
    expect(json.curve.points[0]).toEqual({ timeS: 0, volts: json.busPeakV });
  });

  it("suggests the largest E12 bleeder for the target time (IEC 60063): 33 kΩ for 60 s, 2.7 kΩ for 5 s (IEC 60204-1)", async () => {
    const a = await call(POST, { mainsVrms: 230, capacitanceF: 1e-3 });
    expect(a.json.suggestedBleeder.ohms).toBe(33e3); // R ≤ 60 / 1.786e-3 = 33.6 kΩ
    expect(a.json.suggestedBleeder.dischargeS).toBeLessThanOrEqual(60);
    expect(a.json.dischargeS).toBeNull();
    expect(a.json.curve.source).toBe("suggested");
    const b = await call(POST, { mainsVrms: 230, capacitanceF: 1e-3, targetDischargeS: 5 });
    expect(b.json.suggestedBleeder.ohms).toBe(2700);
  });

  it("needs no bleeder when the bus never exceeds the safe voltage", async () => {
    const { status, json } = await call(POST, { mainsVrms: 24, capacitanceF: 1e-3 });
    expect(status).toBe(200);
    expect(json.aboveSafeVoltage).toBe(false); // 24 V +10 % peaks at 37 V
    expect(json.suggestedBleeder).toBeNull();
    expect(json.curve).toBeNull();
  });

  it("answers 422 with field errors for wrong or missing inputs", async () => {
    const { status, json } = await call(POST, { mainsVrms: "230", capacitanceF: -1, tolerance: 2 });
    expect(status).toBe(422);
    expect(json.error).toBe("invalid_input");
    expect(Object.keys(json.fieldErrors).sort()).toEqual(["capacitanceF", "mainsVrms", "tolerance"]);
    expect(json.fieldErrors.mainsVrms[0]).toMatch(/number/);
  });

  it("answers 422 for a body that is not JSON, or not an object", async () => {
    const bad = await call(POST, "{mainsVrms: 230");
    expect(bad.status).toBe(422);
    expect(bad.json.error).toBe("invalid_input");
    expect(bad.json.message).toMatch(/not valid JSON/);
    const notObject = await call(POST, "[1,2]");
    expect(notObject.status).toBe(422);
  });
});
