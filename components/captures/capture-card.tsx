"use client";

import { useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useEffect, useRef, useState, useTransition } from "react";
import { formatReading } from "@/components/bench/format";
import { ProgressBar } from "@/components/uploads/progress-bar";
import { Alert } from "@/components/ui/alert";
import { Button, ButtonLink } from "@/components/ui/button";
import { FormMessage } from "@/components/ui/form-message";
import { StateBadge } from "@/components/ui/state-badge";
import type { CaptureActionResult } from "@/lib/captures/action-schemas";
import { figureRow, figureValue, withPulseWidth, type FigureKey } from "@/lib/captures/figures";
import type { CaptureStatusView } from "@/lib/captures/types";
import { groupThousands } from "@/lib/format/plain";
import { CAPTURE_STATE_WORDS, formatFigure, formatFileSize, formatTime } from "./format";
import { ProposalForm } from "./proposal-form";
import { captureStatusKey, useCaptureStatus } from "./use-capture-status";

const SUMMARY: FigureKey[] = ["frequencyHz", "dutyCyclePct", "amplitudeV", "riseTimeS"];

export type CaptureCardProps = {
  initial: CaptureStatusView;
  viewerHref: string;
  confirm?: (input: unknown) => Promise<CaptureActionResult>;
  remove?: () => Promise<CaptureActionResult>;
  /** re-render the page once measuring ends (the viewer page swaps the card for the trace) */
  refreshWhenDone?: boolean;
  /** the proposal's heading level: 4 under a log's "Scope captures", 3 in a capture page's panel-level flow */
  proposalHeadingLevel?: 3 | 4;
};

function Summary({ status }: { status: CaptureStatusView }) {
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-sm" aria-label={`Main figures of ${status.fileName}`}>
        <thead>
          <tr className="text-left text-xs text-graphite-600">
            <th scope="col" className="py-1 pr-3 font-semibold">Channel</th>
            {SUMMARY.map((key) => (
              <th key={key} scope="col" className="py-1 pr-3 text-right font-semibold">
                {figureRow(key).label}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {status.channels.map((c) => {
            const all = withPulseWidth(c.figures);
            return (
              <tr key={c.index} className="border-t border-graphite-100" data-testid="capture-summary-row">
                <th scope="row" className="py-1 pr-3 text-left font-medium">{c.name}</th>
                {SUMMARY.map((key) => (
                  <td key={key} className="figure py-1 pr-3 text-right font-mono whitespace-nowrap" data-figure={key}>
                    {formatFigure(figureValue(all, key), figureRow(key), c.unit, c.figures.amplitudeV)}
                  </td>
                ))}
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}

/** One capture on a reading: its state while measured (polled), the parser's message, the main figures, the proposal. */
export function CaptureCard({ initial, viewerHref, confirm, remove, refreshWhenDone = false, proposalHeadingLevel = 4 }: CaptureCardProps) {
  const queryClient = useQueryClient();
  const router = useRouter();
  const { data: status, error: pollError } = useCaptureStatus(initial);
  const previous = useRef(status.state);
  useEffect(() => {
    const was = previous.current;
    previous.current = status.state;
    if (refreshWhenDone && (was === "queued" || was === "measuring") && (status.state === "measured" || status.state === "failed")) router.refresh();
  }, [status.state, refreshWhenDone, router]);
  const [message, setMessage] = useState<CaptureActionResult | null>(null);
  const [removing, startRemoving] = useTransition();
  const [confirmingRemove, setConfirmingRemove] = useState(false);
  const word = CAPTURE_STATE_WORDS[status.state];
  const working = status.state === "queued" || status.state === "measuring";

  const confirmed = (answer: Extract<CaptureActionResult, { ok: true }>) => {
    setMessage(answer);
    void queryClient.invalidateQueries({ queryKey: captureStatusKey(status.id) });
  };
  const removeIt = () =>
    startRemoving(async () => {
      if (!remove) return;
      const answer = await remove();
      if (!answer.ok) setMessage(answer);
    });

  return (
    <li className="space-y-3 rounded border border-graphite-200 bg-paper-raised px-3 py-3" data-testid="capture" data-state={status.state} data-capture-id={status.id}>
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <p className="min-w-0 text-sm">
          <span className="font-semibold text-graphite-900 break-all">{status.fileName}</span>{" "}
          <span className="text-graphite-600">· {formatFileSize(status.bytes)}</span>
          {status.sampleCount !== null && status.startTimeS !== null && status.endTimeS !== null ? (
            <span className="text-graphite-600">
              {" "}
              · <span className="figure font-mono">{groupThousands(status.sampleCount)}</span> samples over{" "}
              <span className="figure font-mono">{formatTime(status.endTimeS - status.startTimeS, 3)}</span>
            </span>
          ) : null}
        </p>
        <span data-testid="capture-state">
          <StateBadge label={word.label} tone={word.tone} />
        </span>
      </div>

      {working ? (
        <div className="space-y-1" aria-live="polite">
          <ProgressBar value={status.progress} label={`Measuring ${status.fileName}`} />
          <p className="text-xs text-graphite-600">
            {status.state === "queued" ? "Waiting for the measuring worker; a large capture is measured in the background." : "Reading the samples and measuring every channel…"}
          </p>
        </div>
      ) : null}
      {pollError && working ? <p className="text-sm text-signal-700">{pollError.message} The page keeps trying.</p> : null}

      {status.state === "failed" ? (
        <Alert tone="caution" title="This file could not be measured">
          <p data-testid="capture-error" className="font-mono text-xs whitespace-pre-wrap">
            {status.error}
          </p>
          <p className="mt-1">Save the capture from the instrument as CSV — a time column (or a sample interval line) and one column per channel — and attach it again.</p>
        </Alert>
      ) : null}

      {status.state === "measured" ? (
        <>
          <Summary status={status} />
          {status.applied ? (
            <p className="text-sm text-graphite-700" data-testid="capture-applied">
              Its {figureRow(status.applied.figure as FigureKey).label.toLowerCase()} of{" "}
              {status.channels.find((c) => c.index === status.applied?.channel)?.name ?? "a channel"} is the reading&apos;s value:{" "}
              <span className="figure font-mono font-semibold">{formatReading(status.applied.value, status.checkpoint.unit)}</span> (it was{" "}
              <span className="figure font-mono">{formatReading(status.applied.enteredBefore.value, status.applied.enteredBefore.unit)}</span>).
            </p>
          ) : status.proposal ? (
            <ProposalForm
              proposal={status.proposal}
              checkpoint={status.checkpoint}
              currentValue={status.reading.value}
              confirm={status.canEdit ? confirm : undefined}
              onConfirmed={confirmed}
              headingLevel={proposalHeadingLevel}
            />
          ) : null}
        </>
      ) : null}

      <div data-testid="capture-message">
        <FormMessage tone={message?.ok ? (message.outsideRange ? "info" : "success") : "error"} message={message?.message} />
      </div>

      <div className="flex flex-wrap items-center gap-2">
        {status.state === "measured" ? (
          <ButtonLink href={viewerHref} variant="secondary" size="sm">
            Open the trace
          </ButtonLink>
        ) : null}
        <a href={status.fileUrl} className="text-sm" download={status.fileName}>
          Original file
        </a>
        {remove && status.canEdit && !status.applied ? (
          confirmingRemove ? (
            <span className="flex flex-wrap items-center gap-2 text-sm" role="group" aria-label={`Remove ${status.fileName}?`}>
              <span className="text-graphite-700">Remove this capture and its figures?</span>
              <Button variant="danger" size="sm" onClick={removeIt} disabled={removing}>
                {removing ? "Removing…" : "Remove it"}
              </Button>
              <Button variant="quiet" size="sm" onClick={() => setConfirmingRemove(false)} disabled={removing}>
                Keep it
              </Button>
            </span>
          ) : (
            <Button variant="quiet" size="sm" onClick={() => setConfirmingRemove(true)} aria-label={`Remove the capture ${status.fileName}`}>
              Remove
            </Button>
          )
        ) : null}
      </div>
    </li>
  );
}
