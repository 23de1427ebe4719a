"use client";

import { useRouter } from "next/navigation";
import { useMemo, useState, type ReactNode } from "react";
import { formatSi } from "@/components/ui/format";
import { Panel } from "@/components/ui/panel";
import type { CaptureActionResult } from "@/lib/captures/action-schemas";
import { unpackWindow, type PackedWindowView } from "@/lib/captures/packed-window";
import type { CaptureChannelView, CapturePinView } from "@/lib/captures/types";
import { CaptureViewer } from "./capture-viewer";
import { FiguresTable } from "./figures-table";
import { PinForm } from "./pin-form";
import { PinList } from "./pin-list";
import type { Span } from "./viewer-math";

export type CaptureWorkspaceProps = {
  captureId: string;
  fileName: string;
  channels: readonly CaptureChannelView[];
  bounds: Span;
  sampleIntervalS: number | null;
  sampleCount: number;
  /** the whole capture, packed for the page (lib/captures/packed-window.ts) */
  initialWindow: PackedWindowView;
  focusChannel: number;
  highlight: { channel: number; figure: string } | null;
  /** null: this reader sees no pins (a visitor of a public log) */
  pins: readonly CapturePinView[] | null;
  /** the reviewer's pin action, bound to their session */
  pin?: (input: unknown) => Promise<CaptureActionResult>;
  /** shown above the pin list, e.g. where to reply */
  pinsNote?: ReactNode;
};

/** The viewer with the figures beside it and the pinned comments below: the same for the builder and in a review. */
export function CaptureWorkspace(props: CaptureWorkspaceProps) {
  const router = useRouter();
  const [timeText, setTimeText] = useState("");
  const [draft, setDraft] = useState<number | null>(null);
  const [active, setActive] = useState<string | null>(null);
  const [showTime, setShowTime] = useState<{ timeS: number; nonce: number } | null>(null);
  const initialWindow = useMemo(() => unpackWindow(props.initialWindow), [props.initialWindow]);
  const channelName = (index: number) => props.channels.find((c) => c.index === index)?.name ?? `Channel ${index + 1}`;

  const pick = (t: number) => {
    setDraft(t);
    setTimeText(formatSi(t, "s", 6));
  };

  return (
    <div className="space-y-6">
      <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_22rem]">
        <Panel title="Trace">
          <CaptureViewer
            captureId={props.captureId}
            fileName={props.fileName}
            channels={props.channels}
            bounds={props.bounds}
            sampleIntervalS={props.sampleIntervalS}
            sampleCount={props.sampleCount}
            initialWindow={initialWindow}
            pins={props.pins ?? []}
            focusChannel={props.focusChannel}
            onPickTime={props.pin ? pick : undefined}
            draftPinS={props.pin ? draft : null}
            activePinId={active}
            showTime={showTime}
          />
        </Panel>
        <Panel title="Figures" className="self-start">
          <FiguresTable channels={props.channels} caption="Measured per channel (IEEE Std 181 terms)" highlight={props.highlight} />
          {props.highlight ? <p className="mt-2 text-xs text-graphite-600">The highlighted figure is the one proposed as the reading&apos;s value.</p> : null}
        </Panel>
      </div>

      {props.pins !== null ? (
        <Panel title={`Comments on the trace (${props.pins.length})`}>
          <div className="space-y-4">
            {props.pinsNote}
            <PinList
              pins={props.pins}
              channelName={channelName}
              activePinId={active}
              onShow={(p) => {
                setActive(p.id);
                setShowTime({ timeS: p.timeS, nonce: Date.now() });
              }}
              emptyText={props.pin ? "No comments yet. Click the trace where something deserves a word, then write it below." : "No reviewer has pinned a comment to this trace yet."}
            />
            {props.pin ? (
              <div className="border-t border-graphite-200 pt-4">
                <h3 className="mb-3 text-base font-semibold text-graphite-900">Pin a comment</h3>
                <PinForm
                  captureId={props.captureId}
                  channels={props.channels}
                  time={timeText}
                  onTimeChange={(text) => {
                    setTimeText(text);
                    setDraft(null);
                  }}
                  pin={props.pin}
                  onPinned={() => {
                    setDraft(null);
                    setTimeText("");
                    router.refresh();
                  }}
                />
              </div>
            ) : null}
          </div>
        </Panel>
      ) : null}
    </div>
  );
}
