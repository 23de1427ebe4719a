import { useId, type ReactNode } from "react";
import { cx } from "@/components/ui/cx";
import { formatSi } from "@/components/ui/format";
import { linePath, linearScale, niceTicks, sampleEvenly, tickLabels } from "./scale";

export type ChartTone = "copper" | "graphite" | "verdigris" | "amber" | "signal";

export interface ChartPoint {
  x: number;
  y: number;
}

export interface ChartSeries {
  id: string;
  label: string;
  points: readonly ChartPoint[];
  tone?: ChartTone;
  dashed?: boolean;
  /** stroke width in viewBox units; 2 by default */
  width?: number;
}

/** A labelled line across the plot: `axis: "y"` is horizontal at a level, `"x"` vertical at a time or current. */
export interface ChartMarker {
  axis: "x" | "y";
  value: number;
  label: string;
  tone?: ChartTone;
  /** which end of a horizontal marker carries its label; "start" (left) by default */
  labelAt?: "start" | "end";
}

export interface ChartAxis {
  label: string;
  unit: string;
  /** force an end of the axis; otherwise it follows the data and the markers */
  min?: number;
  max?: number;
  /** start the axis at zero even when the data does not reach it; true by default */
  includeZero?: boolean;
  /** false prints plain numbers (e.g. minutes), true (default) one SI prefix per axis */
  prefixes?: boolean;
  /** the most tick intervals to draw */
  intervals?: number;
}

export interface LineChartProps {
  /** read by assistive tech as the chart's name */
  title: string;
  /** what the chart shows and what the markers mean, in a sentence or two */
  description: string;
  x: ChartAxis;
  y: ChartAxis;
  series: readonly ChartSeries[];
  markers?: readonly ChartMarker[];
  /** visible caption under the chart */
  caption?: ReactNode;
  /** rows per series in the visually hidden data table */
  tableRows?: number;
  width?: number;
  height?: number;
  className?: string;
}

const STROKES: Record<ChartTone, string> = {
  copper: "stroke-copper-600",
  graphite: "stroke-graphite-700",
  verdigris: "stroke-verdigris-600",
  amber: "stroke-amber-600",
  signal: "stroke-signal-700",
};

const TEXT_FILLS: Record<ChartTone, string> = {
  copper: "fill-copper-700",
  graphite: "fill-graphite-700",
  verdigris: "fill-verdigris-700",
  amber: "fill-amber-700",
  signal: "fill-signal-700",
};

const SWATCHES: Record<ChartTone, string> = {
  copper: "border-copper-600",
  graphite: "border-graphite-700",
  verdigris: "border-verdigris-600",
  amber: "border-amber-600",
  signal: "border-signal-700",
};

const MARGIN = { top: 16, right: 16, bottom: 54, left: 78 };
const LABEL_SIZE = 13;
const LINE_GAP = 16;

function extent(values: number[], axis: ChartAxis): [number, number] {
  const finite = values.filter(Number.isFinite);
  if (axis.includeZero !== false) finite.push(0);
  const lo = axis.min ?? (finite.length > 0 ? Math.min(...finite) : 0);
  const hi = axis.max ?? (finite.length > 0 ? Math.max(...finite) : 1);
  return [lo, hi];
}

function formatValue(value: number, axis: ChartAxis): string {
  return formatSi(value, axis.unit, 4, { prefixes: axis.prefixes });
}

/**
 * A line chart drawn as plain SVG: axes with SI-labelled ticks, gridlines, one or more series
 * and labelled marker lines. It scales with its container through the viewBox, renders the
 * same on the server and in the browser, and carries a visually hidden table of its data.
 */
export function LineChart({
  title,
  description,
  x,
  y,
  series,
  markers = [],
  caption,
  tableRows = 12,
  width = 560,
  height = 330,
  className,
}: LineChartProps) {
  const id = `chart${useId().replace(/[^A-Za-z0-9_-]/g, "")}`;
  const allPoints = series.flatMap((s) => s.points);
  const xMarkers = markers.filter((m) => m.axis === "x");
  const yMarkers = markers.filter((m) => m.axis === "y");

  const [x0, x1] = extent([...allPoints.map((p) => p.x), ...xMarkers.map((m) => m.value)], x);
  const [y0, y1] = extent([...allPoints.map((p) => p.y), ...yMarkers.map((m) => m.value)], y);
  const xTicks = niceTicks(x0, x1, x.intervals ?? 6);
  const yTicks = niceTicks(y0, y1, y.intervals ?? 5);
  const xDomain: [number, number] = [x.min ?? xTicks.min, x.max ?? xTicks.max];
  const yDomain: [number, number] = [y.min ?? yTicks.min, y.max ?? yTicks.max];
  const xTickValues = xTicks.ticks.filter((t) => t >= xDomain[0] - 1e-12 && t <= xDomain[1] + 1e-12);
  const yTickValues = yTicks.ticks.filter((t) => t >= yDomain[0] - 1e-12 && t <= yDomain[1] + 1e-12);

  const left = MARGIN.left;
  const right = width - MARGIN.right;
  const top = MARGIN.top;
  const bottom = height - MARGIN.bottom;
  const sx = linearScale(xDomain, [left, right]);
  const sy = linearScale(yDomain, [bottom, top]);

  const xLabels = tickLabels(xTickValues, x.unit, { prefixes: x.prefixes });
  const yLabels = tickLabels(yTickValues, y.unit, { prefixes: y.prefixes });

  // Horizontal marker labels sit above their line unless that would collide with the one
  // above or run out of the plot; then below.
  const placedY: { marker: ChartMarker; py: number; ly: number }[] = [];
  for (const marker of [...yMarkers].sort((a, b) => b.value - a.value)) {
    const py = sy(marker.value);
    const previous = placedY[placedY.length - 1];
    const above = py - 5;
    const clash = previous !== undefined && Math.abs(previous.ly - above) < LINE_GAP;
    const ly = above - LABEL_SIZE < top || clash ? py + LABEL_SIZE + 3 : above;
    placedY.push({ marker, py, ly });
  }

  return (
    <figure className={cx("w-full", className)} data-chart="line">
      <svg
        viewBox={`0 0 ${width} ${height}`}
        role="img"
        aria-labelledby={`${id}-title ${id}-desc`}
        className="h-auto w-full"
        xmlns="http://www.w3.org/2000/svg"
      >
        <title id={`${id}-title`}>{title}</title>
        <desc id={`${id}-desc`}>{description}</desc>
        <defs>
          <clipPath id={`${id}-plot`}>
            <rect x={left} y={top} width={right - left} height={bottom - top} />
          </clipPath>
        </defs>

        <g className="fill-graphite-600 font-mono" fontSize={LABEL_SIZE - 1}>
          {yTickValues.map((tick, i) => (
            <g key={`y${tick}`}>
              <line x1={left} x2={right} y1={sy(tick)} y2={sy(tick)} className="stroke-graphite-100" strokeWidth={1} />
              <text x={left - 8} y={sy(tick)} textAnchor="end" dominantBaseline="middle">
                {yLabels[i]}
              </text>
            </g>
          ))}
          {xTickValues.map((tick, i) => (
            <g key={`x${tick}`}>
              <line x1={sx(tick)} x2={sx(tick)} y1={top} y2={bottom} className="stroke-graphite-100" strokeWidth={1} />
              <text x={sx(tick)} y={bottom + 18} textAnchor="middle">
                {xLabels[i]}
              </text>
            </g>
          ))}
        </g>

        <g className="stroke-graphite-400" strokeWidth={1}>
          <line x1={left} x2={right} y1={bottom} y2={bottom} />
          <line x1={left} x2={left} y1={top} y2={bottom} />
        </g>
        <g className="fill-graphite-700 font-sans" fontSize={LABEL_SIZE}>
          <text x={(left + right) / 2} y={height - 10} textAnchor="middle">
            {x.label}
          </text>
          <text x={16} y={(top + bottom) / 2} textAnchor="middle" transform={`rotate(-90 16 ${(top + bottom) / 2})`}>
            {y.label}
          </text>
        </g>

        <g clipPath={`url(#${id}-plot)`} fill="none" strokeLinejoin="round" strokeLinecap="round">
          {series.map((s) => (
            <path
              key={s.id}
              data-series={s.id}
              d={linePath(s.points.map((p) => ({ x: sx(p.x), y: sy(p.y) })))}
              className={STROKES[s.tone ?? "copper"]}
              strokeWidth={s.width ?? 2}
              strokeDasharray={s.dashed ? "6 4" : undefined}
            />
          ))}
        </g>

        <g fontSize={LABEL_SIZE} className="font-sans">
          {placedY.map(({ marker, py, ly }) => (
            <g key={`my-${marker.label}`} data-marker="y">
              <line
                x1={left}
                x2={right}
                y1={py}
                y2={py}
                className={STROKES[marker.tone ?? "graphite"]}
                strokeWidth={1.5}
                strokeDasharray="5 4"
              />
              <text
                x={marker.labelAt === "end" ? right - 5 : left + 5}
                y={ly}
                textAnchor={marker.labelAt === "end" ? "end" : "start"}
                className={cx(TEXT_FILLS[marker.tone ?? "graphite"], "stroke-paper-raised font-semibold")}
                strokeWidth={4}
                paintOrder="stroke"
              >
                {marker.label}
              </text>
            </g>
          ))}
          {xMarkers.map((marker, row) => {
            const px = sx(marker.value);
            const nearRight = px > left + (right - left) * 0.65;
            return (
              <g key={`mx-${marker.label}`} data-marker="x">
                <line
                  x1={px}
                  x2={px}
                  y1={top}
                  y2={bottom}
                  className={STROKES[marker.tone ?? "graphite"]}
                  strokeWidth={1.5}
                  strokeDasharray="2 3"
                />
                <text
                  x={nearRight ? px - 5 : px + 5}
                  y={top + LABEL_SIZE + 2 + row * LINE_GAP}
                  textAnchor={nearRight ? "end" : "start"}
                  className={cx(TEXT_FILLS[marker.tone ?? "graphite"], "stroke-paper-raised font-semibold")}
                  strokeWidth={4}
                  paintOrder="stroke"
                >
                  {marker.label}
                </text>
              </g>
            );
          })}
        </g>
      </svg>

      {series.length > 1 ? (
        <ul className="mt-2 flex flex-wrap gap-x-5 gap-y-1 text-sm text-graphite-700" aria-label="Lines on the chart">
          {series.map((s) => (
            <li key={s.id} className="flex items-center gap-2">
              <span
                aria-hidden="true"
                className={cx("inline-block w-6 border-t-2", SWATCHES[s.tone ?? "copper"], s.dashed && "border-dashed")}
              />
              {s.label}
            </li>
          ))}
        </ul>
      ) : null}
      {caption != null ? <figcaption className="mt-2 text-sm text-graphite-600">{caption}</figcaption> : null}

      {/* A table will not shrink to the 1 px of .sr-only and widens the page; its wrapper does. */}
      <div className="sr-only">
      <table>
        <caption>Data of the chart: {title}</caption>
        <thead>
          <tr>
            {series.length > 1 ? <th scope="col">Line</th> : null}
            <th scope="col">{x.label}</th>
            <th scope="col">{y.label}</th>
          </tr>
        </thead>
        <tbody>
          {series.flatMap((s) =>
            sampleEvenly(s.points, tableRows).map((p, i) => (
              <tr key={`${s.id}-${i}`}>
                {series.length > 1 ? <th scope="row">{s.label}</th> : null}
                <td>{formatValue(p.x, x)}</td>
                <td>{formatValue(p.y, y)}</td>
              </tr>
            )),
          )}
        </tbody>
      </table>
      </div>
      {markers.length > 0 ? (
        <p className="sr-only">Marked on the chart: {markers.map((m) => m.label).join("; ")}.</p>
      ) : null}
    </figure>
  );
}
