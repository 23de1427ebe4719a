import { formatSi } from "@/components/ui/format";
import { formatUtcDay, formatUtcDayTime } from "@/lib/format/plain";

// Readings are shown in the checkpoint's own unit, as the kit's sheet writes them: no prefix rescaling.

export function formatReading(value: number, unit: string): string {
  return formatSi(value, unit, 5, { prefixes: false });
}

/** "38–42 kHz"; a single-value range prints once. */
export function formatRange(min: number, max: number, unit: string): string {
  if (min === max) return formatReading(min, unit);
  return `${formatSi(min, "", 5, { prefixes: false })}–${formatReading(max, unit)}`;
}

// Dates as en-GB's medium style writes them in UTC, without Intl (see lib/format/plain.ts).

export function formatTakenAt(at: Date): string {
  return `${formatUtcDayTime(at)} UTC`;
}

export function formatDay(at: Date): string {
  return formatUtcDay(at);
}
