import { describe, expect, it } from "vitest";
import { policyCheckRequestSchema, safetyDeclarationSchema, safetyNoteSchema } from "@/lib/validations/policy";
import { mainsKit, welderKit } from "./fixtures";

const issuePaths = (result: { success: boolean; error?: { issues: { path: PropertyKey[] }[] } }) =>
  result.error?.issues.map((i) => i.path.join(".")) ?? [];

describe("safetyDeclarationSchema", () => {
  it("accepts the worked example and a welding source", () => {
    expect(safetyDeclarationSchema.parse(mainsKit)).toEqual(mainsKit);
    expect(safetyDeclarationSchema.parse(welderKit)).toEqual(welderKit);
  });

  it("needs a mains voltage for a mains-connected item, reported with the other errors", () => {
    const result = safetyDeclarationSchema.safeParse({ mainsConnected: true, liveHeatsinks: "no" });
    expect(result.success).toBe(false);
    expect(issuePaths(result).sort()).toEqual(["liveHeatsinks", "mainsVrms", "weldingSource"]);
  });

  it("keeps figures in range: mains up to 1000 V (IEC 60038 low voltage), no negative capacitance", () => {
    expect(issuePaths(safetyDeclarationSchema.safeParse({ ...mainsKit, mainsVrms: 1500 }))).toEqual(["mainsVrms"]);
    expect(issuePaths(safetyDeclarationSchema.safeParse({ ...mainsKit, busCapacitanceF: -1e-3 }))).toEqual(["busCapacitanceF"]);
    expect(issuePaths(safetyDeclarationSchema.safeParse({ ...welderKit, ocvKind: "pulsed" }))).toEqual(["ocvKind"]);
  });
});

describe("safetyNoteSchema and policyCheckRequestSchema", () => {
  it("accepts a note with a wait and rejects an unknown topic", () => {
    expect(safetyNoteSchema.parse({ topic: "stored-charge", text: "Wait.", waitSeconds: 90 }).waitSeconds).toBe(90);
    expect(issuePaths(safetyNoteSchema.safeParse({ topic: "radiation", text: "x" }))).toEqual(["topic"]);
  });

  it("defaults notes to none and nests declaration errors under their path", () => {
    expect(policyCheckRequestSchema.parse({ declaration: mainsKit }).notes).toEqual([]);
    const result = policyCheckRequestSchema.safeParse({ declaration: { ...mainsKit, bleederOhm: "47k" }, notes: [{ topic: "x" }] });
    expect(issuePaths(result).sort()).toEqual(["declaration.bleederOhm", "notes.0.text", "notes.0.topic"]);
  });
});
