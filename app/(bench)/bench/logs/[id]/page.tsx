import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { AddCheckpointForm } from "@/components/bench/add-checkpoint-form";
import { CheckpointCard } from "@/components/bench/checkpoint-card";
import { CheckpointCaptures, type CaptureActions } from "@/components/captures/checkpoint-captures";
import { formatRange } from "@/components/bench/format";
import { RecordReadingForm } from "@/components/bench/record-reading-form";
import { StageProgress } from "@/components/bench/stage-progress";
import { STAGE_NOTES } from "@/components/bench/stage-notes";
import { VisibilityForm } from "@/components/bench/visibility-form";
import { MainsCaution } from "@/components/caution";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { StateBadge } from "@/components/ui/state-badge";
import { getLogForViewer, type LogAccess } from "@/db/queries/bench";
import { capturesOfLog } from "@/db/queries/captures";
import { BRING_UP_STAGES } from "@/db/schema/listings";
import { unitChoices } from "@/lib/bench/unit-choices";
import { getSessionUser } from "@/lib/auth/guard";
import { STAGE_LABELS } from "@/lib/listings/labels";
import { captureStatusView } from "@/lib/captures/status-view";
import { addCheckpointAction, recordReadingAction, setVisibilityAction } from "./actions";
import { attachCaptureAction, confirmProposalAction, removeCaptureAction } from "./capture-actions";

export const metadata: Metadata = { title: "Bring-up log" };
export const dynamic = "force-dynamic";

const READ_ONLY_NOTES: Record<Exclude<LogAccess, "owner">, string> = {
  reviewer: "You are reading this log as the reviewer of a session its builder booked. Only the builder can change it.",
  moderator: "You are reading this log as a moderator. Only the builder can change it.",
  public: "The builder made this log public. Only they can change it.",
};

export default async function LogPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await getSessionUser();
  // Visitors may read public logs; anyone else not allowed gets the same page as for a missing log.
  const log = await getLogForViewer(viewer, id);
  if (!log) notFound();

  const stageOptions = BRING_UP_STAGES.map((stage) => ({ value: stage, label: STAGE_LABELS[stage] }));
  const record = recordReadingAction.bind(null, log.id);
  const captures = (await capturesOfLog(log.id, log.access)).map(captureStatusView);
  const logId = log.id;
  const captureActions: CaptureActions | undefined = log.canEdit
    ? {
        attach: attachCaptureAction.bind(null, logId),
        confirmFor: (captureId) => confirmProposalAction.bind(null, logId, captureId),
        removeFor: (captureId) => removeCaptureAction.bind(null, logId, captureId),
      }
    : undefined;

  return (
    <article className="space-y-8" data-testid="log-page" data-access={log.access}>
      <PageHeader
        eyebrow={log.canEdit ? <Link href="/bench">My bench</Link> : "Bring-up log"}
        title={log.title}
        lede={
          <>
            {log.kit ? (
              <>
                From the kit <Link href={`/listings/${log.kit.slug}`}>{log.kit.title}</Link>
              </>
            ) : (
              "A build of the builder's own"
            )}
            {log.canEdit ? null : <> · kept by {log.owner.name}</>}
          </>
        }
        actions={<StateBadge label={log.visibility === "public" ? "Public" : "Private"} tone={log.visibility === "public" ? "active" : "neutral"} className="text-sm" />}
      />
      <MainsCaution variant="full" />
      {log.access !== "owner" ? <Alert tone="info">{READ_ONLY_NOTES[log.access]}</Alert> : null}

      <div className="grid gap-8 lg:grid-cols-[3fr_2fr]">
        <div className="space-y-10">
          {BRING_UP_STAGES.map((stage, index) => {
            const checkpoints = log.checkpoints.filter((c) => c.stage === stage);
            return (
              <section key={stage} aria-labelledby={`stage-${stage}`} className="space-y-4" data-testid="stage" data-stage={stage}>
                <header className="max-w-reading">
                  <h2 id={`stage-${stage}`} className="text-xl font-semibold">
                    <span className="figure font-mono text-graphite-600">{index + 1}.</span> {STAGE_LABELS[stage]}
                  </h2>
                  <p className="mt-1 text-sm text-graphite-600">{STAGE_NOTES[stage]}</p>
                </header>
                {checkpoints.length === 0 ? (
                  <p className="text-sm text-graphite-600">No checkpoints at this stage{log.canEdit ? " yet; add your own beside the progress." : "."}</p>
                ) : (
                  checkpoints.map((checkpoint) => (
                    <div key={checkpoint.id}>
                      <CheckpointCard
                        checkpoint={checkpoint}
                        form={
                          log.canEdit ? (
                            <RecordReadingForm
                              checkpoint={{
                                id: checkpoint.id,
                                name: checkpoint.name,
                                unit: checkpoint.unit,
                                range: formatRange(checkpoint.expectedMin, checkpoint.expectedMax, checkpoint.unit),
                              }}
                              units={unitChoices(checkpoint.unit).units}
                              action={record}
                            />
                          ) : undefined
                        }
                      />
                      <CheckpointCaptures checkpoint={checkpoint} captures={captures.filter((c) => c.checkpoint.id === checkpoint.id)} actions={captureActions} />
                    </div>
                  ))
                )}
              </section>
            );
          })}
        </div>

        <aside className="space-y-6" aria-label="Progress and settings">
          <Panel title="Progress">
            <StageProgress progress={log.progress} caption="Checkpoints read and how the newest reading of each stands" captionHidden />
            <p className="mt-3 text-sm text-graphite-600">Finish a stage with every reading within its range before you go on to the next.</p>
          </Panel>
          {log.canEdit ? (
            <>
              <Panel title="Sharing">
                <VisibilityForm visibility={log.visibility} action={setVisibilityAction.bind(null, log.id)} />
              </Panel>
              <Panel title="Add a checkpoint">
                <AddCheckpointForm stages={stageOptions} action={addCheckpointAction.bind(null, log.id)} />
              </Panel>
            </>
          ) : null}
        </aside>
      </div>
    </article>
  );
}
