import { DeferredDetails } from "@/components/bench/deferred-details";
import { formatReading, formatTakenAt } from "@/components/bench/format";
import type { CheckpointView } from "@/db/queries/bench";
import type { CaptureActionResult } from "@/lib/captures/action-schemas";
import { probeCautionFor } from "@/lib/captures/probe-caution";
import { figureForCheckpoint } from "@/lib/captures/proposal";
import type { CaptureStatusView } from "@/lib/captures/types";
import { AttachCaptureForm } from "./attach-capture-form";
import { CaptureCard } from "./capture-card";
import { ProbeCautionNote } from "./probe-caution-note";

export type CaptureActions = {
  attach: (input: unknown) => Promise<CaptureActionResult>;
  confirmFor: (captureId: string) => (input: unknown) => Promise<CaptureActionResult>;
  removeFor: (captureId: string) => () => Promise<CaptureActionResult>;
};

/**
 * The captures of a checkpoint's readings, under its card on the log page; for the owner also
 * the form that attaches one. Nothing is shown for a checkpoint a capture cannot measure that has none.
 */
export function CheckpointCaptures({
  checkpoint,
  captures,
  actions,
  viewerHref = (id) => `/bench/captures/${id}`,
}: {
  checkpoint: CheckpointView;
  captures: readonly CaptureStatusView[];
  /** only for the log's owner */
  actions?: CaptureActions;
  viewerHref?: (captureId: string) => string;
}) {
  const measurable = figureForCheckpoint(checkpoint) !== null;
  const readings = [...checkpoint.readings].reverse().map((r) => ({ id: r.id, label: `${formatReading(r.value, checkpoint.unit)} · ${formatTakenAt(r.takenAt)}` }));
  // An owner attaches to a reading; with none yet (or a checkpoint no capture measures) there is nothing to show.
  if (captures.length === 0 && (!actions || !measurable || readings.length === 0)) return null;
  const caution = probeCautionFor(checkpoint);

  return (
    <section
      aria-label={`Captures at ${checkpoint.name}`}
      className="-mt-1 ml-3 space-y-3 rounded-b-md border border-t-0 border-graphite-200 bg-paper-sunken px-4 pt-4 pb-3"
      data-testid="checkpoint-captures"
      data-checkpoint-name={checkpoint.name}
    >
      {captures.length > 0 ? (
        <>
          <h4 className="text-sm font-semibold text-graphite-900">Scope captures</h4>
          <ul className="space-y-2">
            {captures.map((capture) => (
              <CaptureCard
                key={capture.id}
                initial={capture}
                viewerHref={viewerHref(capture.id)}
                confirm={actions?.confirmFor(capture.id)}
                remove={actions?.removeFor(capture.id)}
              />
            ))}
          </ul>
        </>
      ) : null}
      {actions && readings.length > 0 ? (
          <DeferredDetails
            className="rounded border border-graphite-200 bg-paper-raised px-3 py-2"
            testId="attach-capture-details"
            summary={`Attach a scope capture${captures.length > 0 ? " to another reading or probe point" : ""}`}
            summaryClassName="cursor-pointer text-sm font-medium text-copper-700"
            bodyClassName="space-y-3 pt-3"
            lead={caution ? <ProbeCautionNote caution={caution} /> : null}
          >
            <AttachCaptureForm checkpointName={checkpoint.name} readings={readings} attach={actions.attach} />
          </DeferredDetails>
      ) : null}
    </section>
  );
}
