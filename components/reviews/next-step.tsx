import { ButtonLink } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import type { SessionDetail } from "@/db/queries/reviews";
import { formatWhen } from "@/lib/reviews/format";
import { deliverBy } from "@/lib/reviews/transitions";

/** What happens next on this session, in words, for the person looking at it. */
export function nextStepText(s: SessionDetail): string {
  const builder = s.viewerRole === "builder";
  switch (s.state) {
    case "requested":
      return builder
        ? `Waiting for ${s.reviewerName} to accept or decline, until ${formatWhen(s.respondBy)}. If they decline or do not answer, the hold on your card is released.`
        : `Waiting for ${s.reviewerName}'s answer, until ${formatWhen(s.respondBy)}.`;
    case "accepted":
      return builder
        ? `${s.reviewerName} is reading your log; the report is due by ${formatWhen(deliverBy(s))}. Keep the build de-energised and the bus discharged until you have read it.`
        : `The report is due by ${formatWhen(deliverBy(s))}.`;
    case "delivered":
      return s.disputeBy ? `The report is delivered. It can be disputed until ${formatWhen(s.disputeBy)}; after that the session closes.` : "The report is delivered.";
    case "disputed":
      return "A moderator is reading the report against the log and will decide whether the payment stands or is refunded in part or in full.";
    case "closed":
      return "This session is closed.";
    case "declined":
      return builder ? `${s.reviewerName} declined. Nothing was charged; you can book another reviewer.` : "You declined this request; nothing was charged.";
    case "expired":
      return builder ? "The request ran out of time. Nothing was charged; you can book another reviewer." : "This request ran out of time; nothing was charged.";
  }
}

export function NextStep({ session }: { session: SessionDetail }) {
  const rebook = session.viewerRole === "builder" && (session.state === "declined" || session.state === "expired");
  return (
    <Panel title="What happens next">
      <div className="space-y-3 text-sm" data-testid="next-step">
        <p>{nextStepText(session)}</p>
        {rebook ? (
          <ButtonLink href={`/reviews/new?log=${session.logId}`} variant="secondary">
            Book another reviewer
          </ButtonLink>
        ) : null}
      </div>
    </Panel>
  );
}
