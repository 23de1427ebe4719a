import { describe, expect, it } from "vitest";
import { evaluateMains, MAINS_DEFAULTS } from "@/components/workbench/mains-model";
import { evaluateInductor, INDUCTOR_DEFAULTS } from "@/components/workbench/inductor-model";
import { evaluateTransformer, TRANSFORMER_DEFAULTS } from "@/components/workbench/transformer-model";

// The workbench forms take practical units as typed text; these checks hold their results to the
// handbook formulas computed here by hand, so a unit slip in a form (µF vs F, kΩ vs Ω) shows up.

describe("mains calculator form", () => {
  it("230 V +10 %, 680 µF, 100 kΩ: bus peak √2·Vrms·(1+tol), ½CV², RC·ln(V0/60)", () => {
    const outcome = evaluateMains(MAINS_DEFAULTS);
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    const peak = Math.SQRT2 * 230 * 1.1; // 357.8 V, the figure PRODUCT.md quotes for 230 V +10 %
    expect(outcome.result.busPeakV).toBeCloseTo(peak, 6);
    expect(outcome.result.energyJ).toBeCloseTo(0.5 * 680e-6 * peak ** 2, 6); // ≈ 43.5 J
    expect(outcome.result.dischargeS!).toBeCloseTo(100e3 * 680e-6 * Math.log(peak / 60), 6); // ≈ 121 s
    expect(outcome.result.waitTooLong).toBe(true); // the default 60 s target is exceeded
  });

  it("an empty or non-numeric field is an error on that field, never NaN figures", () => {
    const empty = evaluateMains({ ...MAINS_DEFAULTS, tolerance: "" });
    expect(empty.ok).toBe(false);
    if (!empty.ok) expect(Object.keys(empty.fieldErrors)).toContain("tolerance");
    const garbage = evaluateMains({ ...MAINS_DEFAULTS, capacitanceF: "lots" });
    expect(garbage.ok).toBe(false);
    if (!garbage.ok) expect(Object.keys(garbage.fieldErrors)).toContain("capacitanceF");
  });
});

describe("inductor calculator form", () => {
  it("L = AL·N²: 160 nH/N² and 24 turns give 92.16 µH (AL definition, ferrite datasheet convention)", () => {
    const outcome = evaluateInductor(INDUCTOR_DEFAULTS);
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    expect(outcome.result.inductanceH).toBeCloseTo(160e-9 * 24 ** 2, 12);
    // B = L·I/(N·Ae) (Erickson & Maksimović, ch. 13): 92.16 µH · 15 A / (24 · 240 mm²) = 0.24 T
    expect(outcome.result.peakFluxT).toBeCloseTo((92.16e-6 * 15) / (24 * 240e-6), 9);
  });
});

describe("transformer calculator form", () => {
  it("square wave: N = V/(4·f·Ae·B) (EMF equation with Kf = 4.0; McLyman ch. 1)", () => {
    const outcome = evaluateTransformer(TRANSFORMER_DEFAULTS);
    expect(outcome.ok).toBe(true);
    if (!outcome.ok) return;
    // 170 V, 40 kHz, 240 mm², 0.15 T
    expect(outcome.result.primaryTurns).toBeCloseTo(170 / (4 * 40e3 * 240e-6 * 0.15), 6);
    expect(outcome.result.primaryTurnsRounded).toBe(Math.ceil(170 / (4 * 40e3 * 240e-6 * 0.15)));
  });
});
