import { BRING_UP_STAGES, type BringUpStage } from "@/db/schema/listings";
import type { ReadingVerdict } from "@/db/schema/bench";
import { STAGE_LABELS } from "@/lib/listings/labels";

export type ProgressCheckpoint = { id: string; stage: BringUpStage };
export type ProgressReading = { checkpointId: string; verdict: ReadingVerdict; takenAt: Date };

export type StageProgress = {
  stage: BringUpStage;
  label: string;
  checkpoints: number;
  /** checkpoints with at least one reading */
  read: number;
  within: number;
  low: number;
  high: number;
};

/** The newest reading of each checkpoint: a re-measurement after a fix replaces the earlier verdict. */
export function latestReadings<R extends ProgressReading>(readings: readonly R[]): Map<string, R> {
  const latest = new Map<string, R>();
  for (const reading of readings) {
    const current = latest.get(reading.checkpointId);
    if (!current || reading.takenAt.getTime() >= current.takenAt.getTime()) latest.set(reading.checkpointId, reading);
  }
  return latest;
}

/**
 * Stage by stage, in the order of a careful bring-up: how many checkpoints have a reading and
 * how the newest reading of each stands. Every stage is listed, even one without checkpoints.
 */
export function summariseProgress(checkpoints: readonly ProgressCheckpoint[], readings: readonly ProgressReading[]): StageProgress[] {
  const latest = latestReadings(readings);
  return BRING_UP_STAGES.map((stage) => {
    const row: StageProgress = { stage, label: STAGE_LABELS[stage], checkpoints: 0, read: 0, within: 0, low: 0, high: 0 };
    for (const checkpoint of checkpoints) {
      if (checkpoint.stage !== stage) continue;
      row.checkpoints += 1;
      const reading = latest.get(checkpoint.id);
      if (!reading) continue;
      row.read += 1;
      row[reading.verdict] += 1;
    }
    return row;
  });
}

export function stageOrder(stage: BringUpStage): number {
  return BRING_UP_STAGES.indexOf(stage);
}
