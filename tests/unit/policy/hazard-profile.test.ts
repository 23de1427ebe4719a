import { describe, expect, it } from "vitest";
import { CURRENT_POLICY_REVISION, SAFETY_TOPICS, hazardProfile } from "@/lib/policy";
import { expectFieldError, expectRelClose } from "../engineering/support";
import { mainsKit, welderKit } from "./fixtures";

describe("SAFETY_TOPICS", () => {
  it("lists the eight topics with the product's keys and labels", () => {
    expect(SAFETY_TOPICS.map((t) => [t.key, t.label])).toEqual([
      ["mains-isolation", "Mains isolation"],
      ["stored-charge", "Stored charge"],
      ["first-power-up", "First power-up"],
      ["protective-earth", "Protective earth"],
      ["live-heatsinks", "Live heatsinks"],
      ["output-voltage", "Output voltage"],
      ["arc-hazards", "Arc, fume and fire"],
      ["codes-and-competence", "Local codes and competence"],
    ]);
  });

  it("asks first power-up notes for a series lamp of about 100 W (common practice)", () => {
    expect(SAFETY_TOPICS.find((t) => t.key === "first-power-up")!.prompt).toMatch(/series lamp of about 100 W/);
  });
});

describe("hazardProfile", () => {
  it("computes the worked example: 357.8 V, 64 J, 0.358 C, 83.9 s (IEC 60038 230 V +10 %)", () => {
    const p = hazardProfile(mainsKit);
    expectRelClose(p.busPeakV, 357.8, 1e-4);
    expectRelClose(p.storedEnergyJ, 64.0, 1e-3);
    expectRelClose(p.storedChargeC, 0.3578, 1e-4);
    expectRelClose(p.dischargeS!, 83.9, 1e-3);
    expect(p.ocvLimitV).toBeNull();
    expect(p.requiredTopics).toEqual([
      "mains-isolation",
      "stored-charge",
      "first-power-up",
      "protective-earth",
      "codes-and-competence",
    ]);
  });

  it("has no discharge time without a bleeder (absent or 0 Ω)", () => {
    expect(hazardProfile({ ...mainsKit, bleederOhm: undefined }).dischargeS).toBeNull();
    expect(hazardProfile({ ...mainsKit, bleederOhm: 0 }).dischargeS).toBeNull();
  });

  it("defaults the tolerance to IEC 60038's +10 %", () => {
    expect(hazardProfile({ ...mainsKit, mainsTolerance: undefined }).busPeakV).toBe(hazardProfile(mainsKit).busPeakV);
  });

  it("gives a non-mains item with no bus zeros and only the local-codes topic", () => {
    const p = hazardProfile({ mainsConnected: false, liveHeatsinks: false, weldingSource: false });
    expect(p).toMatchObject({ busPeakV: 0, storedEnergyJ: 0, storedChargeC: 0, dischargeS: null, ocvLimitV: null });
    expect(p.requiredTopics).toEqual(["codes-and-competence"]);
  });

  it("requires stored charge only above 45 µC (IEC 61010-1, from memory)", () => {
    // 100 nF at 357.8 V is 35.8 µC; 130 nF is 46.5 µC
    expect(hazardProfile({ ...mainsKit, busCapacitanceF: 100e-9 }).requiredTopics).not.toContain("stored-charge");
    expect(hazardProfile({ ...mainsKit, busCapacitanceF: 130e-9 }).requiredTopics).toContain("stored-charge");
  });

  it("requires stored charge only above 60 V DC (IEC 62368-1 ES1 / IEC 61010-1, from memory), however large the charge", () => {
    // 38 V RMS +10 % peaks at 59.1 V; 40 V RMS at 62.2 V
    const big = { ...mainsKit, busCapacitanceF: 0.1 };
    expect(hazardProfile({ ...big, mainsVrms: 38 }).requiredTopics).not.toContain("stored-charge");
    expect(hazardProfile({ ...big, mainsVrms: 40 }).requiredTopics).toContain("stored-charge");
  });

  it("adds live heatsinks, output voltage and arc hazards from the declaration", () => {
    const p = hazardProfile(welderKit);
    expect(p.requiredTopics).toEqual([
      "mains-isolation",
      "stored-charge",
      "first-power-up",
      "protective-earth",
      "live-heatsinks",
      "output-voltage",
      "arc-hazards",
      "codes-and-competence",
    ]);
  });

  it("takes the OCV limit from IEC 60974-1 (from memory): DC 113 V peak; AC 80 V / 48 V RMS", () => {
    expect(hazardProfile(welderKit).ocvLimitV).toBe(113);
    expect(hazardProfile({ ...welderKit, environment: "increased-hazard" }).ocvLimitV).toBe(113);
    expect(hazardProfile({ ...welderKit, ocvKind: "ac" }).ocvLimitV).toBe(80);
    expect(hazardProfile({ ...welderKit, ocvKind: "ac", environment: "increased-hazard" }).ocvLimitV).toBe(48);
    expect(hazardProfile(welderKit).ocv).toMatchObject({ declaredV: 62, withinLimit: true, basis: "peak" });
  });

  it("computes discharge to the revision's safe voltage", () => {
    const stricter = { ...CURRENT_POLICY_REVISION, safeVoltageV: 30 };
    expectRelClose(hazardProfile(mainsKit, stricter).dischargeS!, 47 * Math.log(357.796 / 30), 1e-5);
  });

  it("refuses a mains-connected declaration without a voltage, naming the field", () => {
    expectFieldError(() => hazardProfile({ ...mainsKit, mainsVrms: undefined }), "mainsVrms");
    expectFieldError(() => hazardProfile({ ...mainsKit, busCapacitanceF: -1 }), "busCapacitanceF");
    expectFieldError(() => hazardProfile({ ...mainsKit, mainsTolerance: 2 }), "mainsTolerance");
    expectFieldError(() => hazardProfile({ ...welderKit, openCircuitV: Number.NaN }), "openCircuitV");
  });
});
