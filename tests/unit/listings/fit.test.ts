// Which kits a magnetic fits. The rule is the product brief's (subtype matches, L ≥ the kit's
// minimum, rated current ≥ the current it states); the figures are invented but plausible for an
// inverter welder's output choke.
import { describe, expect, it } from "vitest";
import { fitsRequirement, kitsFittedBy, type KitRequirement, type MagneticOffer } from "@/lib/listings/fit";

const choke: MagneticOffer = { subtype: "choke", inductanceH: 45e-6, ratedCurrentA: 130 };
const needs = (r: Partial<KitRequirement>): KitRequirement => ({ subtype: "choke", label: "Output choke", minInductanceH: 40e-6, atCurrentA: 120, ...r });

describe("fitsRequirement", () => {
  it("fits when subtype, inductance and current all meet the requirement", () => {
    expect(fitsRequirement(choke, needs({}))).toEqual({ fits: true });
  });

  it("fits at exactly the stated figures (≥, not >), even a last bit short after a trip through floating point", () => {
    expect(fitsRequirement({ subtype: "choke", inductanceH: 40e-6, ratedCurrentA: 120 }, needs({})).fits).toBe(true);
    expect(fitsRequirement({ subtype: "choke", inductanceH: 40e-6 * (1 - 1e-12), ratedCurrentA: 120 }, needs({})).fits).toBe(true);
    expect(fitsRequirement({ subtype: "choke", inductanceH: 39.9e-6, ratedCurrentA: 120 }, needs({})).fits).toBe(false);
  });

  it("does not fit another subtype, too little inductance or too little current", () => {
    expect(fitsRequirement(choke, needs({ subtype: "transformer" }))).toEqual({ fits: false, because: "subtype" });
    expect(fitsRequirement(choke, needs({ minInductanceH: 50e-6 }))).toEqual({ fits: false, because: "inductance" });
    expect(fitsRequirement(choke, needs({ atCurrentA: 140 }))).toEqual({ fits: false, because: "current" });
  });

  it("ignores a figure the kit does not state, and refuses a magnetic whose figure is unknown", () => {
    expect(fitsRequirement(choke, needs({ atCurrentA: null })).fits).toBe(true);
    expect(fitsRequirement({ ...choke, inductanceH: null }, needs({}))).toEqual({ fits: false, because: "unknown-figures" });
    expect(fitsRequirement({ ...choke, inductanceH: null }, needs({ minInductanceH: null })).fits).toBe(true);
  });
});

describe("kitsFittedBy", () => {
  it("lists each fitting kit once, with the requirement it matched", () => {
    const kits = [
      { id: "welder", requirements: [needs({ subtype: "transformer", label: "Main transformer" }), needs({})] },
      { id: "heater", requirements: [needs({ minInductanceH: 200e-6, label: "Tank choke" })] },
      { id: "charger", requirements: [needs({ label: "Choke A" }), needs({ label: "Choke B", atCurrentA: 10 })] },
    ];
    const fitted = kitsFittedBy(choke, kits);
    expect(fitted.map((f) => [f.kit.id, f.requirement.label])).toEqual([
      ["welder", "Output choke"],
      ["charger", "Choke A"],
    ]);
  });
});
