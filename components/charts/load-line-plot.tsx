import { formatSi } from "@/components/ui/format";
import { LineChart, type ChartMarker, type ChartSeries } from "./line-chart";

export interface LoadLinePoint {
  currentA: number;
  volts: number;
}

export interface LoadLinePlotProps {
  /** the conventional load line U2(I2) from 0 A */
  points: readonly LoadLinePoint[];
  /** the same line over the source's output current range, drawn heavier */
  outputRange?: readonly LoadLinePoint[];
  openCircuitV: number;
  limitV: number;
  /** e.g. "DC limit (peak)" */
  limitLabel: string;
  /** whether the declared open-circuit voltage is within the limit; colours its marker */
  withinLimit: boolean;
  title?: string;
  caption?: string;
  className?: string;
}

/** The welding load line with the open-circuit voltage and the standard's no-load limit drawn across it. */
export function LoadLinePlot({
  points,
  outputRange,
  openCircuitV,
  limitV,
  limitLabel,
  withinLimit,
  title,
  caption,
  className,
}: LoadLinePlotProps) {
  const series: ChartSeries[] = [
    {
      id: "load-line",
      label: "Conventional load line",
      points: points.map((p) => ({ x: p.currentA, y: p.volts })),
      tone: "graphite",
      dashed: outputRange !== undefined,
    },
  ];
  const first = outputRange?.[0];
  const last = outputRange?.[outputRange.length - 1];
  if (outputRange && first && last) {
    series.push({
      id: "output-range",
      label: `Output range ${formatSi(first.currentA, "A")} – ${formatSi(last.currentA, "A")}`,
      points: outputRange.map((p) => ({ x: p.currentA, y: p.volts })),
      tone: "copper",
      width: 4,
    });
  }
  const ocv = formatSi(openCircuitV, "V");
  const limit = formatSi(limitV, "V");
  const markers: ChartMarker[] = [
    { axis: "y", value: limitV, label: `${limitLabel} ${limit}`, tone: "signal" },
    {
      axis: "y",
      value: openCircuitV,
      label: `Open circuit ${ocv}${withinLimit ? "" : " (over the limit)"}`,
      tone: withinLimit ? "verdigris" : "signal",
    },
  ];
  return (
    <LineChart
      title={title ?? "Welding load line and open-circuit voltage"}
      description={
        `The conventional load voltage rises with welding current. The open-circuit voltage of ${ocv} is ` +
        `${withinLimit ? "within" : "over"} the ${limitLabel.toLowerCase()} of ${limit}.`
      }
      x={{ label: "Welding current", unit: "A" }}
      y={{ label: "Output voltage", unit: "V" }}
      series={series}
      markers={markers}
      caption={caption}
      className={className}
    />
  );
}
