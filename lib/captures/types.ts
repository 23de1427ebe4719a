import type { CaptureState } from "@/db/schema/captures";
import type { PulseMeasurement } from "@/lib/engineering/waveform";
import type { Proposal } from "./proposal";

// What the capture routes answer and the capture components read. Type-only imports keep
// drizzle and the parser out of the browser bundle.

export type { CaptureState };

export type CaptureChannelView = {
  index: number;
  name: string;
  unit: string | null;
  minValue: number;
  maxValue: number;
  figures: PulseMeasurement;
};

export type CaptureApplied = {
  at: string;
  channel: number;
  figure: string;
  value: number;
  valueBefore: number;
  enteredBefore: { value: number; unit: string };
};

/** GET /api/captures/[id]: the capture's state for the card that polls it. */
export type CaptureStatusView = {
  id: string;
  state: CaptureState;
  /** 0–100 */
  progress: number;
  /** the parser's message for a bad file (it names the line), or why measuring failed */
  error: string | null;
  fileName: string;
  bytes: number;
  fileUrl: string;
  reading: { id: string; value: number; verdict: "within" | "low" | "high" };
  checkpoint: { id: string; name: string; measure: string; unit: string; stage: string; expectedMin: number; expectedMax: number };
  sampleCount: number | null;
  startTimeS: number | null;
  endTimeS: number | null;
  sampleIntervalS: number | null;
  channels: CaptureChannelView[];
  /** the figure proposed as the reading's value, once measured and not yet applied */
  proposal: Proposal | null;
  applied: CaptureApplied | null;
  /** only the log's owner confirms a proposal or removes the capture */
  canEdit: boolean;
  createdAt: string;
};

export type WindowTrace = {
  index: number;
  name: string;
  unit: string | null;
  timeS: number[];
  values: number[];
};

/** GET /api/captures/[id]/window */
export type CaptureWindowView = {
  from: number;
  to: number;
  points: number;
  /** samples of the capture inside the window, before downsampling */
  samplesInWindow: number;
  traces: WindowTrace[];
};

export type CapturePinView = {
  id: string;
  sessionId: string;
  authorName: string;
  timeS: number;
  channel: number | null;
  body: string;
  createdAt: string;
};
