import type { DischargePoint } from "@/lib/engineering";
import { formatSi } from "@/components/ui/format";
import { LineChart, type ChartMarker } from "./line-chart";

export interface DischargePlotProps {
  /** V(t) from dischargeCurve(), in s and V */
  points: readonly DischargePoint[];
  /** the level counted as safe to touch, V (60 V DC) */
  safeV: number;
  /** the computed time to reach safeV, s; null when no wait can be computed */
  dischargeS: number | null;
  /** what the bus discharges through, e.g. "through the 100 kΩ bleeder" */
  through?: string;
  title?: string;
  caption?: string;
  className?: string;
}

// Past ten minutes a time axis reads better in minutes than in kiloseconds.
const MINUTES_FROM_S = 600;

/**
 * The capacitor discharge curve V(t) with the safe level and the computed wait marked. Shared
 * by the workbench and the listings' live safety check.
 */
export function DischargePlot({ points, safeV, dischargeS, through, title, caption, className }: DischargePlotProps) {
  if (points.length < 2) {
    return (
      <p className="rounded border border-dashed border-graphite-300 bg-paper-sunken px-4 py-6 text-sm text-graphite-700">
        No discharge curve to draw: without a bleeder the bus has no discharge path of its own.
      </p>
    );
  }
  const lastS = points[points.length - 1]?.timeS ?? 0;
  const minutes = lastS > MINUTES_FROM_S;
  const perUnit = minutes ? 60 : 1;
  const timeText = (s: number) => (minutes ? formatSi(s / 60, "min", 3, { prefixes: false }) : formatSi(s, "s"));
  const startV = points[0]?.volts ?? 0;

  const markers: ChartMarker[] = [
    { axis: "y", value: safeV, label: `${formatSi(safeV, "V")} safe level`, tone: "verdigris" },
  ];
  if (dischargeS !== null && Number.isFinite(dischargeS) && dischargeS > 0) {
    markers.push({ axis: "x", value: dischargeS / perUnit, label: `t = ${timeText(dischargeS)}`, tone: "amber" });
  }
  const name = title ?? `Bus voltage after switch-off${through ? `, ${through}` : ""}`;
  const waitSentence =
    dischargeS !== null && dischargeS > 0
      ? `It falls below the ${formatSi(safeV, "V")} safe level after ${timeText(dischargeS)}.`
      : `It starts at or below the ${formatSi(safeV, "V")} safe level.`;

  return (
    <LineChart
      title={name}
      description={`The bus voltage decays exponentially from ${formatSi(startV, "V")}. ${waitSentence}`}
      x={{ label: "Time after switch-off", unit: minutes ? "min" : "s", prefixes: !minutes }}
      y={{ label: "Bus voltage", unit: "V" }}
      series={[
        {
          id: "bus-voltage",
          label: "Bus voltage",
          points: points.map((p) => ({ x: p.timeS / perUnit, y: p.volts })),
          tone: "copper",
        },
      ]}
      markers={markers}
      caption={caption}
      className={className}
    />
  );
}
