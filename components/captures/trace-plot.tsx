import type { Ref } from "react";
import { linePath, linearScale, niceTicks, tickLabels } from "@/components/charts/scale";
import { cx } from "@/components/ui/cx";
import type { CapturePinView, WindowTrace } from "@/lib/captures/types";
import type { PulseMeasurement } from "@/lib/engineering/waveform";
import { formatLevelOf, formatTime } from "./format";
import type { Span } from "./viewer-math";

// The drawing of the capture viewer: axes, traces, the focus channel's levels and period marks,
// pins, the dragged range and the pointer's crosshair. No state; the viewer owns all of it.

// About the width the plot gets beside the figures on a laptop screen, so its text stays near its set size.
export const PLOT_WIDTH = 800;
export const PLOT_HEIGHT = 430;
export const MARGIN = { top: 58, right: 64, bottom: 48, left: 70 };

export const CHANNEL_STROKES = ["stroke-copper-600", "stroke-verdigris-600", "stroke-graphite-800", "stroke-amber-600"] as const;
export const CHANNEL_SWATCHES = ["bg-copper-600", "bg-verdigris-600", "bg-graphite-800", "bg-amber-600"] as const;

export type AxisGroup = { unit: string; domain: [number, number]; side: "left" | "right" | "none"; channels: number[] };

export type PlotTrace = WindowTrace & { group: number };

export type TracePlotProps = {
  svgRef?: Ref<SVGSVGElement>;
  title: string;
  description: string;
  view: Span;
  groups: readonly AxisGroup[];
  traces: readonly PlotTrace[];
  /** the channel whose levels and period are marked */
  focus: { index: number; name: string; unit: string | null; group: number; figures: PulseMeasurement } | null;
  pins: readonly (CapturePinView & { number: number })[];
  /** a time picked for a new pin, not saved yet */
  draftPinS?: number | null;
  selection?: Span | null;
  hover?: { timeS: number } | null;
  activePinId?: string | null;
};

export const plotLeft = MARGIN.left;
export const plotRight = PLOT_WIDTH - MARGIN.right;
const top = MARGIN.top;
const bottom = PLOT_HEIGHT - MARGIN.bottom;

function levelLines(figures: PulseMeasurement, unit: string | null) {
  const lines: { key: string; value: number; label: string; strong: boolean }[] = [];
  const swing = figures.amplitudeV;
  if (figures.highV !== null) lines.push({ key: "high", value: figures.highV, label: `High ${formatLevelOf(figures.highV, swing, unit)}`, strong: true });
  if (figures.lowV !== null) lines.push({ key: "low", value: figures.lowV, label: `Low ${formatLevelOf(figures.lowV, swing, unit)}`, strong: true });
  const refs = figures.referenceLevels;
  if (refs) {
    lines.push({ key: "90", value: refs.high90, label: "90 %", strong: false });
    lines.push({ key: "50", value: refs.mesial50, label: "50 %", strong: false });
    lines.push({ key: "10", value: refs.low10, label: "10 %", strong: false });
  }
  return lines;
}

/** A horizontal dimension line with arrow ends and its label above, clipped to the plot. */
function Dimension({ x1, x2, y, label, testId }: { x1: number; x2: number; y: number; label: string; testId: string }) {
  const a = Math.max(plotLeft, Math.min(x1, x2));
  const b = Math.min(plotRight, Math.max(x1, x2));
  if (b - a < 2) return null;
  const mid = (a + b) / 2;
  const wide = b - a > label.length * 7.5 + 12;
  return (
    <g data-testid={testId} className="font-sans" fontSize={13}>
      <line x1={a} x2={b} y1={y} y2={y} className="stroke-graphite-800" strokeWidth={1.25} markerStart="url(#capture-arrow)" markerEnd="url(#capture-arrow)" />
      <text
        x={wide ? mid : b + 4 > plotRight - 80 ? a - 4 : b + 4}
        y={y - 5}
        textAnchor={wide ? "middle" : b + 4 > plotRight - 80 ? "end" : "start"}
        className="fill-graphite-900 stroke-paper-raised font-semibold"
        strokeWidth={4}
        paintOrder="stroke"
      >
        {label}
      </text>
    </g>
  );
}

export function TracePlot({ svgRef, title, description, view, groups, traces, focus, pins, draftPinS, selection, hover, activePinId }: TracePlotProps) {
  const sx = linearScale([view.from, view.to], [plotLeft, plotRight]);
  const scales = groups.map((g) => linearScale(g.domain, [bottom, top]));
  const xTicks = niceTicks(view.from, view.to, 8).ticks.filter((t) => t >= view.from && t <= view.to);
  const xLabels = tickLabels(xTicks, "s");
  const inView = (t: number) => t >= view.from && t <= view.to;

  const axes = groups
    .map((g, i) => ({ g, i }))
    .filter(({ g }) => g.side !== "none")
    .map(({ g, i }) => {
      const ticks = niceTicks(g.domain[0], g.domain[1], 6).ticks.filter((t) => t >= g.domain[0] && t <= g.domain[1]);
      return { side: g.side, unit: g.unit, ticks, labels: tickLabels(ticks, g.unit), scale: scales[i]! };
    });
  const left = axes.find((a) => a.side === "left");
  const right = axes.find((a) => a.side === "right");
  const focusScale = focus ? scales[focus.group] : undefined;
  const markers = focus?.figures.markers ?? null;

  return (
    <svg
      ref={svgRef}
      viewBox={`0 0 ${PLOT_WIDTH} ${PLOT_HEIGHT}`}
      role="img"
      aria-labelledby="capture-plot-title capture-plot-desc"
      className="block h-auto w-full touch-none select-none"
      xmlns="http://www.w3.org/2000/svg"
      data-testid="capture-plot"
      data-from={view.from}
      data-to={view.to}
    >
      <title id="capture-plot-title">{title}</title>
      <desc id="capture-plot-desc">{description}</desc>
      <defs>
        <clipPath id="capture-plot-area">
          <rect x={plotLeft} y={top} width={plotRight - plotLeft} height={bottom - top} />
        </clipPath>
        <marker id="capture-arrow" viewBox="0 0 10 10" refX="5" refY="5" markerWidth="7" markerHeight="7" orient="auto-start-reverse">
          <path d="M0 1 L9 5 L0 9 z" className="fill-graphite-800" />
        </marker>
      </defs>

      <rect x={plotLeft} y={top} width={plotRight - plotLeft} height={bottom - top} className="fill-paper-raised stroke-graphite-300" strokeWidth={1} />

      {/* Grid and tick labels */}
      <g className="font-mono fill-graphite-600" fontSize={12.5}>
        {xTicks.map((t, i) => (
          <g key={`x${t}`}>
            <line x1={sx(t)} x2={sx(t)} y1={top} y2={bottom} className="stroke-graphite-100" strokeWidth={1} />
            <text x={sx(t)} y={bottom + 18} textAnchor="middle">
              {xLabels[i]}
            </text>
          </g>
        ))}
        {left?.ticks.map((t, i) => (
          <g key={`l${t}`}>
            <line x1={plotLeft} x2={plotRight} y1={left.scale(t)} y2={left.scale(t)} className="stroke-graphite-100" strokeWidth={1} />
            <text x={plotLeft - 8} y={left.scale(t)} textAnchor="end" dominantBaseline="middle">
              {left.labels[i]}
            </text>
          </g>
        ))}
        {right?.ticks.map((t, i) => (
          <text key={`r${t}`} x={plotRight + 8} y={right.scale(t)} textAnchor="start" dominantBaseline="middle">
            {right.labels[i]}
          </text>
        ))}
      </g>
      <text x={(plotLeft + plotRight) / 2} y={PLOT_HEIGHT - 8} textAnchor="middle" className="fill-graphite-700 font-sans" fontSize={13}>
        Time
      </text>

      <g clipPath="url(#capture-plot-area)">
        {/* The focus channel's state and reference levels (IEEE Std 181), under the traces */}
        {focus && focusScale
          ? levelLines(focus.figures, focus.unit).map((line) => (
              <g key={line.key} data-level={line.key}>
                <line
                  x1={plotLeft}
                  x2={plotRight}
                  y1={focusScale(line.value)}
                  y2={focusScale(line.value)}
                  className={line.strong ? "stroke-graphite-600" : "stroke-graphite-400"}
                  strokeWidth={line.strong ? 1.25 : 1}
                  strokeDasharray={line.strong ? undefined : "6 5"}
                />
              </g>
            ))
          : null}

        {/* The representative period's crossings of the 50 % level */}
        {markers && focusScale
          ? [markers.pulseStartS, markers.pulseEndS, markers.nextPulseStartS].filter(inView).map((t) => (
              <line key={t} x1={sx(t)} x2={sx(t)} y1={top} y2={bottom} className="stroke-graphite-500" strokeWidth={1} strokeDasharray="2 4" />
            ))
          : null}

        {traces.map((trace) => {
          const sy = scales[trace.group];
          if (!sy) return null;
          const points = trace.timeS.map((t, i) => ({ x: sx(t), y: sy(trace.values[i] ?? 0) }));
          return (
            <path
              key={trace.index}
              d={linePath(points)}
              data-channel={trace.index}
              data-points={trace.timeS.length}
              fill="none"
              className={CHANNEL_STROKES[trace.index % CHANNEL_STROKES.length]}
              strokeWidth={focus?.index === trace.index ? 1.8 : 1.4}
              strokeLinejoin="round"
            />
          );
        })}

        {focus && focusScale && focus.figures.referenceLevels && markers
          ? [markers.pulseStartS, markers.pulseEndS, markers.nextPulseStartS].filter(inView).map((t) => (
              <circle key={`c${t}`} cx={sx(t)} cy={focusScale(focus.figures.referenceLevels!.mesial50)} r={3.5} className="fill-paper-raised stroke-graphite-900" strokeWidth={1.5} />
            ))
          : null}

        {selection ? (
          <rect
            x={sx(Math.min(selection.from, selection.to))}
            y={top}
            width={Math.abs(sx(selection.to) - sx(selection.from))}
            height={bottom - top}
            className="fill-copper-200/40 stroke-copper-500"
            strokeWidth={1}
            data-testid="capture-selection"
          />
        ) : null}

        {hover && inView(hover.timeS) ? <line x1={sx(hover.timeS)} x2={sx(hover.timeS)} y1={top} y2={bottom} className="stroke-graphite-900" strokeWidth={0.75} /> : null}
      </g>

      {/* Level labels sit in the right margin, beside their lines */}
      {focus && focusScale
        ? levelLines(focus.figures, focus.unit).map((line) => {
            const y = focusScale(line.value);
            if (y < top - 2 || y > bottom + 2) return null;
            return (
              <text
                key={`label-${line.key}`}
                x={plotRight - 6}
                y={y - 4}
                textAnchor="end"
                fontSize={12}
                className={cx("font-sans stroke-paper-raised", line.strong ? "fill-graphite-800 font-semibold" : "fill-graphite-600")}
                strokeWidth={3}
                paintOrder="stroke"
              >
                {line.label}
              </text>
            );
          })
        : null}

      {/* Period and pulse width, as dimension lines above the plot */}
      {markers && focus ? (
        <>
          <Dimension
            x1={sx(markers.pulseStartS)}
            x2={sx(markers.pulseEndS)}
            y={top - 30}
            label={`Pulse width ${formatTime(markers.pulseEndS - markers.pulseStartS, 3)}`}
            testId="mark-pulse-width"
          />
          <Dimension
            x1={sx(markers.pulseStartS)}
            x2={sx(markers.nextPulseStartS)}
            y={top - 10}
            label={`Period ${formatTime(markers.nextPulseStartS - markers.pulseStartS, 3)}`}
            testId="mark-period"
          />
        </>
      ) : null}

      {/* Pins: a line through the plot and a numbered flag above it */}
      {pins.filter((p) => inView(p.timeS)).map((pin) => {
        const x = sx(pin.timeS);
        const active = pin.id === activePinId;
        return (
          <g key={pin.id} data-testid="plot-pin" data-pin-id={pin.id} aria-hidden="true">
            <line x1={x} x2={x} y1={top} y2={bottom} className={active ? "stroke-copper-800" : "stroke-graphite-900"} strokeWidth={active ? 2 : 1.25} strokeDasharray="4 3" />
            <rect x={x - 10} y={top - 2} width={20} height={16} rx={2} className={active ? "fill-copper-800" : "fill-graphite-900"} />
            <text x={x} y={top + 10} textAnchor="middle" fontSize={11} className="fill-white font-mono font-semibold">
              {pin.number}
            </text>
          </g>
        );
      })}
      {draftPinS !== undefined && draftPinS !== null && inView(draftPinS) ? (
        <g data-testid="plot-draft-pin" aria-hidden="true">
          <line x1={sx(draftPinS)} x2={sx(draftPinS)} y1={top} y2={bottom} className="stroke-copper-600" strokeWidth={2} />
          <rect x={sx(draftPinS) - 10} y={top - 2} width={20} height={16} rx={2} className="fill-copper-600" />
          <text x={sx(draftPinS)} y={top + 10} textAnchor="middle" fontSize={11} className="fill-white font-mono font-semibold">
            +
          </text>
        </g>
      ) : null}
    </svg>
  );
}
