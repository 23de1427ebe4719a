import type { BringUpStage } from "@/db/schema/listings";
import type { CheckpointVerdict } from "@/db/schema/reviews";
import { STAGE_LABELS } from "@/lib/listings/labels";
import type { SettleOutcome } from "@/lib/validations/reviews";

/** The reviewer's verdict words; "stop" spells out what it means for the builder. */
export const VERDICT_LABELS: Record<CheckpointVerdict, { label: string; meaning: string; tone: "clear" | "caution" | "stop" }> = {
  fine: { label: "Fine", meaning: "Nothing to change here.", tone: "clear" },
  needs_attention: { label: "Needs attention", meaning: "Look at this before going further.", tone: "caution" },
  stop: { label: "Stop", meaning: "Do not power up again until this is fixed.", tone: "stop" },
};

export const SETTLE_LABELS: Record<SettleOutcome, string> = {
  payment_stands: "the payment stands",
  refund_full: "refunded in full",
  refund_partial: "refunded in part",
};

export const DISPUTE_OUTCOME_LABELS: Record<string, string> = {
  open: "Open",
  closed_payment_stands: "Payment stands",
  refunded_full: "Refunded in full",
  refunded_partial: "Refunded in part",
};

export function stageList(stages: readonly string[]): string {
  return stages.map((s) => STAGE_LABELS[s as BringUpStage] ?? s).join(", ");
}
