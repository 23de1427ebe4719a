import type { ReactNode } from "react";
import { ProductStateBadge } from "@/components/ui/state-badge";
import type { SessionDetail } from "@/db/queries/reviews";
import { formatMoney } from "@/lib/format/money";
import { formatWhen } from "@/lib/reviews/format";
import { stageList } from "@/lib/reviews/labels";
import { deliverBy } from "@/lib/reviews/transitions";

/** Where the money stands, in words, from the session's own record. */
export function paymentStatus(s: Pick<SessionDetail, "state" | "capturedAt" | "releasedAt" | "refundedMinor" | "priceMinor" | "currency">): string {
  switch (s.state) {
    case "requested":
    case "accepted":
      return "Held on the card, not charged";
    case "declined":
    case "expired":
      return s.releasedAt ? "Released, nothing charged" : "Being released";
    default: {
      if (!s.capturedAt) return "Being charged";
      if (s.refundedMinor === 0) return "Charged";
      return s.refundedMinor >= s.priceMinor ? "Charged, then refunded in full" : `Charged, ${formatMoney(s.refundedMinor, s.currency)} refunded`;
    }
  }
}

function Row({ term, children, testId }: { term: string; children: ReactNode; testId?: string }) {
  return (
    <>
      <dt className="text-graphite-600">{term}</dt>
      <dd data-testid={testId}>{children}</dd>
    </>
  );
}

export function SessionFacts({ session }: { session: SessionDetail }) {
  const asReviewer = session.viewerRole === "reviewer";
  return (
    <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1.5 text-sm" data-testid="session-facts">
      <Row term="State" testId="session-state">
        <ProductStateBadge kind="review" state={session.state} />
      </Row>
      <Row term="Builder">{session.builderName}</Row>
      <Row term="Reviewer">{session.reviewerName}</Row>
      <Row term="Stages">{stageList(session.stages)}</Row>
      {asReviewer ? (
        <Row term="Your share">
          <span className="font-mono">{formatMoney(session.reviewerShareMinor, session.currency)}</span>{" "}
          <span className="text-graphite-600">
            of {formatMoney(session.priceMinor, session.currency)} (platform fee {formatMoney(session.feeMinor, session.currency)})
          </span>
        </Row>
      ) : (
        <Row term="Price">
          <span className="font-mono">{formatMoney(session.priceMinor, session.currency)}</span>
        </Row>
      )}
      <Row term="Payment" testId="payment-status">
        {paymentStatus(session)}
      </Row>
      {session.state === "requested" ? <Row term="Answer due by">{formatWhen(session.respondBy)}</Row> : null}
      {session.state === "accepted" ? <Row term="Report due by">{formatWhen(deliverBy(session))}</Row> : null}
      {session.state === "delivered" && session.disputeBy ? <Row term="Open to dispute until">{formatWhen(session.disputeBy)}</Row> : null}
    </dl>
  );
}
