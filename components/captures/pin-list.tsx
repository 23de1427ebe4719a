"use client";

import { formatTakenAt } from "@/components/bench/format";
import { Button } from "@/components/ui/button";
import { cx } from "@/components/ui/cx";
import type { CapturePinView } from "@/lib/captures/types";
import { formatTime } from "./format";

/** The reviewers' comments pinned to the trace, in time order; each can be shown on the plot. */
export function PinList({
  pins,
  channelName,
  activePinId,
  onShow,
  emptyText,
}: {
  pins: readonly CapturePinView[];
  channelName: (index: number) => string;
  activePinId?: string | null;
  onShow: (pin: CapturePinView) => void;
  emptyText: string;
}) {
  if (pins.length === 0) return <p className="text-sm text-graphite-600">{emptyText}</p>;
  return (
    <ol className="space-y-2" aria-label="Comments pinned to the trace, in time order" data-testid="pin-list">
      {pins.map((pin, i) => (
        <li
          key={pin.id}
          className={cx("rounded border bg-paper-raised px-3 py-2", pin.id === activePinId ? "border-copper-600 ring-1 ring-copper-600" : "border-graphite-200")}
          data-testid="pin"
          data-pin-id={pin.id}
        >
          <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1 text-sm">
            <span className="figure inline-flex h-5 min-w-5 items-center justify-center rounded-sm bg-graphite-900 px-1 font-mono text-xs font-semibold text-white" aria-label={`Pin ${i + 1}`}>
              {i + 1}
            </span>
            <span className="figure font-mono font-semibold" data-testid="pin-time">
              {formatTime(pin.timeS, 5)}
            </span>
            <span className="text-graphite-600">{pin.channel === null ? "all channels" : channelName(pin.channel)}</span>
            <span className="text-graphite-600">
              {pin.authorName} · {formatTakenAt(new Date(pin.createdAt))}
            </span>
            <Button variant="quiet" size="sm" className="ml-auto" onClick={() => onShow(pin)} aria-label={`Show pin ${i + 1} on the trace`}>
              Show on the trace
            </Button>
          </div>
          {/* Plain text: a comment is read as written, never as markup. */}
          <p className="mt-1 text-sm whitespace-pre-line text-graphite-900" data-testid="pin-body">
            {pin.body}
          </p>
        </li>
      ))}
    </ol>
  );
}
