"use client";

import { useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { formatReading } from "@/components/bench/format";
import { FormMessage } from "@/components/ui/form-message";
import type { CaptureActionResult } from "@/lib/captures/action-schemas";
import { figureRow, type FigureKey } from "@/lib/captures/figures";
import type { CaptureStatusView } from "@/lib/captures/types";
import { ProposalForm } from "./proposal-form";
import { captureStatusKey, useCaptureStatus } from "./use-capture-status";

/** Beside the reading on the viewer page: the proposed value (the owner confirms it) or what was applied. */
export function ProposalPanel({ initial, confirm }: { initial: CaptureStatusView; confirm?: (input: unknown) => Promise<CaptureActionResult> }) {
  const queryClient = useQueryClient();
  const { data: status } = useCaptureStatus(initial);
  const [message, setMessage] = useState<Extract<CaptureActionResult, { ok: true }> | null>(null);
  return (
    <div className="max-w-md flex-1 space-y-2">
      {status.applied ? (
        <p className="text-sm text-graphite-700" data-testid="capture-applied">
          The {figureRow(status.applied.figure as FigureKey).label.toLowerCase()} of {status.channels.find((c) => c.index === status.applied?.channel)?.name ?? "a channel"} is the
          reading&apos;s value; it was <span className="figure font-mono">{formatReading(status.applied.enteredBefore.value, status.applied.enteredBefore.unit)}</span> before.
        </p>
      ) : status.proposal ? (
        <ProposalForm
          proposal={status.proposal}
          checkpoint={status.checkpoint}
          currentValue={status.reading.value}
          confirm={confirm}
          headingLevel={3}
          onConfirmed={(answer) => {
            setMessage(answer);
            void queryClient.invalidateQueries({ queryKey: captureStatusKey(status.id) });
          }}
        />
      ) : null}
      <div data-testid="capture-message">
        <FormMessage tone={message?.outsideRange ? "info" : "success"} message={message?.message} />
      </div>
    </div>
  );
}
