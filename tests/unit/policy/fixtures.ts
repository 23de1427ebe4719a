import type { SafetyDeclaration, SafetyNote } from "@/lib/policy";

/** The worked example: 230 V +10 % mains (IEC 60038), 1000 µF bus, 47 kΩ bleeder. */
export const mainsKit: SafetyDeclaration = {
  mainsConnected: true,
  mainsVrms: 230,
  mainsTolerance: 0.1,
  busCapacitanceF: 1000e-6,
  bleederOhm: 47e3,
  liveHeatsinks: false,
  weldingSource: false,
};

/** An inverter welding source with heatsinks at bus potential and ≈60 V OCV (common practice). */
export const welderKit: SafetyDeclaration = {
  ...mainsKit,
  liveHeatsinks: true,
  weldingSource: true,
  openCircuitV: 62,
  ocvKind: "dc",
  environment: "normal",
};

const words = (n: number, topic: string) =>
  Array.from({ length: n }, (_, i) => (i === 0 ? `About ${topic}:` : `word${i}`)).join(" ");

/** Substantive notes (20 words each) for every topic, with a wait that covers the 83.9 s discharge. */
export function fullNotes(overrides: Partial<Record<SafetyNote["topic"], Partial<SafetyNote>>> = {}): SafetyNote[] {
  const topics: SafetyNote["topic"][] = [
    "mains-isolation",
    "stored-charge",
    "first-power-up",
    "protective-earth",
    "live-heatsinks",
    "output-voltage",
    "arc-hazards",
    "codes-and-competence",
  ];
  return topics.map((topic) => ({
    topic,
    text: words(20, topic),
    ...(topic === "stored-charge" ? { waitSeconds: 90 } : {}),
    ...overrides[topic],
  }));
}
