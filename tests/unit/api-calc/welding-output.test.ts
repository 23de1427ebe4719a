import { describe, expect, it } from "vitest";
import { POST } from "@/app/api/calc/welding-output/route";
import { expectRelClose } from "../engineering/support";
import { call } from "./request";

describe("POST /api/calc/welding-output", () => {
  it("an MMA inverter: 62 V DC OCV under the 113 V limit, 160 A at 60 % is 124 A at 100 % (IEC 60974-1, from memory)", async () => {
    const { status, json } = await call(POST, { openCircuitV: 62, ratedA: 160, ratedDutyPct: 60 });
    expect(status).toBe(200);
    expect(json.process).toBe("mma");
    expectRelClose(json.ratedLoadV, 26.4, 1e-12); // 20 + 0.04·160
    expect(json.ocv).toMatchObject({ declaredV: 62, basis: "peak", limitV: 113, withinLimit: true, marginV: 51 });
    expectRelClose(json.dutyCycle.currentA, 123.94, 1e-4);
    expectRelClose(json.dutyCycle.continuousA, 123.94, 1e-4);
    expect(json.loadLine).toHaveLength(40);
    expect(json.loadLine[0]).toEqual({ currentA: 0, volts: 20 });
    expectRelClose(json.loadLine.at(-1).currentA, 160, 1e-12);
    expectRelClose(json.loadLine.at(-1).volts, 26.4, 1e-12);
  });

  it("draws the load line to maxCurrentA, flat at 44 V past 600 A", async () => {
    const { json } = await call(POST, { openCircuitV: 80, ratedA: 400, ratedDutyPct: 60, maxCurrentA: 800, points: 9, targetDutyPct: 35 });
    expect(json.loadLine.map((p: { volts: number }) => p.volts)).toEqual([20, 24, 28, 32, 36, 40, 44, 44, 44]);
    expectRelClose(json.dutyCycle.currentA, 400 * Math.sqrt(60 / 35), 1e-12);
  });

  it("judges AC OCV against the RMS limit, stricter under increased hazard (80 V / 48 V RMS)", async () => {
    const normal = await call(POST, { openCircuitV: 70, ocvKind: "ac", ratedA: 150, ratedDutyPct: 30 });
    expect(normal.json.ocv).toMatchObject({ basis: "rms", limitV: 80, limitPeakV: 113, limitRmsV: 80, withinLimit: true });
    const wet = await call(POST, { openCircuitV: 70, ocvKind: "ac", environment: "increased-hazard", ratedA: 150, ratedDutyPct: 30 });
    expect(wet.json.ocv).toMatchObject({ limitV: 48, limitPeakV: 68, withinLimit: false, marginV: -22 });
  });

  it("answers 422 for a duty cycle over 100 % or an unknown process", async () => {
    const { status, json } = await call(POST, { openCircuitV: 62, ratedA: 160, ratedDutyPct: 60, targetDutyPct: 120, process: "gas" });
    expect(status).toBe(422);
    expect(Object.keys(json.fieldErrors).sort()).toEqual(["process", "targetDutyPct"]);
  });
});
