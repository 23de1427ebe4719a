export const SAFETY_TOPIC_KEYS = [
  "mains-isolation",
  "stored-charge",
  "first-power-up",
  "protective-earth",
  "live-heatsinks",
  "output-voltage",
  "arc-hazards",
  "codes-and-competence",
] as const;

export type SafetyTopicKey = (typeof SAFETY_TOPIC_KEYS)[number];

export interface SafetyTopic {
  key: SafetyTopicKey;
  label: string;
  /** what a seller's note on this topic should cover (reads after "It should cover"), shown beside the form and in findings */
  prompt: string;
}

export const SAFETY_TOPICS: readonly SafetyTopic[] = [
  {
    key: "mains-isolation",
    label: "Mains isolation",
    prompt:
      "how the build is disconnected from the mains before anyone works on it, and which parts stay live while it is plugged in",
  },
  {
    key: "stored-charge",
    label: "Stored charge",
    prompt:
      "how long the bus capacitors hold a dangerous charge after unplugging, and how to confirm with a meter that the bus is below 60 V",
  },
  {
    key: "first-power-up",
    label: "First power-up",
    prompt:
      "how to bring the build up the first time (through a series lamp of about 100 W or an isolation transformer) and what to check before full power",
  },
  {
    key: "protective-earth",
    label: "Protective earth",
    prompt: "which metal parts are bonded to protective earth and how to check the earth connection",
  },
  {
    key: "live-heatsinks",
    label: "Live heatsinks",
    prompt: "which heatsinks sit at bus potential, how they are insulated from the case, and the warning to give",
  },
  {
    key: "output-voltage",
    label: "Output voltage",
    prompt: "the open-circuit output voltage and how the output is kept within the arc-welding standard's limit",
  },
  {
    key: "arc-hazards",
    label: "Arc, fume and fire",
    prompt: "eye and skin protection from arc radiation, ventilation against fume, and keeping the work area clear of anything that burns",
  },
  {
    key: "codes-and-competence",
    label: "Local codes and competence",
    prompt:
      "the local electrical codes and licensed practice that take precedence over this sheet, and the experience a builder needs before taking this on",
  },
];

export function topicLabel(key: SafetyTopicKey): string {
  return SAFETY_TOPICS.find((t) => t.key === key)?.label ?? key;
}

export function topicPrompt(key: SafetyTopicKey): string {
  return SAFETY_TOPICS.find((t) => t.key === key)?.prompt ?? "";
}
