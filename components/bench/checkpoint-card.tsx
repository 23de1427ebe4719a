import type { ReactNode } from "react";
import { Card } from "@/components/ui/card";
import type { CheckpointView } from "@/db/queries/bench";
import { DeferredDetails } from "./deferred-details";
import { formatRange } from "./format";
import { ReadingList } from "./reading-list";

/** One checkpoint: what to measure, the expected range, its readings and (for the owner) the reading form. */
export function CheckpointCard({ checkpoint, form }: { checkpoint: CheckpointView; form?: ReactNode }) {
  return (
    <Card data-testid="checkpoint" data-checkpoint-name={checkpoint.name} className="space-y-3">
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 className="text-base font-semibold text-graphite-900">{checkpoint.name}</h3>
        <p className="text-sm text-graphite-700">
          Expected <span className="figure font-mono font-semibold" data-testid="expected-range">{formatRange(checkpoint.expectedMin, checkpoint.expectedMax, checkpoint.unit)}</span>
          {checkpoint.addedByBuilder ? <span className="ml-2 text-xs text-graphite-600">(added by the builder)</span> : null}
        </p>
      </header>
      <p className="text-sm text-graphite-700">{checkpoint.measure}</p>
      <ReadingList checkpoint={checkpoint} />
      {form ? (
        <DeferredDetails
          className="rounded border border-graphite-200 bg-paper-sunken px-3 py-2"
          testId="record-reading"
          summary="Record a reading"
          summaryClassName="cursor-pointer font-medium text-copper-700"
          bodyClassName="pt-3"
        >
          {form}
        </DeferredDetails>
      ) : null}
    </Card>
  );
}
