import { topicLabel, type SafetyTopicKey } from "@/lib/policy";
import type { ReasonTopic } from "@/lib/validations/moderation";

/** The label of a reason's topic: a safety topic's own, or "General" for what is not about the sheet. */
export function reasonTopicLabel(topic: ReasonTopic | string): string {
  return topic === "general" ? "General" : topicLabel(topic as SafetyTopicKey);
}

export const KIND_LABELS: Record<string, string> = {
  board: "Board",
  magnetic: "Magnetic",
  kit: "Kit",
  transformer: "transformer",
  choke: "choke",
  "current-transformer": "current transformer",
};

export function kindLabel(kind: string, subtype?: string | null): string {
  const base = KIND_LABELS[kind] ?? kind;
  return subtype ? `${base} · ${KIND_LABELS[subtype] ?? subtype}` : base;
}

export const DECISION_LABELS: Record<string, string> = {
  submitted: "Submitted for review",
  approved: "Approved",
  sent_back: "Sent back",
  held: "Held",
  restored: "Restored",
  retired: "Retired by the seller",
  grace_notice: "Policy notice, grace period started",
  grace_expired: "Held: grace period ended",
};
