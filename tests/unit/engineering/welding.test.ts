import { describe, expect, it } from "vitest";
import { conventionalLoadVoltage, currentAtDutyCycle, noLoadVoltageLimit } from "@/lib/engineering";
import { expectRelClose } from "./support";

describe("conventionalLoadVoltage (IEC 60974-1 conventional load, from memory)", () => {
  it("MMA: U2 = 20 + 0.04·I2 up to 600 A, 44 V above", () => {
    expectRelClose(conventionalLoadVoltage(100), 24, 1e-12);
    expectRelClose(conventionalLoadVoltage(160, "mma"), 26.4, 1e-12);
    expectRelClose(conventionalLoadVoltage(600, "mma"), 44, 1e-12);
    expect(conventionalLoadVoltage(800, "mma")).toBe(44);
  });

  it("TIG: U2 = 10 + 0.04·I2 up to 600 A, 34 V above", () => {
    expectRelClose(conventionalLoadVoltage(100, "tig"), 14, 1e-12);
    expectRelClose(conventionalLoadVoltage(600, "tig"), 34, 1e-12);
    expect(conventionalLoadVoltage(650, "tig")).toBe(34);
  });

  it("MIG/MAG: U2 = 14 + 0.05·I2 up to 600 A, 44 V above", () => {
    expectRelClose(conventionalLoadVoltage(200, "mig"), 24, 1e-12);
    expectRelClose(conventionalLoadVoltage(600, "mig"), 44, 1e-12);
    expect(conventionalLoadVoltage(601, "mig")).toBe(44);
  });

  it("a 2 mm electrode at its usual 30–70 A sits at about 21–23 V (common practice)", () => {
    expect(conventionalLoadVoltage(30)).toBeGreaterThanOrEqual(21);
    expect(conventionalLoadVoltage(70)).toBeLessThanOrEqual(23);
  });
});

describe("currentAtDutyCycle (equal heating, I²·X constant)", () => {
  it("160 A at 60 % is 123.9 A at 100 %", () => {
    expectRelClose(currentAtDutyCycle({ ratedA: 160, ratedDutyPct: 60, targetDutyPct: 100 }), 123.94, 1e-4);
  });

  it("may exceed the rated current at a shorter duty cycle: 100 A at 100 % is 200 A at 25 %", () => {
    expectRelClose(currentAtDutyCycle({ ratedA: 100, ratedDutyPct: 100, targetDutyPct: 25 }), 200, 1e-12);
  });

  it("keeps I²·X: converting there and back returns the rating", () => {
    const at35 = currentAtDutyCycle({ ratedA: 140, ratedDutyPct: 60, targetDutyPct: 35 });
    expectRelClose(at35 ** 2 * 35, 140 ** 2 * 60, 1e-12);
    expectRelClose(currentAtDutyCycle({ ratedA: at35, ratedDutyPct: 35, targetDutyPct: 60 }), 140, 1e-12);
  });

  it("rejects a duty cycle above 100 %", () => {
    expect(() => currentAtDutyCycle({ ratedA: 160, ratedDutyPct: 60, targetDutyPct: 120 })).toThrow(/targetDutyPct/);
    expect(() => currentAtDutyCycle({ ratedA: 160, ratedDutyPct: 101, targetDutyPct: 60 })).toThrow(/ratedDutyPct/);
  });
});

describe("noLoadVoltageLimit (IEC 60974-1 rated no-load voltage, from memory)", () => {
  it("normal environment: DC 113 V peak; AC 113 V peak and 80 V RMS", () => {
    expect(noLoadVoltageLimit({ kind: "dc", environment: "normal" })).toEqual({ peakV: 113 });
    expect(noLoadVoltageLimit({ kind: "ac", environment: "normal" })).toEqual({ peakV: 113, rmsV: 80 });
  });

  it("increased hazard of electric shock: DC 113 V peak; AC 68 V peak and 48 V RMS", () => {
    expect(noLoadVoltageLimit({ kind: "dc", environment: "increased-hazard" })).toEqual({ peakV: 113 });
    expect(noLoadVoltageLimit({ kind: "ac", environment: "increased-hazard" })).toEqual({ peakV: 68, rmsV: 48 });
  });

  it("an inverter source's ≈60 V OCV sits well under the DC limit (common practice)", () => {
    expect(60).toBeLessThan(noLoadVoltageLimit({ kind: "dc", environment: "increased-hazard" }).peakV * 0.6);
  });

  it("returns a copy, so a caller cannot change the table", () => {
    const limit = noLoadVoltageLimit({ kind: "dc", environment: "normal" });
    limit.peakV = 1;
    expect(noLoadVoltageLimit({ kind: "dc", environment: "normal" }).peakV).toBe(113);
  });
});
