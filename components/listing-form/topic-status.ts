import type { FindingCode, SafetyFinding, SafetyTopicKey } from "@/lib/policy";

export type TopicStatus = "covered" | "missing" | "too-short" | "needs-figure";

export const TOPIC_STATUS_WORDS: Record<TopicStatus, { label: string; tone: "clear" | "caution" | "stop" }> = {
  covered: { label: "Covered", tone: "clear" },
  missing: { label: "Missing", tone: "caution" },
  "too-short": { label: "Too short", tone: "caution" },
  "needs-figure": { label: "Needs a figure", tone: "caution" },
};

const BY_CODE: Record<FindingCode, TopicStatus> = {
  missing: "missing",
  "too-short": "too-short",
  "wait-missing": "needs-figure",
  "wait-too-short": "needs-figure",
  "discharge-method-missing": "needs-figure",
  "ocv-missing": "needs-figure",
  "ocv-over-limit": "needs-figure",
};

// A missing note outranks a short one, which outranks a missing figure.
const RANK: TopicStatus[] = ["missing", "too-short", "needs-figure", "covered"];

/** One word per required topic, from the check's findings. */
export function topicStatuses(required: readonly SafetyTopicKey[], findings: readonly SafetyFinding[]): Map<SafetyTopicKey, TopicStatus> {
  const out = new Map<SafetyTopicKey, TopicStatus>(required.map((t) => [t, "covered"]));
  for (const finding of findings) {
    if (!out.has(finding.topic)) continue;
    const next = BY_CODE[finding.code];
    const current = out.get(finding.topic) ?? "covered";
    if (RANK.indexOf(next) < RANK.indexOf(current)) out.set(finding.topic, next);
  }
  return out;
}
