"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { useCallback, useEffect, useId, useMemo, useRef, useState, type KeyboardEvent, type PointerEvent } from "react";
import { useDebouncedValue } from "@/components/catalog/use-debounced-value";
import { Button } from "@/components/ui/button";
import { cx } from "@/components/ui/cx";
import type { CaptureChannelView, CapturePinView, CaptureWindowView } from "@/lib/captures/types";
import { DEFAULT_POINTS, windowUrl } from "@/lib/captures/window-url";
import { groupThousands } from "@/lib/format/plain";
import { formatLevel, formatTime } from "./format";
import { CHANNEL_SWATCHES, MARGIN, PLOT_WIDTH, TracePlot, plotLeft, plotRight, type AxisGroup, type PlotTrace } from "./trace-plot";
import { centreOn, minimumSpan, nearestIndex, panBy, rangeSpan, sameSpan, valueDomain, zoomAround, type Span } from "./viewer-math";
import { WindowTable } from "./window-table";

export type CaptureViewerProps = {
  captureId: string;
  fileName: string;
  channels: readonly CaptureChannelView[];
  bounds: Span;
  sampleIntervalS: number | null;
  sampleCount: number;
  /** the whole capture, drawn on the server's render */
  initialWindow: CaptureWindowView;
  pins?: readonly CapturePinView[];
  /** the channel whose levels and period are marked first */
  focusChannel?: number;
  /** when set, a click on the trace picks a time (the reviewer's pin form) */
  onPickTime?: (timeS: number) => void;
  draftPinS?: number | null;
  activePinId?: string | null;
  /** asks the viewer to bring a time into view (a pin chosen in the list) */
  showTime?: { timeS: number; nonce: number } | null;
};

const ZOOM_STEP = 0.5;
const WHEEL_STEP = 0.8;
const DRAG_THRESHOLD_PX = 6;

async function fetchWindow(captureId: string, view: Span, points: number): Promise<CaptureWindowView> {
  const response = await fetch(windowUrl(captureId, view, points), { headers: { accept: "application/json" } });
  if (!response.ok) {
    const body = (await response.json().catch(() => null)) as { message?: string } | null;
    throw new Error(body?.message ?? `The trace could not be loaded (${response.status}).`);
  }
  return (await response.json()) as CaptureWindowView;
}

function axisGroups(channels: readonly CaptureChannelView[]): { groups: AxisGroup[]; groupOf: Map<number, number> } {
  const groups: AxisGroup[] = [];
  const groupOf = new Map<number, number>();
  for (const c of channels) {
    const unit = c.unit || "V";
    let g = groups.findIndex((x) => x.unit === unit);
    if (g === -1) {
      g = groups.length;
      groups.push({ unit, domain: [0, 1], side: g === 0 ? "left" : g === 1 ? "right" : "none", channels: [] });
    }
    groups[g]!.channels.push(c.index);
    groupOf.set(c.index, g);
  }
  for (const g of groups) g.domain = valueDomain(channels.filter((c) => g.channels.includes(c.index)));
  return { groups, groupOf };
}

/**
 * The interactive trace of a capture: channels overlaid with a legend, zoom (wheel, dragging a
 * range, buttons, keys) and pan, each fetching a finer LTTB downsample of the visible window
 * from the window route. The focus channel's state levels, 10/50/90 % reference levels, period
 * and pulse width are marked; a table of the visible trace is the text alternative.
 */
export function CaptureViewer({
  captureId,
  fileName,
  channels,
  bounds,
  sampleIntervalS,
  sampleCount,
  initialWindow,
  pins = [],
  focusChannel = 0,
  onPickTime,
  draftPinS,
  activePinId,
  showTime,
}: CaptureViewerProps) {
  const id = useId();
  const svgRef = useRef<SVGSVGElement>(null);
  const areaRef = useRef<HTMLDivElement>(null);
  const [view, setView] = useState<Span>(bounds);
  const [visible, setVisible] = useState<Set<number>>(() => new Set(channels.map((c) => c.index)));
  const [focus, setFocus] = useState(channels.some((c) => c.index === focusChannel) ? focusChannel : (channels[0]?.index ?? 0));
  const [drag, setDrag] = useState<{ startS: number; startPx: number; nowS: number; moved: boolean } | null>(null);
  const [hover, setHover] = useState<number | null>(null);
  const minSpan = minimumSpan(bounds, sampleIntervalS);

  const settled = useDebouncedValue(view, 120);
  const whole = sameSpan(settled, bounds);
  const query = useQuery({
    queryKey: ["capture-window", captureId, settled.from, settled.to, DEFAULT_POINTS],
    queryFn: () => fetchWindow(captureId, settled, DEFAULT_POINTS),
    initialData: whole ? initialWindow : undefined,
    placeholderData: keepPreviousData,
    staleTime: Infinity,
  });
  const data = query.data ?? initialWindow;

  const { groups, groupOf } = useMemo(() => axisGroups(channels), [channels]);
  const traces: PlotTrace[] = data.traces.filter((t) => visible.has(t.index)).map((t) => ({ ...t, group: groupOf.get(t.index) ?? 0 }));
  const focusView = channels.find((c) => c.index === focus);
  const numberedPins = useMemo(() => pins.map((p, i) => ({ ...p, number: i + 1 })), [pins]);

  // A pin picked in the list is brought into view, keeping the zoom when it already shows it.
  useEffect(() => {
    if (!showTime) return;
    setView((current) => (showTime.timeS >= current.from && showTime.timeS <= current.to ? current : centreOn(showTime.timeS, current.to - current.from, bounds)));
  }, [showTime, bounds]);

  const timeAtClientX = useCallback(
    (clientX: number): number => {
      const svg = svgRef.current;
      if (!svg) return view.from;
      const rect = svg.getBoundingClientRect();
      const x = ((clientX - rect.left) / rect.width) * PLOT_WIDTH;
      const share = (Math.min(plotRight, Math.max(plotLeft, x)) - plotLeft) / (plotRight - plotLeft);
      return view.from + share * (view.to - view.from);
    },
    [view],
  );

  // The wheel zooms around the pointer; React's wheel listener is passive, so the page would scroll too.
  useEffect(() => {
    const area = areaRef.current;
    if (!area) return;
    const onWheel = (event: WheelEvent) => {
      event.preventDefault();
      const horizontal = Math.abs(event.deltaX) > Math.abs(event.deltaY) || event.shiftKey;
      if (horizontal) {
        const delta = event.shiftKey ? event.deltaY : event.deltaX;
        setView((v) => panBy(v, bounds, Math.sign(delta) * 0.1));
        return;
      }
      const anchor = timeAtClientX(event.clientX);
      setView((v) => zoomAround(v, bounds, event.deltaY < 0 ? WHEEL_STEP : 1 / WHEEL_STEP, anchor, minSpan));
    };
    area.addEventListener("wheel", onWheel, { passive: false });
    return () => area.removeEventListener("wheel", onWheel);
  }, [bounds, minSpan, timeAtClientX]);

  const middle = (view.from + view.to) / 2;
  const zoomIn = () => setView((v) => zoomAround(v, bounds, ZOOM_STEP, (v.from + v.to) / 2, minSpan));
  const zoomOut = () => setView((v) => zoomAround(v, bounds, 1 / ZOOM_STEP, (v.from + v.to) / 2, minSpan));
  const pan = (fraction: number) => setView((v) => panBy(v, bounds, fraction));
  const reset = () => setView(bounds);
  const markers = focusView?.figures.markers ?? null;
  const showPeriod = () => {
    if (!markers) return;
    const period = markers.nextPulseStartS - markers.pulseStartS;
    setView(rangeSpan(markers.pulseStartS - period * 0.2, markers.nextPulseStartS + period * 0.2, bounds, minSpan));
  };

  const onKeyDown = (event: KeyboardEvent<HTMLDivElement>) => {
    const handled = (() => {
      switch (event.key) {
        case "+":
        case "=":
          zoomIn();
          return true;
        case "-":
        case "_":
          zoomOut();
          return true;
        case "ArrowLeft":
          pan(event.shiftKey ? -0.5 : -0.1);
          return true;
        case "ArrowRight":
          pan(event.shiftKey ? 0.5 : 0.1);
          return true;
        case "Home":
        case "0":
          reset();
          return true;
        case "Enter":
          if (onPickTime) onPickTime(middle);
          return onPickTime !== undefined;
        default:
          return false;
      }
    })();
    if (handled) event.preventDefault();
  };

  // The drag lives in a ref as well as in state: a quick click's pointerup can come before the
  // render that would hand the handler the new state.
  const dragRef = useRef<typeof drag>(null);
  const setDragBoth = (next: typeof drag) => {
    dragRef.current = next;
    setDrag(next);
  };
  const onPointerDown = (event: PointerEvent<HTMLDivElement>) => {
    if (event.button !== 0) return;
    event.currentTarget.setPointerCapture(event.pointerId);
    const t = timeAtClientX(event.clientX);
    setDragBoth({ startS: t, startPx: event.clientX, nowS: t, moved: false });
  };
  const onPointerMove = (event: PointerEvent<HTMLDivElement>) => {
    const t = timeAtClientX(event.clientX);
    setHover(t);
    const current = dragRef.current;
    if (current) setDragBoth({ ...current, nowS: t, moved: current.moved || Math.abs(event.clientX - current.startPx) > DRAG_THRESHOLD_PX });
  };
  const onPointerUp = (event: PointerEvent<HTMLDivElement>) => {
    const current = dragRef.current;
    if (!current) return;
    const t = timeAtClientX(event.clientX);
    const moved = current.moved || Math.abs(event.clientX - current.startPx) > DRAG_THRESHOLD_PX;
    if (moved) setView(rangeSpan(current.startS, t, bounds, minSpan));
    else if (onPickTime) onPickTime(t);
    setDragBoth(null);
  };

  const readout = hover !== null && !drag ? data.traces.filter((t) => visible.has(t.index)).map((t) => ({ trace: t, i: nearestIndex(t.timeS, hover) })) : [];
  const zoomFactor = (bounds.to - bounds.from) / (view.to - view.from);
  const helpId = `${id}-help`;
  const statusId = `${id}-status`;

  return (
    <div className="space-y-3" data-testid="capture-viewer">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <ul className="flex flex-wrap gap-x-4 gap-y-2" aria-label="Channels">
          {channels.map((c) => {
            const group = groups[groupOf.get(c.index) ?? 0];
            return (
              <li key={c.index} className="flex items-center gap-2 text-sm">
                <label className="flex items-center gap-2">
                  <input
                    type="checkbox"
                    className="size-4 accent-copper-600"
                    checked={visible.has(c.index)}
                    onChange={(event) => {
                      const on = event.currentTarget.checked;
                      setVisible((s) => {
                        const next = new Set(s);
                        if (on) next.add(c.index);
                        else if (next.size > 1) next.delete(c.index);
                        return next;
                      });
                    }}
                    aria-label={`Show ${c.name}`}
                  />
                  <span aria-hidden="true" className={cx("inline-block h-1 w-6 rounded-full", CHANNEL_SWATCHES[c.index % CHANNEL_SWATCHES.length])} />
                  <span className="font-medium text-graphite-900">{c.name}</span>
                  <span className="text-graphite-600">
                    ({c.unit || "V"}
                    {group?.side === "right" ? ", right axis" : group?.side === "none" ? ", own scale" : ""})
                  </span>
                </label>
              </li>
            );
          })}
        </ul>
        {channels.length > 1 ? (
          <label className="flex items-center gap-2 text-sm">
            <span className="font-semibold text-graphite-900">Mark levels of</span>
            <select
              className="h-8 rounded border border-graphite-300 bg-paper-raised px-2 text-sm"
              value={String(focus)}
              onChange={(event) => setFocus(Number(event.currentTarget.value))}
            >
              {channels.map((c) => (
                <option key={c.index} value={String(c.index)}>
                  {c.name}
                </option>
              ))}
            </select>
          </label>
        ) : null}
      </div>

      <div className="flex flex-wrap items-center gap-2" role="toolbar" aria-label="Zoom and pan" aria-controls={`${id}-plot`}>
        <Button size="sm" variant="secondary" onClick={zoomIn} disabled={view.to - view.from <= minSpan * 1.0001} aria-keyshortcuts="+">
          Zoom in
        </Button>
        <Button size="sm" variant="secondary" onClick={zoomOut} disabled={sameSpan(view, bounds)} aria-keyshortcuts="-">
          Zoom out
        </Button>
        <Button size="sm" variant="secondary" onClick={() => pan(-0.5)} disabled={view.from <= bounds.from} aria-label="Pan earlier" aria-keyshortcuts="Shift+ArrowLeft">
          ← Earlier
        </Button>
        <Button size="sm" variant="secondary" onClick={() => pan(0.5)} disabled={view.to >= bounds.to} aria-label="Pan later" aria-keyshortcuts="Shift+ArrowRight">
          Later →
        </Button>
        <Button size="sm" variant="quiet" onClick={reset} disabled={sameSpan(view, bounds)} aria-keyshortcuts="Home">
          Whole capture
        </Button>
        {markers ? (
          <Button size="sm" variant="quiet" onClick={showPeriod}>
            Show the measured period
          </Button>
        ) : null}
        <span className="ml-auto figure font-mono text-xs text-graphite-600" data-testid="capture-zoom">
          ×{zoomFactor < 10 ? zoomFactor.toFixed(1) : Math.round(zoomFactor)}
        </span>
      </div>

      <div
        id={`${id}-plot`}
        ref={areaRef}
        tabIndex={0}
        role="group"
        aria-label={`Trace of ${fileName}`}
        aria-describedby={`${helpId} ${statusId}`}
        onKeyDown={onKeyDown}
        onPointerDown={onPointerDown}
        onPointerMove={onPointerMove}
        onPointerUp={onPointerUp}
        onPointerLeave={() => setHover(null)}
        onPointerCancel={() => setDragBoth(null)}
        className={cx(
          "relative rounded border border-graphite-200 bg-paper-raised focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-copper-500",
          onPickTime ? "cursor-crosshair" : "cursor-zoom-in",
        )}
        data-testid="capture-plot-area"
      >
        <TracePlot
          svgRef={svgRef}
          title={`Trace of ${fileName}`}
          description={`${channels.length} channel${channels.length === 1 ? "" : "s"} from ${formatTime(view.from)} to ${formatTime(view.to)}. The marked lines are ${focusView?.name ?? "the channel"}'s high and low state levels and its 10, 50 and 90 % reference levels; the arrows above show the measured period and pulse width.`}
          view={view}
          groups={groups}
          traces={traces}
          focus={focusView ? { index: focusView.index, name: focusView.name, unit: focusView.unit, group: groupOf.get(focusView.index) ?? 0, figures: focusView.figures } : null}
          pins={numberedPins}
          draftPinS={draftPinS}
          activePinId={activePinId}
          selection={drag?.moved ? { from: drag.startS, to: drag.nowS } : null}
          hover={hover !== null && !drag ? { timeS: hover } : null}
        />
        {query.isFetching ? (
          <span className="pointer-events-none absolute top-2 right-3 rounded-sm bg-paper-sunken px-2 py-0.5 text-xs text-graphite-700" style={{ marginRight: MARGIN.right }}>
            Loading a finer trace…
          </span>
        ) : null}
      </div>

      <p className="min-h-5 text-sm text-graphite-800" aria-hidden="true" data-testid="capture-readout">
        {readout.length > 0 && hover !== null ? (
          <>
            <span className="figure font-mono">{formatTime(hover, 5)}</span>
            {readout.map(({ trace, i }) => (
              <span key={trace.index} className="ml-4">
                {trace.name} <span className="figure font-mono">{i >= 0 ? formatLevel(trace.values[i] ?? 0, trace.unit) : "—"}</span>
              </span>
            ))}
          </>
        ) : (
          <span className="text-graphite-600">Point at the trace to read its values{onPickTime ? "; click to choose a time for a comment" : ""}.</span>
        )}
      </p>

      <p id={statusId} className="text-sm text-graphite-700" aria-live="polite" data-testid="capture-window-status">
        Showing <span className="figure font-mono">{formatTime(view.from)}</span> to <span className="figure font-mono">{formatTime(view.to)}</span> of{" "}
        <span className="figure font-mono">{formatTime(bounds.from)}</span>–<span className="figure font-mono">{formatTime(bounds.to)}</span>
        {" · "}
        <span className="figure font-mono" data-testid="capture-samples-in-window">
          {groupThousands(data.samplesInWindow)}
        </span>{" "}
        of <span className="figure font-mono">{groupThousands(sampleCount)}</span> samples in this window
        {query.isError ? <span className="text-signal-700"> · {(query.error as Error).message}</span> : null}
      </p>
      <p id={helpId} className="text-xs text-graphite-600">
        Zoom with the mouse wheel, by dragging across a range, with the buttons, or with + and − on the focused plot; pan with Shift and the wheel, the arrow keys or the
        buttons; Home shows the whole capture.{onPickTime ? " Enter picks the middle of the window as the comment's time." : ""}
      </p>

      <WindowTable traces={data.traces.filter((t) => visible.has(t.index))} view={view} />
    </div>
  );
}
