import { SAFE_VOLTAGE_V, STORED_CHARGE_THRESHOLD_C } from "@/lib/engineering";
import type { SafetyTopicKey } from "./topics";

/** When a topic becomes required; each condition is evaluated by hazard-profile.ts. */
export const TOPIC_CONDITIONS = [
  "always",
  "mains-connected",
  "stored-charge",
  "live-heatsinks",
  "welding-source",
] as const;
export type TopicCondition = (typeof TOPIC_CONDITIONS)[number];

export interface TopicRule {
  topic: SafetyTopicKey;
  when: TopicCondition;
  /** overrides the revision's minWords for this topic */
  minWords?: number;
}

/**
 * A policy revision is plain JSON-compatible data, so a revision an admin publishes later
 * (stored in the database) satisfies the same type and the same checks run on it.
 */
export interface PolicyRevision {
  revision: number;
  /** ISO 8601 */
  publishedAt: string;
  summary: string;
  /** words a note needs to count as substantive */
  minWords: number;
  /** stored charge above which the stored-charge topic is required, C */
  storedChargeThresholdC: number;
  /** bus voltage counted as safe to touch, and the level discharge times are computed to, V */
  safeVoltageV: number;
  /** the stated wait must be at least this factor × the computed discharge time */
  waitMarginFactor: number;
  topicRules: TopicRule[];
  /**
   * With no bleeder the stored-charge note must describe a hand discharge: it passes when the
   * text contains a word starting with one of `actions` and a word starting with one of
   * `means` (case-insensitive), e.g. "discharge the bus through a 2 kΩ resistor".
   */
  handDischarge: { actions: string[]; means: string[] };
}

export const POLICY_REVISIONS: readonly PolicyRevision[] = [
  {
    revision: 1,
    publishedAt: "2025-01-15T00:00:00.000Z",
    summary:
      "First safety-sheet policy: topics follow from the hazard profile; stored charge needs a wait no shorter than the bleeder's discharge time to 60 V, or a hand-discharge method.",
    minWords: 12,
    storedChargeThresholdC: STORED_CHARGE_THRESHOLD_C,
    safeVoltageV: SAFE_VOLTAGE_V,
    waitMarginFactor: 1.0,
    topicRules: [
      { topic: "mains-isolation", when: "mains-connected" },
      { topic: "protective-earth", when: "mains-connected" },
      { topic: "first-power-up", when: "mains-connected" },
      { topic: "codes-and-competence", when: "always" },
      { topic: "stored-charge", when: "stored-charge" },
      { topic: "live-heatsinks", when: "live-heatsinks" },
      { topic: "output-voltage", when: "welding-source" },
      { topic: "arc-hazards", when: "welding-source" },
    ],
    handDischarge: {
      actions: ["discharg", "bleed", "drain"],
      means: ["resistor", "probe", "tool", "lamp"],
    },
  },
];

export const CURRENT_POLICY_REVISION: PolicyRevision = POLICY_REVISIONS[POLICY_REVISIONS.length - 1]!;

export function getPolicyRevision(revision: number): PolicyRevision | undefined {
  return POLICY_REVISIONS.find((r) => r.revision === revision);
}
