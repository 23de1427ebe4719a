import { describe, expect, it } from "vitest";
import {
  busPeakVoltage,
  capacitorCharge,
  capacitorEnergy,
  dischargeCurve,
  dischargeTime,
  suggestBleeder,
} from "@/lib/engineering";
import { expectRelClose } from "./support";

describe("busPeakVoltage", () => {
  it("gives ≈ 357.8 V for 230 V +10 % (IEC 60038 nominal 230 V, tolerance ±10 %; worked example)", () => {
    expectRelClose(busPeakVoltage(230, 0.1), 357.8, 1e-4);
    expectRelClose(busPeakVoltage(230), 357.8, 1e-4); // +10 % is the default
  });

  it("covers the other IEC 60038 nominal voltages: 120 V and 400 V", () => {
    expectRelClose(busPeakVoltage(120, 0.1), 186.7, 1e-3); // √2·120·1.1
    expectRelClose(busPeakVoltage(400, 0.1), 622.3, 1e-3); // three-phase bridge on 400 V line-to-line
  });

  it("is just √2·Vrms with no tolerance (sine peak = √2 × RMS)", () => {
    expectRelClose(busPeakVoltage(230, 0), 325.27, 1e-4);
  });

  it("stays under the 450 V rating of bulk capacitors used on 230 V mains (common practice)", () => {
    expect(busPeakVoltage(230, 0.1)).toBeLessThan(450);
    expect(busPeakVoltage(240, 0.1)).toBeLessThan(450);
    // …while 400 V three-phase needs two in series (common practice): one 450 V part is not enough.
    expect(busPeakVoltage(400, 0.1)).toBeGreaterThan(450);
  });
});

describe("capacitorEnergy and capacitorCharge", () => {
  it("1000 µF at 357.8 V holds 64 J and 0.358 C (½CV², CV; worked example)", () => {
    expectRelClose(capacitorEnergy(1000e-6, 357.8), 64.0, 2e-3);
    expectRelClose(capacitorCharge(1000e-6, 357.8), 0.3578, 1e-4);
  });

  it("has zero energy and charge at zero volts", () => {
    expect(capacitorEnergy(1e-3, 0)).toBe(0);
    expect(capacitorCharge(1e-3, 0)).toBe(0);
  });
});

describe("dischargeTime", () => {
  it("47 kΩ across 1000 µF from 357.8 V to 60 V takes ≈ 83.9 s (RC·ln(V0/V); worked example)", () => {
    expectRelClose(dischargeTime({ resistanceOhm: 47e3, capacitanceF: 1e-3, fromV: 357.8 }), 83.9, 1e-3);
  });

  it("defaults the safe level to 60 V DC (IEC 62368-1 ES1 / IEC 61010-1, from memory)", () => {
    const a = dischargeTime({ resistanceOhm: 47e3, capacitanceF: 1e-3, fromV: 357.8 });
    const b = dischargeTime({ resistanceOhm: 47e3, capacitanceF: 1e-3, fromV: 357.8, toV: 60 });
    expect(a).toBe(b);
  });

  it("takes one time constant to fall to 1/e (definition of τ = RC)", () => {
    expectRelClose(dischargeTime({ resistanceOhm: 1e3, capacitanceF: 1e-3, fromV: 100 * Math.E, toV: 100 }), 1, 1e-12);
  });

  it("is 0 when the bus is already at or below the target", () => {
    expect(dischargeTime({ resistanceOhm: 47e3, capacitanceF: 1e-3, fromV: 60 })).toBe(0);
    expect(dischargeTime({ resistanceOhm: 47e3, capacitanceF: 1e-3, fromV: 12 })).toBe(0);
  });
});

describe("suggestBleeder", () => {
  it("meets the IEC 60204-1 5 s to 60 V with 2.7 kΩ on 1000 µF at 357.8 V (from memory)", () => {
    // R ≤ 5 / (1e-3 · ln(357.8/60)) = 2.80 kΩ → largest E12 below: 2.7 kΩ (IEC 60063)
    const b = suggestBleeder({ capacitanceF: 1e-3, fromV: 357.8, withinS: 5 });
    expect(b.ohms).toBe(2700);
    expectRelClose(b.watts, (357.8 * 357.8) / 2700, 1e-12); // 47 W: why hobby builds settle for a minute
    expect(b.dischargeS).toBeLessThanOrEqual(5);
    expectRelClose(b.dischargeS, 2700 * 1e-3 * Math.log(357.8 / 60), 1e-12);
  });

  it("picks 56 kΩ for two minutes, not the 68 kΩ above it (E12, IEC 60063)", () => {
    // R ≤ 120 / 1.7857 = 67.2 kΩ: 68 kΩ would take 121.4 s
    const b = suggestBleeder({ capacitanceF: 1e-3, fromV: 357.8, withinS: 120 });
    expect(b.ohms).toBe(56_000);
    expect(dischargeTime({ resistanceOhm: 68e3, capacitanceF: 1e-3, fromV: 357.8 })).toBeGreaterThan(120);
  });

  it("accepts an E12 value that meets the time exactly", () => {
    const exact = 47e3 * 1e-3 * Math.log(357.8 / 60);
    expect(suggestBleeder({ capacitanceF: 1e-3, fromV: 357.8, withinS: exact }).ohms).toBe(47e3);
  });

  it("steps down when an E12 value misses the time by a rounding hair", () => {
    const exact = 47e3 * 1e-3 * Math.log(357.8 / 60);
    const b = suggestBleeder({ capacitanceF: 1e-3, fromV: 357.8, withinS: exact * (1 - 1e-13) });
    expect(b.ohms).toBe(39e3);
    expect(b.dischargeS).toBeLessThanOrEqual(exact * (1 - 1e-13));
  });

  it("refuses to size a bleeder for a bus already below the target", () => {
    expect(() => suggestBleeder({ capacitanceF: 1e-3, fromV: 48, withinS: 10 })).toThrow(/no bleeder is needed/);
  });
});

describe("dischargeCurve", () => {
  it("follows V0·e^(−t/RC) and spans 1.5 × the time to 60 V by default", () => {
    const curve = dischargeCurve({ resistanceOhm: 47e3, capacitanceF: 1e-3, fromV: 357.8, points: 31 });
    expect(curve).toHaveLength(31);
    expect(curve[0]).toEqual({ timeS: 0, volts: 357.8 });
    const last = curve.at(-1)!;
    expectRelClose(last.timeS, 1.5 * 83.92, 1e-3);
    expectRelClose(last.volts, 357.8 * Math.exp(-last.timeS / 47), 1e-12);
    // The 20th of 30 intervals is the 60 V crossing (1.5 × 20/30 = 1)
    expectRelClose(curve[20]!.volts, 60, 1e-9);
    for (let k = 1; k < curve.length; k++) expect(curve[k]!.volts).toBeLessThan(curve[k - 1]!.volts);
  });

  it("spans three time constants when the bus starts below the safe level", () => {
    const curve = dischargeCurve({ resistanceOhm: 1e3, capacitanceF: 1e-3, fromV: 40, points: 4 });
    expect(curve.map((p) => p.timeS)).toEqual([0, 1, 2, 3]);
    expectRelClose(curve[1]!.volts, 40 / Math.E, 1e-12);
  });
});
