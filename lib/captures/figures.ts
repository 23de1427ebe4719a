import type { PulseMeasurement } from "@/lib/engineering/waveform";

// The figures a capture's channel is measured for, in the order the figures table shows them,
// with the SI unit each is stored in. Client-safe: the viewer and the table read it too.

export type FigureKey =
  | "lowV"
  | "highV"
  | "amplitudeV"
  | "frequencyHz"
  | "periodS"
  | "pulseWidthS"
  | "dutyCyclePct"
  | "riseTimeS"
  | "fallTimeS"
  | "overshootPct"
  | "undershootPct";

export type FigureRow = {
  key: FigureKey;
  label: string;
  /** "level" figures are in the channel's own unit (V for a voltage probe, A for a current probe) */
  unit: "level" | "Hz" | "s" | "%";
  /** how IEEE Std 181 defines it, in a line, for the table's description */
  note: string;
};

export const FIGURE_ROWS: readonly FigureRow[] = [
  { key: "lowV", label: "Low state level", unit: "level", note: "the lower mode of the samples' histogram" },
  { key: "highV", label: "High state level", unit: "level", note: "the upper mode of the samples' histogram" },
  { key: "amplitudeV", label: "Amplitude", unit: "level", note: "high state level minus low state level" },
  { key: "frequencyHz", label: "Frequency", unit: "Hz", note: "1 / period" },
  { key: "periodS", label: "Period", unit: "s", note: "between rising crossings of the 50 % level" },
  { key: "pulseWidthS", label: "Pulse width", unit: "s", note: "rising to falling crossing of the 50 % level" },
  { key: "dutyCyclePct", label: "Duty cycle", unit: "%", note: "pulse width / period" },
  { key: "riseTimeS", label: "Rise time", unit: "s", note: "10 % to 90 % of the amplitude" },
  { key: "fallTimeS", label: "Fall time", unit: "s", note: "90 % to 10 % of the amplitude" },
  { key: "overshootPct", label: "Overshoot", unit: "%", note: "peak above the high level, of the amplitude" },
  { key: "undershootPct", label: "Undershoot", unit: "%", note: "dip below the low level, of the amplitude" },
];

/** The stored figures plus pulse width, which follows from two of them. */
export type ChannelFigures = PulseMeasurement & { pulseWidthS: number | null };

export function withPulseWidth(figures: PulseMeasurement): ChannelFigures {
  const { dutyCyclePct, periodS } = figures;
  const pulseWidthS = dutyCyclePct !== null && periodS !== null ? (dutyCyclePct / 100) * periodS : null;
  return { ...figures, pulseWidthS };
}

export function figureValue(figures: ChannelFigures, key: FigureKey): number | null {
  const value = figures[key];
  return typeof value === "number" && Number.isFinite(value) ? value : null;
}

/** The unit a figure is stored in, for a channel whose samples are in `channelUnit` (volts when unknown). */
export function figureUnit(row: Pick<FigureRow, "unit">, channelUnit: string | null | undefined): string {
  return row.unit === "level" ? channelUnit || "V" : row.unit;
}

export function figureRow(key: FigureKey): FigureRow {
  const row = FIGURE_ROWS.find((r) => r.key === key);
  if (!row) throw new Error(`unknown figure ${key}`);
  return row;
}

/**
 * JSON has no NaN or Infinity; the library promises neither, and this keeps the promise at the
 * database's door too (a non-finite figure is stored as "not measured").
 */
export function storableFigures(figures: PulseMeasurement): PulseMeasurement {
  const finite = (v: number | null) => (v !== null && Number.isFinite(v) ? v : null);
  const levels = figures.referenceLevels;
  const markers = figures.markers;
  return {
    lowV: finite(figures.lowV),
    highV: finite(figures.highV),
    amplitudeV: finite(figures.amplitudeV),
    frequencyHz: finite(figures.frequencyHz),
    periodS: finite(figures.periodS),
    dutyCyclePct: finite(figures.dutyCyclePct),
    riseTimeS: finite(figures.riseTimeS),
    fallTimeS: finite(figures.fallTimeS),
    overshootPct: finite(figures.overshootPct),
    undershootPct: finite(figures.undershootPct),
    pulseCount: Number.isFinite(figures.pulseCount) ? figures.pulseCount : 0,
    reason: figures.reason,
    referenceLevels:
      levels && [levels.low10, levels.mesial50, levels.high90].every(Number.isFinite)
        ? { low10: levels.low10, mesial50: levels.mesial50, high90: levels.high90 }
        : null,
    markers:
      markers && [markers.pulseStartS, markers.pulseEndS, markers.nextPulseStartS].every(Number.isFinite)
        ? { pulseStartS: markers.pulseStartS, pulseEndS: markers.pulseEndS, nextPulseStartS: markers.nextPulseStartS }
        : null,
  };
}
