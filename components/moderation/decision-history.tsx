import type { DecisionRow } from "@/db/queries/moderation";
import { EmptyState } from "@/components/ui/empty-state";
import { DECISION_LABELS, reasonTopicLabel } from "./labels";
import { RelativeTime } from "./relative-time";

export function DecisionHistory({ decisions }: { decisions: DecisionRow[] }) {
  if (decisions.length === 0) return <EmptyState title="No decisions yet">This listing has not been submitted before.</EmptyState>;
  return (
    <ol className="space-y-3" data-testid="decision-history">
      {decisions.map((d) => (
        <li key={d.id} className="border-l-2 border-graphite-300 pl-3">
          <p className="text-sm">
            <span className="font-semibold">{DECISION_LABELS[d.decision] ?? d.decision}</span>
            <span className="text-graphite-600"> · {d.actorName ?? "the platform"} · </span>
            <RelativeTime iso={d.createdAt.toISOString()} />
            {d.policyRevision ? <span className="ml-2 font-mono text-xs text-graphite-600">rev. {d.policyRevision}</span> : null}
          </p>
          {d.reasons.length > 0 ? (
            <ul className="mt-1 space-y-1 text-sm">
              {d.reasons.map((r, i) => (
                <li key={i}>
                  <strong>{reasonTopicLabel(r.topic)}:</strong> {r.text}
                </li>
              ))}
            </ul>
          ) : null}
          {d.note ? <p className="mt-1 whitespace-pre-line text-sm text-graphite-700">{d.note}</p> : null}
        </li>
      ))}
    </ol>
  );
}
