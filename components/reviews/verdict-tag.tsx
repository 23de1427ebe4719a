import { StateBadge } from "@/components/ui/state-badge";
import type { CheckpointVerdict } from "@/db/schema/reviews";
import { VERDICT_LABELS } from "@/lib/reviews/labels";

/** The reviewer's verdict as its word; "stop" is the one place the deep red is used in a report. */
export function VerdictTag({ verdict }: { verdict: CheckpointVerdict }) {
  const entry = VERDICT_LABELS[verdict];
  return <StateBadge label={entry.label} tone={entry.tone} />;
}
