import { describe, expect, it } from "vitest";
import { POST } from "@/app/api/calc/transformer/route";
import { expectRelClose } from "../engineering/support";
import { call } from "./request";

describe("POST /api/calc/transformer", () => {
  it("sine: 230 V → 12 V at 50 Hz, 10 cm², 1.2 T (EMF equation, Kf 4.44; McLyman ch. 1)", async () => {
    const { status, json } = await call(POST, { mode: "sine", primaryV: 230, frequencyHz: 50, peakFluxT: 1.2, coreAreaM2: 10e-4, secondaryV: 12 });
    expect(status).toBe(200);
    expect(json.waveformFactor).toBe(4.44);
    expectRelClose(json.primaryTurns, 863.36, 1e-5);
    expect(json.primaryTurnsRounded).toBe(864);
    expect(json.fluxAtRoundedTurnsT).toBeLessThanOrEqual(1.2);
    expectRelClose(json.turnsRatio, 230 / 12, 1e-12);
    expectRelClose(json.secondaryTurns, (864 * 12) / 230, 1e-12);
    expect(json.secondaryTurnsRounded).toBe(46);
  });

  it("square: Kf 4.0 for a half-bridge primary (McLyman ch. 1)", async () => {
    const { json } = await call(POST, { mode: "square", primaryV: 162, frequencyHz: 50e3, peakFluxT: 0.1, coreAreaM2: 2e-4 });
    expect(json.waveformFactor).toBe(4);
    expectRelClose(json.primaryTurns, 162 / (4 * 50e3 * 2e-4 * 0.1), 1e-12); // 40.5
    expect(json.primaryTurnsRounded).toBe(41);
    expect(json.secondaryTurns).toBeNull();
    expect(json.turnsRatio).toBeNull();
  });

  it("forward: N = V·ton/(ΔB·Ae) (Erickson & Maksimović ch. 15)", async () => {
    const { json } = await call(POST, { mode: "forward", busVolts: 340, onTimeS: 4e-6, fluxSwingT: 0.2, coreAreaM2: 1.5e-4, secondaryV: 34 });
    expect(json.waveformFactor).toBeNull();
    expectRelClose(json.voltSecondsVs, 1.36e-3, 1e-12);
    expectRelClose(json.primaryTurns, 45.333, 1e-4);
    expect(json.primaryTurnsRounded).toBe(46);
    expectRelClose(json.turnsRatio, 10, 1e-12);
    expectRelClose(json.secondaryTurns, 4.6, 1e-12);
  });

  it("answers 422 for an unknown mode or a missing frequency", async () => {
    expect((await call(POST, { mode: "triangle" })).status).toBe(422);
    const { status, json } = await call(POST, { mode: "sine", primaryV: 230, peakFluxT: 1.2, coreAreaM2: 1e-3 });
    expect(status).toBe(422);
    expect(Object.keys(json.fieldErrors)).toEqual(["frequencyHz"]);
  });
});
