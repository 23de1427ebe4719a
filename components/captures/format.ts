import { formatSi } from "@/components/ui/format";
import { figureUnit, type FigureRow } from "@/lib/captures/figures";

// Figures of a capture with an engineering SI prefix (12.5 µs, 40.0 kHz, 15.0 V), four significant digits.

export function formatFigure(value: number | null, row: Pick<FigureRow, "unit">, channelUnit: string | null, amplitude?: number | null): string {
  if (value === null) return "—";
  const unit = figureUnit(row, channelUnit);
  return row.unit === "level" ? formatLevelOf(value, amplitude ?? null, unit) : formatSi(value, unit, 4);
}

/**
 * A level to the resolution its signal's amplitude gives it (a ten-thousandth of the swing):
 * the low level of a 15 V gate signal reads "0 V", not "−564.1 µV" of noise.
 */
export function formatLevelOf(value: number, amplitude: number | null, unit: string | null): string {
  if (amplitude === null || !(amplitude > 0)) return formatSi(value, unit || "V", 4);
  const step = 10 ** (Math.floor(Math.log10(amplitude)) - 3);
  const rounded = Math.round(value / step) * step;
  return formatSi(Object.is(rounded, -0) ? 0 : rounded, unit || "V", 4);
}

export function formatTime(seconds: number, digits = 4): string {
  return formatSi(seconds, "s", digits);
}

export function formatLevel(value: number, unit: string | null, digits = 4): string {
  return formatSi(value, unit || "V", digits);
}

export function formatFileSize(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
  if (bytes >= 1024) return `${Math.ceil(bytes / 1024)} KB`;
  return `${bytes} bytes`;
}

export const CAPTURE_STATE_WORDS = {
  queued: { label: "Waiting to be measured", tone: "neutral" },
  measuring: { label: "Measuring", tone: "active" },
  measured: { label: "Measured", tone: "clear" },
  // A file that cannot be read is not a safety stop: amber, as for anything that needs the builder's attention.
  failed: { label: "Not measured", tone: "caution" },
} as const;
