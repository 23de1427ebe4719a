import { describe, expect, it } from "vitest";
import { CURRENT_POLICY_REVISION, checkSafetySheet, countWords, type SafetyFinding } from "@/lib/policy";
import { fullNotes, mainsKit, welderKit } from "./fixtures";

const codes = (findings: SafetyFinding[]) => findings.map((f) => `${f.topic}:${f.code}`);

describe("checkSafetySheet", () => {
  it("is clear for a complete sheet, against the current revision by default", () => {
    const result = checkSafetySheet({ declaration: welderKit, notes: fullNotes() });
    expect(result.status).toBe("clear");
    expect(result.findings).toEqual([]);
    expect(result.revision).toBe(CURRENT_POLICY_REVISION.revision);
    expect(result.profile.requiredTopics).toHaveLength(8);
  });

  it("ignores notes on topics the profile does not require", () => {
    const notes = fullNotes().filter((n) => ["mains-isolation", "stored-charge", "first-power-up", "protective-earth", "codes-and-competence"].includes(n.topic));
    expect(checkSafetySheet({ declaration: mainsKit, notes }).status).toBe("clear");
  });

  it("reports missing for each required topic without a note (an empty note counts as missing)", () => {
    const notes = fullNotes({ "live-heatsinks": { text: "   " } }).filter(
      (n) => n.topic !== "protective-earth" && n.topic !== "arc-hazards",
    );
    const result = checkSafetySheet({ declaration: welderKit, notes });
    expect(result.status).toBe("incomplete");
    expect(codes(result.findings)).toEqual(["protective-earth:missing", "live-heatsinks:missing", "arc-hazards:missing"]);
    expect(result.findings[0]!.message).toMatch(/Add a note on Protective earth/);
  });

  it("has at least the local-codes topic for any listing", () => {
    const result = checkSafetySheet({ declaration: { mainsConnected: false, liveHeatsinks: false, weldingSource: false }, notes: [] });
    expect(codes(result.findings)).toEqual(["codes-and-competence:missing"]);
  });

  it("reports too-short below the revision's minimum words, with the counts", () => {
    const result = checkSafetySheet({
      declaration: mainsKit,
      notes: fullNotes({ "mains-isolation": { text: "Unplug it first." } }),
    });
    expect(codes(result.findings)).toEqual(["mains-isolation:too-short"]);
    expect(result.findings[0]!.message).toContain("3 words");
    expect(result.findings[0]!.message).toContain(`at least ${CURRENT_POLICY_REVISION.minWords}`);
  });

  it("reports wait-missing with the figures and the wait to state (worked example: 64 J at 358 V, 84 s)", () => {
    const result = checkSafetySheet({ declaration: mainsKit, notes: fullNotes({ "stored-charge": { waitSeconds: undefined } }) });
    expect(codes(result.findings)).toEqual(["stored-charge:wait-missing"]);
    const message = result.findings[0]!.message;
    expect(message).toContain("64 J at 358 V");
    expect(message).toContain("47 kΩ");
    expect(message).toContain("at least 84 s");
  });

  it("reports wait-too-short below the computed 83.9 s and accepts a wait at or above it", () => {
    const short = checkSafetySheet({ declaration: mainsKit, notes: fullNotes({ "stored-charge": { waitSeconds: 83 } }) });
    expect(codes(short.findings)).toEqual(["stored-charge:wait-too-short"]);
    expect(short.findings[0]!.message).toMatch(/wait 83 s.*at least 84 s/);
    expect(checkSafetySheet({ declaration: mainsKit, notes: fullNotes({ "stored-charge": { waitSeconds: 84 } }) }).status).toBe("clear");
  });

  it("without a bleeder, asks for a hand-discharge method (discharge-method-missing) instead of a wait", () => {
    const noBleeder = { ...mainsKit, bleederOhm: undefined };
    const vague = "Be careful with the capacitors after switching off because they can hold a dangerous charge for a while.";
    const result = checkSafetySheet({ declaration: noBleeder, notes: fullNotes({ "stored-charge": { text: vague, waitSeconds: undefined } }) });
    expect(codes(result.findings)).toEqual(["stored-charge:discharge-method-missing"]);
    expect(result.findings[0]!.message).toContain("64 J at 358 V");

    const method =
      "After unplugging, discharge the bus through a 2 kΩ 10 W resistor held in an insulated probe, then confirm below 60 V with a meter.";
    expect(checkSafetySheet({ declaration: noBleeder, notes: fullNotes({ "stored-charge": { text: method } }) }).status).toBe("clear");
  });

  it("blocks a welding source whose OCV is over the IEC 60974-1 limit (from memory: 113 V DC peak)", () => {
    const result = checkSafetySheet({ declaration: { ...welderKit, openCircuitV: 130 }, notes: fullNotes() });
    expect(result.status).toBe("blocked");
    expect(codes(result.findings)).toEqual(["output-voltage:ocv-over-limit"]);
    expect(result.findings[0]!.message).toMatch(/130 V DC is above the 113 V peak limit/);
  });

  it("keeps a 60 V inverter OCV clear, well under the DC limit (common practice)", () => {
    expect(checkSafetySheet({ declaration: { ...welderKit, openCircuitV: 60 }, notes: fullNotes() }).status).toBe("clear");
  });

  it("compares AC OCV with the RMS limit: 75 V RMS passes in a normal environment, not under increased hazard", () => {
    const ac = { ...welderKit, ocvKind: "ac" as const, openCircuitV: 75 };
    expect(checkSafetySheet({ declaration: ac, notes: fullNotes() }).status).toBe("clear");
    expect(checkSafetySheet({ declaration: { ...ac, environment: "increased-hazard" }, notes: fullNotes() }).status).toBe("blocked");
  });

  it("blocks even when other findings exist, and asks for an OCV that was never declared", () => {
    expect(checkSafetySheet({ declaration: { ...welderKit, openCircuitV: 130 }, notes: [] }).status).toBe("blocked");
    const undeclared = checkSafetySheet({ declaration: { ...welderKit, openCircuitV: undefined }, notes: fullNotes() });
    expect(undeclared.status).toBe("incomplete");
    expect(codes(undeclared.findings)).toEqual(["output-voltage:ocv-missing"]);
  });

  it("reads several notes on one topic as one", () => {
    const notes = fullNotes().filter((n) => n.topic !== "mains-isolation");
    notes.push({ topic: "mains-isolation", text: "Unplug the build at the wall before any work." });
    notes.push({ topic: "mains-isolation", text: "The input terminals stay live while plugged in." });
    expect(checkSafetySheet({ declaration: mainsKit, notes }).status).toBe("clear");
  });
});

describe("countWords", () => {
  it("counts words, not punctuation or spacing", () => {
    expect(countWords("  Wait 90 s — then check with a meter.  ")).toBe(8);
    expect(countWords("")).toBe(0);
  });
});
