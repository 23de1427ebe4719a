import { describe, expect, it } from "vitest";
import { acknowledgementHazards, acknowledgementText, needsAcknowledgement } from "@/lib/checkout/hazards";
import type { SafetyDeclaration } from "@/lib/policy";

// Figures checked by hand from the formulas in the product brief (which are the textbook ones):
//   bus peak √2 · 230 V · 1.10 = 357.8 V; stored energy ½ · 1000 µF · (357.8 V)² = 64.0 J;
//   discharge to 60 V through 47 kΩ: R C ln(V0/60) = 47 s · ln(357.8/60) = 47 · 1.7857 = 83.9 s (rounded up: 84 s).
const welder: SafetyDeclaration = {
  mainsConnected: true,
  mainsVrms: 230,
  mainsTolerance: 0.1,
  busCapacitanceF: 1000e-6,
  bleederOhm: 47_000,
  liveHeatsinks: true,
  weldingSource: true,
  openCircuitV: 62,
  ocvKind: "dc",
  environment: "normal",
};

describe("acknowledgementHazards", () => {
  it("names mains, bus peak and energy, the wait, live heatsinks and the welding OCV of a welder kit", () => {
    expect(acknowledgementHazards(welder)).toEqual([
      "connects to 230 V mains",
      "its bus reaches 358 V and stores 64 J",
      "the bus needs 84 s to fall below 60 V after unplugging",
      "heatsinks are live",
      "it is a welding source with 62 V open-circuit output",
    ]);
  });

  it("says the bus must be discharged by hand when there is no bleeder", () => {
    const hazards = acknowledgementHazards({ ...welder, bleederOhm: 0 });
    expect(hazards).toContain("it has no bleeder, so the bus must be discharged by hand");
  });

  it("leaves out the wait where the charge is below the policy's 45 µC threshold: 10 nF at 357.8 V holds 3.6 µC and ½CV² = 0.64 mJ", () => {
    const small = acknowledgementHazards({ mainsConnected: true, mainsVrms: 230, busCapacitanceF: 10e-9, liveHeatsinks: false, weldingSource: false });
    expect(small).toEqual(["connects to 230 V mains", "its bus reaches 358 V and stores 0.64 mJ"]);
  });

  it("120 V mains: √2 · 120 · 1.1 = 186.7 V → 187 V", () => {
    expect(acknowledgementHazards({ mainsConnected: true, mainsVrms: 120, liveHeatsinks: false, weldingSource: false })).toEqual([
      "connects to 120 V mains",
      "its bus reaches 187 V",
    ]);
  });

  it("asks nothing of items that never touch mains", () => {
    const lowVoltage: SafetyDeclaration = { mainsConnected: false, liveHeatsinks: false, weldingSource: false };
    expect(needsAcknowledgement(lowVoltage)).toBe(false);
    expect(acknowledgementHazards(lowVoltage)).toEqual([]);
  });
});

describe("acknowledgementText", () => {
  it("reads as one sentence naming the kind and the sheet revision (the wording of the issue's example)", () => {
    const text = acknowledgementText({ kind: "kit", magneticSubtype: null, sheetRevision: 3 }, [
      "connects to 230 V mains",
      "its bus reaches 358 V and stores 64 J",
      "heatsinks are live",
      "it is a welding source with 62 V open-circuit output",
    ]);
    expect(text).toBe(
      "This kit connects to 230 V mains; its bus reaches 358 V and stores 64 J; heatsinks are live; it is a welding source with 62 V open-circuit output. I have read its safety sheet (revision 3).",
    );
  });

  it("names a magnetic by its subtype", () => {
    expect(acknowledgementText({ kind: "magnetic", magneticSubtype: "current-transformer", sheetRevision: 1 }, ["connects to 230 V mains"])).toBe(
      "This current transformer connects to 230 V mains. I have read its safety sheet (revision 1).",
    );
  });
});
