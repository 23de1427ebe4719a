import * as math from "mathjs";
import { describe, expect, it } from "vitest";
import { toCheckpointUnit, unitChoices } from "@/lib/bench/unit-choices";

// Our unit spelling → mathjs's, so each offered unit's factor is checked against mathjs unit().
const MATHJS: Record<string, string> = {
  "µV": "uV", mV: "mV", V: "V", kV: "kV",
  "µA": "uA", mA: "mA", A: "A", kA: "kA",
  Hz: "Hz", kHz: "kHz", MHz: "MHz",
  pF: "pF", nF: "nF", "µF": "uF", uF: "uF", mF: "mF", F: "F",
  "mΩ": "mohm", "Ω": "ohm", "kΩ": "kohm", "MΩ": "Mohm",
  "°C": "degC", K: "K",
};

describe("unitChoices: the units the reading form offers, per quantity", () => {
  // Families and their order follow the SI prefixes (SI Brochure, 9th ed., table 7): smallest first.
  const families: [string, string[]][] = [
    ["kHz", ["Hz", "kHz", "MHz"]],
    ["Hz", ["Hz", "kHz", "MHz"]],
    ["V", ["µV", "mV", "V", "kV"]],
    ["mA", ["µA", "mA", "A", "kA"]],
    ["Ω", ["mΩ", "Ω", "kΩ", "MΩ"]],
    ["µF", ["pF", "nF", "µF", "mF", "F"]],
    ["°C", ["°C", "K"]],
    ["%", ["%"]],
  ];
  for (const [unit, expected] of families) {
    it(`a checkpoint in ${unit} offers ${expected.join(", ")}`, () => {
      expect(unitChoices(unit).units).toEqual(expected);
    });
  }

  it("keeps the checkpoint's own spelling (uF for µF) so the default choice matches it", () => {
    expect(unitChoices("uF").units).toEqual(["pF", "nF", "uF", "mF", "F"]);
  });

  it("offers a unit the converter does not know alone, with no quantity", () => {
    expect(unitChoices("rpm")).toEqual({ units: ["rpm"], quantity: null });
  });

  it("every offered unit converts to the checkpoint's unit by the factor mathjs gives", () => {
    for (const unit of ["kHz", "V", "mA", "µF", "kΩ", "°C"]) {
      for (const offered of unitChoices(unit).units) {
        const converted = toCheckpointUnit(3, offered, unit);
        if (!converted.ok) throw new Error(converted.message);
        const expected = math.unit(3, MATHJS[offered]!).toNumber(MATHJS[unit]!);
        expect(Math.abs(converted.value - expected)).toBeLessThanOrEqual(Math.abs(expected) * 1e-12);
      }
    }
  });
});

describe("toCheckpointUnit", () => {
  it("converts 41 000 Hz to 41 kHz and 0.29 kV to 290 V (cross-checked with mathjs)", () => {
    expect(toCheckpointUnit(41_000, "Hz", "kHz")).toEqual({ ok: true, value: math.unit(41_000, "Hz").toNumber("kHz") });
    expect(toCheckpointUnit(0.29, "kV", "V")).toEqual({ ok: true, value: 290 });
  });

  it("passes a reading in the checkpoint's own unit unchanged, even one the converter does not know", () => {
    expect(toCheckpointUnit(1450, "rpm", "rpm")).toEqual({ ok: true, value: 1450 });
  });

  it("refuses a unit of another quantity with words naming both and the units to use", () => {
    const refused = toCheckpointUnit(41, "V", "kHz");
    expect(refused.ok).toBe(false);
    if (refused.ok) return;
    expect(refused.message).toBe("V measures voltage, but this checkpoint measures frequency in kHz. Enter the reading in one of Hz, kHz, MHz.");
  });

  it("refuses units it does not know, in either direction", () => {
    expect(toCheckpointUnit(5, "furlong", "V")).toEqual({ ok: false, message: "furlong is not a unit Fluxyard knows. Enter the reading in one of µV, mV, V, kV." });
    expect(toCheckpointUnit(5, "V", "rpm")).toEqual({ ok: false, message: "This checkpoint is recorded in rpm; enter the reading in rpm." });
  });
});
