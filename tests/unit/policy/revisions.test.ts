import { describe, expect, it } from "vitest";
import {
  CURRENT_POLICY_REVISION,
  POLICY_REVISIONS,
  checkSafetySheet,
  getPolicyRevision,
  type PolicyRevision,
} from "@/lib/policy";
import { policyRevisionSchema } from "@/lib/validations/policy";
import { fullNotes, mainsKit, welderKit } from "./fixtures";

describe("policy revisions", () => {
  it("the current revision is the last published one, and can be looked up by number", () => {
    expect(CURRENT_POLICY_REVISION).toBe(POLICY_REVISIONS.at(-1));
    expect(getPolicyRevision(CURRENT_POLICY_REVISION.revision)).toBe(CURRENT_POLICY_REVISION);
    expect(getPolicyRevision(999)).toBeUndefined();
  });

  it("revision 1 uses 45 µC (IEC 61010-1), 60 V DC (IEC 62368-1 ES1 / IEC 61010-1) and a wait of at least the discharge time — from memory", () => {
    const r1 = getPolicyRevision(1)!;
    expect(r1.storedChargeThresholdC).toBe(45e-6);
    expect(r1.safeVoltageV).toBe(60);
    expect(r1.waitMarginFactor).toBe(1);
  });

  it("every built-in revision is valid data that the database schema accepts", () => {
    for (const r of POLICY_REVISIONS) expect(policyRevisionSchema.parse(r)).toEqual(r);
    const numbers = POLICY_REVISIONS.map((r) => r.revision);
    expect(new Set(numbers).size).toBe(numbers.length);
  });
});

describe("a stricter revision turns a clear sheet incomplete", () => {
  const clearNotes = fullNotes(); // 20 words each, 90 s wait
  const check = (revision: PolicyRevision) => checkSafetySheet({ declaration: mainsKit, notes: clearNotes, revision });

  it("starts clear under the current revision", () => {
    expect(check(CURRENT_POLICY_REVISION).status).toBe("clear");
  });

  it("more minimum words", () => {
    const r = { ...CURRENT_POLICY_REVISION, revision: 2, minWords: 25 };
    const result = check(r);
    expect(result.status).toBe("incomplete");
    expect(result.revision).toBe(2);
    expect(result.findings.every((f) => f.code === "too-short")).toBe(true);
    expect(result.findings[0]!.message).toContain("policy revision 2 asks for at least 25");
  });

  it("a per-topic minimum in the topic rules", () => {
    const r: PolicyRevision = {
      ...CURRENT_POLICY_REVISION,
      revision: 2,
      topicRules: CURRENT_POLICY_REVISION.topicRules.map((rule) =>
        rule.topic === "stored-charge" ? { ...rule, minWords: 30 } : rule,
      ),
    };
    expect(check(r).findings.map((f) => `${f.topic}:${f.code}`)).toEqual(["stored-charge:too-short"]);
  });

  it("a wait margin: 1.5 × 83.9 s needs 126 s, so 90 s is too short", () => {
    const result = check({ ...CURRENT_POLICY_REVISION, revision: 2, waitMarginFactor: 1.5 });
    expect(result.findings.map((f) => f.code)).toEqual(["wait-too-short"]);
    expect(result.findings[0]!.message).toContain("at least 126 s");
  });

  it("a new topic rule: live heatsinks required for every mains item", () => {
    const r: PolicyRevision = {
      ...CURRENT_POLICY_REVISION,
      revision: 2,
      topicRules: [...CURRENT_POLICY_REVISION.topicRules, { topic: "live-heatsinks", when: "mains-connected" }],
    };
    const notes = clearNotes.filter((n) => n.topic !== "live-heatsinks");
    const result = checkSafetySheet({ declaration: mainsKit, notes, revision: r });
    expect(result.findings.map((f) => `${f.topic}:${f.code}`)).toEqual(["live-heatsinks:missing"]);
  });

  it("a lower safe voltage lengthens the required wait (47 kΩ·1000 µF·ln(357.8/30) = 116.5 s)", () => {
    const result = check({ ...CURRENT_POLICY_REVISION, revision: 2, safeVoltageV: 30 });
    expect(result.findings.map((f) => f.code)).toEqual(["wait-too-short"]);
    expect(result.findings[0]!.message).toContain("at least 117 s");
  });

  it("keeps the local-codes topic even in a revision whose rules forget it", () => {
    const r: PolicyRevision = {
      ...CURRENT_POLICY_REVISION,
      revision: 2,
      topicRules: CURRENT_POLICY_REVISION.topicRules.filter((rule) => rule.topic !== "codes-and-competence"),
    };
    const result = checkSafetySheet({ declaration: mainsKit, notes: [], revision: r });
    expect(result.profile.requiredTopics).toContain("codes-and-competence");
    expect(result.findings.map((f) => f.topic)).toContain("codes-and-competence");
  });

  it("works on a revision that came from JSON, as one stored in the database would", () => {
    const stored = JSON.parse(JSON.stringify({ ...CURRENT_POLICY_REVISION, revision: 3, minWords: 40 }));
    const revision = policyRevisionSchema.parse(stored);
    expect(checkSafetySheet({ declaration: welderKit, notes: fullNotes(), revision }).status).toBe("incomplete");
  });

  it("a hand-discharge keyword list that drops the lamp (a lamp discharges 1000 µF in about a second: 529 Ω hot, common practice)", () => {
    const lampNote = "Discharge the bus through a 100 W incandescent lamp on leads until it goes dark, then check with a meter.";
    const noBleeder = { ...mainsKit, bleederOhm: undefined };
    const notes = fullNotes({ "stored-charge": { text: lampNote, waitSeconds: undefined } });
    expect(checkSafetySheet({ declaration: noBleeder, notes }).status).toBe("clear");
    const r = { ...CURRENT_POLICY_REVISION, revision: 2, handDischarge: { actions: ["discharg"], means: ["resistor", "probe", "tool"] } };
    expect(checkSafetySheet({ declaration: noBleeder, notes, revision: r }).findings.map((f) => f.code)).toEqual(["discharge-method-missing"]);
  });
});
