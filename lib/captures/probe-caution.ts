import type { BringUpStage } from "@/db/schema/listings";

// The short caution beside a trace probed on a gate drive or on the mains side. Type-only import:
// this runs in the browser too.

export type ProbeCautionKind = "gate-drive" | "mains-side";

export type ProbeCaution = { kind: ProbeCautionKind; title: string; text: string };

// Common practice: a scope's probe ground is tied to protective earth through its mains lead,
// so clipping it to a node that floats at bus potential shorts that node to earth.
const PROBE_TEXT =
  "Probe mains-side nodes only with a differential probe or a battery-powered, isolated scope — never clip an earthed scope's probe ground to them. Connect the probes with the supply off and the bus discharged.";

const CAUTIONS: Record<ProbeCautionKind, ProbeCaution> = {
  "gate-drive": {
    kind: "gate-drive",
    title: "Gate-drive trace: the switches' gates can sit at bus potential",
    text: PROBE_TEXT,
  },
  "mains-side": {
    kind: "mains-side",
    title: "Mains-side trace: these nodes sit at lethal voltage",
    text: PROBE_TEXT,
  },
};

/**
 * The caution for a capture at this checkpoint, or null for a trace from the low-voltage side.
 * Gate drives count wherever they are read: on a two-transistor forward or a half bridge the
 * upper switch's gate rides on the bus once mains is connected.
 */
export function probeCautionFor(checkpoint: { stage: BringUpStage | string; name: string; measure: string }): ProbeCaution | null {
  const text = `${checkpoint.name} ${checkpoint.measure}`;
  if (/\bgate\b/i.test(text)) return CAUTIONS["gate-drive"];
  if (checkpoint.stage !== "control-supply" || /\b(mains|bus|primary|drain|collector|switch node)\b/i.test(text)) return CAUTIONS["mains-side"];
  return null;
}
