// Figures as the capture pages print them: engineering SI prefixes (SI Brochure, 9th ed., table 7)
// with four significant digits, and levels to a ten-thousandth of their signal's swing.
import { describe, expect, it } from "vitest";
import { formatFigure, formatLevelOf } from "@/components/captures/format";
import { figureRow } from "@/lib/captures/figures";

describe("capture figures", () => {
  it("take an SI prefix per value", () => {
    expect(formatFigure(39_996.2, figureRow("frequencyHz"), "V")).toBe("40 kHz");
    expect(formatFigure(25.0031e-6, figureRow("periodS"), "V")).toBe("25 µs");
    expect(formatFigure(320.54e-9, figureRow("riseTimeS"), "V")).toBe("320.5 ns");
    expect(formatFigure(43.987, figureRow("dutyCyclePct"), "V")).toBe("43.99 %");
    expect(formatFigure(null, figureRow("overshootPct"), "V")).toBe("—");
  });

  it("print a level in the channel's unit, at the resolution of its swing", () => {
    // A 15 V swing resolves to 10 mV: noise of half a millivolt around 0 V is 0 V.
    expect(formatLevelOf(-0.000564, 15, "V")).toBe("0 V");
    expect(formatLevelOf(14.99932, 15, "V")).toBe("15 V");
    expect(formatLevelOf(0.1234, 0.25, "A")).toBe("123.4 mA");
    expect(formatFigure(-0.000564, figureRow("lowV"), null, 15)).toBe("0 V");
    // Without a swing, four significant digits as for any figure.
    expect(formatLevelOf(-0.000564, null, "V")).toBe("−564 µV");
  });
});
