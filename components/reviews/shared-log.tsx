import Link from "next/link";
import { Markdown } from "@/components/markdown";
import { CheckpointCard } from "@/components/bench/checkpoint-card";
import { StageProgress } from "@/components/bench/stage-progress";
import { Panel } from "@/components/ui/panel";
import type { LogView } from "@/db/queries/bench";
import type { BringUpStage } from "@/db/schema/listings";
import { STAGE_LABELS } from "@/lib/listings/labels";

/** The builder's log as the reviewer reads it (read-only): the stages in scope first, the rest folded away. */
export function SharedLog({ log, stages }: { log: LogView; stages: readonly string[] }) {
  const inScope = (stage: BringUpStage) => stages.includes(stage);
  const byStage = (wanted: boolean) =>
    (Object.keys(STAGE_LABELS) as BringUpStage[])
      .filter((stage) => inScope(stage) === wanted)
      .map((stage) => ({ stage, checkpoints: log.checkpoints.filter((c) => c.stage === stage) }))
      .filter((group) => group.checkpoints.length > 0);
  const rest = byStage(false);
  return (
    <Panel title={`The log: ${log.title}`}>
      <div className="space-y-5" data-testid="shared-log">
        <p className="text-sm text-graphite-600">
          Kept by {log.owner.name}
          {log.kit ? ` for the kit “${log.kit.title}”` : ""}. Readings are in each checkpoint&apos;s own unit.{" "}
          {log.canEdit ? <Link href={`/bench/logs/${log.id}`}>Open the log to add readings</Link> : "Read-only here."}
        </p>
        {log.notesMd.trim() !== "" ? <Markdown minHeadingLevel={3}>{log.notesMd}</Markdown> : null}
        <StageProgress progress={log.progress} captionHidden />
        {byStage(true).map((group) => (
          <section key={group.stage} className="space-y-3" data-testid="scope-stage" data-stage={group.stage}>
            <h3 className="text-lg font-semibold">
              {STAGE_LABELS[group.stage]} <span className="text-sm font-normal text-graphite-600">· in scope</span>
            </h3>
            {group.checkpoints.map((c) => (
              <CheckpointCard key={c.id} checkpoint={c} />
            ))}
          </section>
        ))}
        {rest.length > 0 ? (
          <details className="rounded border border-graphite-200 px-3 py-2">
            <summary className="cursor-pointer font-medium text-copper-700">Stages not booked for review</summary>
            <div className="space-y-4 pt-3">
              {rest.map((group) => (
                <section key={group.stage} className="space-y-3">
                  <h3 className="font-semibold">{STAGE_LABELS[group.stage]}</h3>
                  {group.checkpoints.map((c) => (
                    <CheckpointCard key={c.id} checkpoint={c} />
                  ))}
                </section>
              ))}
            </div>
          </details>
        ) : null}
      </div>
    </Panel>
  );
}
