import { ProductStateBadge } from "@/components/ui/state-badge";
import { topicLabel, type SafetyTopicKey } from "@/lib/policy";
import type { ListingDecisionKind, TopicReason } from "@/db/schema/moderation";

const WORDS: Record<ListingDecisionKind, { label: string; state: string }> = {
  submitted: { label: "Submitted for review", state: "in_review" },
  approved: { label: "Approved", state: "live" },
  sent_back: { label: "Sent back", state: "sent_back" },
  held: { label: "Held", state: "held" },
  restored: { label: "Restored", state: "live" },
  retired: { label: "Retired", state: "retired" },
  grace_notice: { label: "New policy: grace period started", state: "sent_back" },
  grace_expired: { label: "Held: grace period ran out", state: "held" },
};

export type DecisionEntry = {
  id: string;
  decision: ListingDecisionKind;
  reasons: TopicReason[];
  note: string | null;
  policyRevision: number | null;
  createdAt: Date;
  actorName: string | null;
  actorId: string | null;
};

/** What happened to a listing, newest first, with the moderators' reasons in full. */
export function DecisionHistory({ entries, sellerId }: { entries: DecisionEntry[]; sellerId: string }) {
  if (entries.length === 0) return <p className="text-sm text-graphite-600">Nothing has happened to this listing yet: it is a draft only you can see.</p>;
  return (
    <ol className="space-y-4" data-testid="decision-history">
      {entries.map((e) => (
        <li key={e.id} className="border-l-2 border-graphite-200 pl-3">
          <div className="flex flex-wrap items-center gap-2 text-sm">
            <ProductStateBadge kind="listing" state={WORDS[e.decision].state} />
            <span className="font-semibold">{WORDS[e.decision].label}</span>
            <span className="text-graphite-600">
              {e.actorId === null ? "by the platform" : e.actorId === sellerId ? "by you" : `by ${e.actorName ?? "a moderator"}`} ·{" "}
              <time dateTime={e.createdAt.toISOString()}>{e.createdAt.toISOString().slice(0, 16).replace("T", " ")} UTC</time>
              {e.policyRevision ? ` · policy revision ${e.policyRevision}` : ""}
            </span>
          </div>
          {e.reasons.length > 0 ? (
            <ul className="mt-1 list-disc pl-5 text-sm">
              {e.reasons.map((r) => (
                <li key={r.topic + r.text}>
                  <strong>{topicLabel(r.topic as SafetyTopicKey)}:</strong> {r.text}
                </li>
              ))}
            </ul>
          ) : null}
          {e.note ? <p className="mt-1 text-sm">{e.note}</p> : null}
        </li>
      ))}
    </ol>
  );
}
