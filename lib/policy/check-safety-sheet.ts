import { hazardProfile, type HazardProfile, type SafetyDeclaration } from "./hazard-profile";
import { coulombs, joules, ohms, seconds, volts } from "./format";
import { CURRENT_POLICY_REVISION, type PolicyRevision } from "./revisions";
import { SAFETY_TOPIC_KEYS, topicLabel, topicPrompt, type SafetyTopicKey } from "./topics";

export interface SafetyNote {
  topic: SafetyTopicKey;
  text: string;
  /** the wait before touching, for the stored-charge topic, s */
  waitSeconds?: number;
}

export const FINDING_CODES = [
  "missing",
  "too-short",
  "wait-missing",
  "wait-too-short",
  "discharge-method-missing",
  "ocv-missing",
  "ocv-over-limit",
] as const;
export type FindingCode = (typeof FINDING_CODES)[number];

export interface SafetyFinding {
  topic: SafetyTopicKey;
  code: FindingCode;
  message: string;
}

export type SheetStatus = "clear" | "incomplete" | "blocked";

export interface SafetySheetCheck {
  status: SheetStatus;
  findings: SafetyFinding[];
  profile: HazardProfile;
  /** the revision checked against, for the listing to record */
  revision: number;
}

export interface CheckSafetySheetInput {
  declaration: SafetyDeclaration;
  notes: SafetyNote[];
  /** any revision object, the built-in ones or one published later; the current one by default */
  revision?: PolicyRevision;
}

export function countWords(text: string): number {
  return text.split(/\s+/).filter((w) => /[\p{L}\p{N}]/u.test(w)).length;
}

export function describesHandDischarge(text: string, rule: PolicyRevision["handDischarge"]): boolean {
  const words = text.toLowerCase().split(/[^\p{L}\p{N}]+/u);
  const has = (stems: string[]) => stems.some((stem) => words.some((w) => w.startsWith(stem.toLowerCase())));
  return has(rule.actions) && has(rule.means);
}

/** Several notes on one topic read as one. */
function notesByTopic(notes: SafetyNote[]): Map<SafetyTopicKey, SafetyNote> {
  const out = new Map<SafetyTopicKey, SafetyNote>();
  for (const note of notes) {
    const seen = out.get(note.topic);
    out.set(
      note.topic,
      seen
        ? { topic: note.topic, text: `${seen.text} ${note.text}`, waitSeconds: seen.waitSeconds ?? note.waitSeconds }
        : note,
    );
  }
  return out;
}

function minWordsFor(topic: SafetyTopicKey, revision: PolicyRevision): number {
  const overrides = revision.topicRules.filter((r) => r.topic === topic && r.minWords !== undefined);
  return overrides.length ? Math.max(...overrides.map((r) => r.minWords ?? 0)) : revision.minWords;
}

function busSummary(p: HazardProfile): string {
  return `Your bus stores ${joules(p.storedEnergyJ)} at ${volts(p.busPeakV)} (${coulombs(p.storedChargeC)})`;
}

function requiredWaitS(p: HazardProfile, revision: PolicyRevision): number {
  return (p.dischargeS ?? 0) * revision.waitMarginFactor;
}

function dischargeSentence(p: HazardProfile, revision: PolicyRevision): string {
  return `with the ${ohms(p.bleederOhm ?? 0)} bleeder it takes about ${seconds(p.dischargeS ?? 0)} to fall below ${volts(revision.safeVoltageV)}`;
}

function ocvLimitText(p: HazardProfile): string {
  const ocv = p.ocv;
  if (!ocv || p.ocvLimitV === null) return "";
  const where = ocv.environment === "normal" ? "a normal environment" : "an environment of increased hazard of electric shock";
  return `${volts(p.ocvLimitV)} ${ocv.basis} limit for ${ocv.kind.toUpperCase()} output in ${where} (IEC 60974-1)`;
}

function missingMessage(topic: SafetyTopicKey, p: HazardProfile, revision: PolicyRevision): string {
  const label = topicLabel(topic);
  if (topic === "stored-charge") {
    if (p.dischargeS === null) {
      return `${busSummary(p)} and has no bleeder, so it can stay charged long after unplugging. Add a note on ${label} that describes how to discharge the bus by hand, through a resistor, discharge probe or tool, and how to confirm with a meter that it is below ${volts(revision.safeVoltageV)}.`;
    }
    return `${busSummary(p)}; ${dischargeSentence(p, revision)}. Add a note on ${label} that says to wait at least ${seconds(requiredWaitS(p, revision))} after unplugging before touching anything, and give that wait in the wait field.`;
  }
  if (topic === "output-voltage" && p.ocv?.declaredV != null) {
    return `Add a note on ${label}: state the open-circuit voltage you declared, ${volts(p.ocv.declaredV)} ${p.ocv.kind.toUpperCase()}, set it against the ${ocvLimitText(p)}, and say how the output is kept within that limit.`;
  }
  return `Add a note on ${label}. It should cover ${topicPrompt(topic)}.`;
}

function checkStoredCharge(note: SafetyNote, p: HazardProfile, revision: PolicyRevision): SafetyFinding | null {
  const topic = "stored-charge" as const;
  if (p.dischargeS === null) {
    if (describesHandDischarge(note.text, revision.handDischarge)) return null;
    return {
      topic,
      code: "discharge-method-missing",
      message: `There is no bleeder, so the bus stays charged after unplugging (${joules(p.storedEnergyJ)} at ${volts(p.busPeakV)}). Describe how to discharge it by hand, through a resistor, discharge probe or tool, and how to confirm with a meter that it is below ${volts(revision.safeVoltageV)} — or fit a bleeder and declare it.`,
    };
  }
  const required = requiredWaitS(p, revision);
  if (note.waitSeconds === undefined) {
    return {
      topic,
      code: "wait-missing",
      message: `${busSummary(p)}; ${dischargeSentence(p, revision)}. State a wait of at least ${seconds(required)} before touching anything, and enter it in the wait field of the ${topicLabel(topic)} note.`,
    };
  }
  if (note.waitSeconds < required) {
    return {
      topic,
      code: "wait-too-short",
      message: `Your note says to wait ${seconds(note.waitSeconds)}, but ${busSummary(p).replace(/^Your/, "your")} and ${dischargeSentence(p, revision)}. State a wait of at least ${seconds(required)} before touching anything.`,
    };
  }
  return null;
}

function checkOutputVoltage(p: HazardProfile): SafetyFinding | null {
  const ocv = p.ocv;
  if (!ocv) return null;
  if (ocv.declaredV === null) {
    return {
      topic: "output-voltage",
      code: "ocv-missing",
      message: `Declare the open-circuit voltage of the welding output so it can be checked against the ${ocvLimitText(p)}.`,
    };
  }
  if (ocv.withinLimit === false) {
    return {
      topic: "output-voltage",
      code: "ocv-over-limit",
      message: `The declared open-circuit voltage of ${volts(ocv.declaredV)} ${ocv.kind.toUpperCase()} is above the ${ocvLimitText(p)}. This listing cannot go live: bring the output within the limit (for example with a voltage-reducing circuit), then update the declaration.`,
    };
  }
  return null;
}

/** Checks a listing's safety notes against its own hazard profile and one policy revision. */
export function checkSafetySheet(input: CheckSafetySheetInput): SafetySheetCheck {
  const revision = input.revision ?? CURRENT_POLICY_REVISION;
  const profile = hazardProfile(input.declaration, revision);
  const notes = notesByTopic(input.notes);
  const findings: SafetyFinding[] = [];

  for (const topic of profile.requiredTopics) {
    const note = notes.get(topic);
    const words = note ? countWords(note.text) : 0;
    if (!note || words === 0) {
      findings.push({ topic, code: "missing", message: missingMessage(topic, profile, revision) });
    } else {
      const minWords = minWordsFor(topic, revision);
      if (words < minWords) {
        findings.push({
          topic,
          code: "too-short",
          message: `Your ${topicLabel(topic)} note has ${words} ${words === 1 ? "word" : "words"}; policy revision ${revision.revision} asks for at least ${minWords}. It should cover ${topicPrompt(topic)}.`,
        });
      }
      if (topic === "stored-charge") {
        const finding = checkStoredCharge(note, profile, revision);
        if (finding) findings.push(finding);
      }
    }
  }
  const ocvFinding = checkOutputVoltage(profile);
  if (ocvFinding) findings.push(ocvFinding);

  const order = (t: SafetyTopicKey) => SAFETY_TOPIC_KEYS.indexOf(t);
  findings.sort((a, b) => order(a.topic) - order(b.topic));

  const status: SheetStatus = findings.some((f) => f.code === "ocv-over-limit")
    ? "blocked"
    : findings.length > 0
      ? "incomplete"
      : "clear";
  return { status, findings, profile, revision: revision.revision };
}
