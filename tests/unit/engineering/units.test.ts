import * as math from "mathjs";
import { describe, expect, it } from "vitest";
import { convertUnit } from "@/lib/engineering";
import { expectFieldError, expectRelClose } from "./support";

// Each conversion is cross-checked against mathjs units (our spelling → mathjs spelling).
const CASES: [number, string, string, string, string][] = [
  [1500, "mV", "V", "mV", "V"],
  [0.4, "kV", "V", "kV", "V"],
  [358, "V", "kV", "V", "kV"],
  [250, "mA", "A", "mA", "A"],
  [65, "kHz", "Hz", "kHz", "Hz"],
  [0.1, "MHz", "kHz", "MHz", "kHz"],
  [83.9, "s", "ms", "s", "ms"],
  [4.2, "µs", "ns", "us", "ns"],
  [750, "ns", "µs", "ns", "us"],
  [47, "kΩ", "Ω", "kohm", "ohm"],
  [2.2, "MΩ", "kΩ", "Mohm", "kohm"],
  [2.2, "µF", "nF", "uF", "nF"],
  [1000, "µF", "F", "uF", "F"],
  [470, "nF", "µF", "nF", "uF"],
  [330, "µH", "mH", "uH", "mH"],
  [1.5, "H", "µH", "H", "uH"],
  [25, "°C", "K", "degC", "K"],
  [373.15, "K", "°C", "K", "degC"],
  [-12, "V", "mV", "V", "mV"],
];

describe("convertUnit (cross-checked with mathjs unit())", () => {
  for (const [value, from, to, mathFrom, mathTo] of CASES) {
    it(`${value} ${from} → ${to}`, () => {
      expectRelClose(convertUnit(value, from, to), math.unit(value, mathFrom).toNumber(mathTo), 1e-12);
    });
  }

  it("percent is hundredths", () => {
    expect(convertUnit(10, "%", "%")).toBe(10);
  });

  it("gives clean decimals, not binary noise (2.2 µF is 2200 nF)", () => {
    expect(convertUnit(2.2, "µF", "nF")).toBe(2200);
    expect(convertUnit(0.1, "MHz", "kHz")).toBe(100);
  });

  it("accepts the spellings people type: u for µ, Greek mu, ohm, degC", () => {
    expect(convertUnit(2.2, "uF", "nF")).toBe(2200);
    expect(convertUnit(2.2, "\u03bcF", "nF")).toBe(2200);
    expect(convertUnit(47, "kohm", "\u2126")).toBe(47_000);
    expect(convertUnit(20, "degC", "K")).toBe(293.15);
  });

  it("refuses incompatible units with a clear error on toUnit", () => {
    expect(() => convertUnit(1, "V", "A")).toThrowError(/different things/);
    expectFieldError(() => convertUnit(1, "µF", "mH"), "toUnit");
    expect(() => convertUnit(1, "furlong", "V")).toThrowError(/not a unit/);
  });
});

describe("convertUnit for times in minutes", () => {
  it("2 min is 120 s and 90 s is 1.5 min (mathjs)", () => {
    expect(convertUnit(2, "min", "s")).toBe(math.unit(2, "minute").toNumber("s"));
    expect(convertUnit(90, "s", "min")).toBe(math.unit(90, "s").toNumber("minute"));
  });
});
