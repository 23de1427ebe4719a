import type { Metadata } from "next";
import Link from "next/link";
import { AccessDenied } from "@/components/access/access-denied";
import { RelativeTime } from "@/components/moderation/relative-time";
import { ReportView } from "@/components/reviews/report-view";
import { ReviewModerationTabs } from "@/components/reviews/review-moderation-tabs";
import { SessionFacts } from "@/components/reviews/session-facts";
import { SettleDisputeForm } from "@/components/reviews/settle-dispute-form";
import { Alert } from "@/components/ui/alert";
import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { openDisputes, reviewModerationCounts, sessionForViewer } from "@/db/queries/reviews";
import { checkAccess } from "@/lib/auth/guard";
import { formatMoney } from "@/lib/format/money";
import { settleDisputeAction } from "./actions";

export const metadata: Metadata = { title: "Review disputes" };
export const dynamic = "force-dynamic";

export default async function ReviewDisputesPage({ searchParams }: { searchParams: Promise<{ done?: string }> }) {
  const access = await checkAccess(["moderator"]);
  if (!access.ok) return <AccessDenied decision={access} next="/moderate/disputes" />;
  const [{ done }, disputes, counts] = await Promise.all([searchParams, openDisputes(), reviewModerationCounts()]);
  const sessions = await Promise.all(disputes.map((d) => sessionForViewer(access.user, d.sessionId)));
  return (
    <div className="space-y-6" data-testid="review-disputes">
      <PageHeader
        eyebrow="Moderation"
        title="Review disputes"
        lede="Builders who say a delivered report is not what they booked. Read the report against the log, then let the payment stand or refund it in part or in full."
      />
      <ReviewModerationTabs current="disputes" counts={counts} />
      {done === "settled" ? <Alert tone="info" title="Settled. The session is closed and both parties have been e-mailed." /> : null}
      {disputes.length === 0 ? (
        <EmptyState title="No dispute waits">Disputed reviews appear here, the oldest first.</EmptyState>
      ) : (
        <ol className="space-y-6">
          {disputes.map((d, i) => {
            const session = sessions[i];
            if (!session) return null;
            const party = access.user.id === session.builderId || access.user.id === session.reviewerId;
            return (
              <li key={d.disputeId}>
                <Card className="space-y-4" data-testid={`dispute-${session.id}`}>
                  <header>
                    <h2 className="text-xl font-semibold">
                      <Link href={`/reviews/${session.id}`}>Review of “{session.logTitle}”</Link>
                    </h2>
                    <p className="text-sm text-graphite-600">
                      Disputed <RelativeTime iso={d.openedAt.toISOString()} /> by {session.builderName}
                    </p>
                  </header>
                  <div className="grid gap-4 lg:grid-cols-[1fr_2fr]">
                    <div className="space-y-3">
                      <SessionFacts session={session} />
                      <section>
                        <h3 className="font-semibold">The builder&apos;s reason</h3>
                        <p className="text-sm whitespace-pre-line">{d.reason}</p>
                      </section>
                    </div>
                    {session.report ? <ReportView report={session.report} reviewerName={session.reviewerName} /> : null}
                  </div>
                  {party ? (
                    <Alert tone="caution" title="You are part of this session">
                      Another moderator must decide it.
                    </Alert>
                  ) : (
                    <SettleDisputeForm action={settleDisputeAction.bind(null, session.id)} priceText={formatMoney(session.priceMinor - session.refundedMinor, session.currency)} />
                  )}
                </Card>
              </li>
            );
          })}
        </ol>
      )}
    </div>
  );
}
