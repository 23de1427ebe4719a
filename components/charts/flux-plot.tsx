import type { FluxPoint } from "@/lib/engineering";
import { formatSi } from "@/components/ui/format";
import { LineChart, type ChartMarker } from "./line-chart";

export interface FluxPlotProps {
  /** B against I from fluxCurve(), in A and T */
  points: readonly FluxPoint[];
  ratedCurrentA: number;
  /** the material's conservative design maximum, T */
  designMaxT: number;
  /** where saturation starts: the lower end of the material's range, T */
  saturationT: number;
  materialLabel?: string;
  title?: string;
  caption?: string;
  className?: string;
}

/** Peak flux density against current, with the design maximum, saturation and the rated current marked. */
export function FluxPlot({
  points,
  ratedCurrentA,
  designMaxT,
  saturationT,
  materialLabel,
  title,
  caption,
  className,
}: FluxPlotProps) {
  const rated = formatSi(ratedCurrentA, "A");
  const markers: ChartMarker[] = [
    { axis: "y", value: saturationT, label: `Saturation ${formatSi(saturationT, "T")}`, tone: "signal" },
    { axis: "y", value: designMaxT, label: `Design max ${formatSi(designMaxT, "T")}`, tone: "amber" },
    { axis: "x", value: ratedCurrentA, label: `Rated ${rated}`, tone: "copper" },
  ];
  const core = materialLabel ? ` for ${materialLabel}` : "";
  return (
    <LineChart
      title={title ?? `Peak flux density against current${core}`}
      description={
        `Flux density rises in proportion to current (constant inductance). Marked: the design maximum of ` +
        `${formatSi(designMaxT, "T")}, saturation from ${formatSi(saturationT, "T")}, and the rated current of ${rated}.`
      }
      x={{ label: "Winding current", unit: "A" }}
      y={{ label: "Peak flux density", unit: "T" }}
      series={[
        {
          id: "flux",
          label: "Flux density",
          points: points.map((p) => ({ x: p.currentA, y: p.fluxT })),
          tone: "copper",
        },
      ]}
      markers={markers}
      caption={caption}
      className={className}
    />
  );
}
