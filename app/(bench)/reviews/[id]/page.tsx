import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { AccessDenied } from "@/components/access/access-denied";
import { ReviewCaptureList } from "@/components/captures/review-capture-list";
import { MainsCaution } from "@/components/caution";
import { ReportView } from "@/components/reviews/report-view";
import { NextStep } from "@/components/reviews/next-step";
import { DisputeForm, RespondForms } from "@/components/reviews/session-action-forms";
import { SessionFacts } from "@/components/reviews/session-facts";
import { SharedLog } from "@/components/reviews/shared-log";
import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { getLogForViewer } from "@/db/queries/bench";
import { capturesOfLog } from "@/db/queries/captures";
import { sessionForViewer } from "@/db/queries/reviews";
import { checkAccess } from "@/lib/auth/guard";
import { formatMoney } from "@/lib/format/money";
import { formatWhen } from "@/lib/reviews/format";
import { DISPUTE_OUTCOME_LABELS } from "@/lib/reviews/labels";
import { availableActions } from "@/lib/reviews/transitions";
import { acceptAction, declineAction, disputeAction } from "./actions";

export const metadata: Metadata = { title: "Review session" };
export const dynamic = "force-dynamic";

const DONE: Record<string, string> = {
  accepted: "Accepted. The log is shared with you; write the report when you have read it.",
  declined: "Declined. The builder's payment is released and they have been e-mailed.",
  disputed: "Dispute sent. A moderator will decide and write to you both.",
  delivered: "Report delivered. The payment is charged and your share is on its way to your payout account.",
};

export default async function ReviewSessionPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ booked?: string; done?: string }> }) {
  const [{ id }, query] = await Promise.all([params, searchParams]);
  const access = await checkAccess();
  if (!access.ok) return <AccessDenied decision={access} next={`/reviews/${id}`} />;
  const session = await sessionForViewer(access.user, id);
  if (!session) notFound();
  const log = await getLogForViewer(access.user, session.logId);
  const captures = log ? await capturesOfLog(log.id, log.access) : [];
  const now = new Date();
  const actions = availableActions(session, { kind: "user", id: access.user.id, roles: access.user.roles }, now);
  const openDispute = session.disputes.find((d) => d.outcome === "open");
  return (
    <div className="space-y-6">
      <PageHeader eyebrow={<Link href="/reviews">Reviews</Link>} title={`Review of “${session.logTitle}”`} lede={`${session.builderName} asked ${session.reviewerName} for a review.`} />
      {query.booked ? (
        <Alert tone="info" title="Payment held — request sent">
          {formatMoney(session.priceMinor, session.currency)} is held on your card, not charged. {session.reviewerName} has until {formatWhen(session.respondBy)} to accept or
          decline.
        </Alert>
      ) : null}
      {query.done && DONE[query.done] ? <Alert tone="info" title={DONE[query.done]} /> : null}
      <div className="grid gap-6 lg:grid-cols-[1fr_2fr]">
        <Panel title="The session" className="self-start">
          <SessionFacts session={session} />
          {session.message !== "" ? (
            <div className="mt-4 text-sm">
              <p className="font-semibold">The builder&apos;s note</p>
              <p className="whitespace-pre-line">{session.message}</p>
            </div>
          ) : null}
        </Panel>
        <div className="space-y-6">
          {actions.length === 0 || actions.includes("dispute") ? <NextStep session={session} /> : null}
          {actions.includes("accept") ? (
            <Panel title="Your answer">
              <RespondForms accept={acceptAction.bind(null, session.id)} decline={declineAction.bind(null, session.id)} />
            </Panel>
          ) : null}
          {actions.includes("deliver") ? (
            <Panel title="Your report">
              <p className="mb-3 text-sm">Give each checkpoint in scope a verdict with your comments, and a summary. Delivering it charges the builder&apos;s payment.</p>
              <ButtonLink href={`/reviews/${session.id}/report`}>Write the report</ButtonLink>
            </Panel>
          ) : null}
          {session.report ? <ReportView report={session.report} reviewerName={session.reviewerName} /> : null}
          {actions.includes("dispute") ? (
            <Panel title="Not what you booked?">
              <DisputeForm action={disputeAction.bind(null, session.id)} />
            </Panel>
          ) : null}
          {session.disputes.length > 0 ? (
            <Panel title="Dispute">
              <ul className="space-y-3 text-sm">
                {session.disputes.map((d) => (
                  <li key={d.id} data-testid="dispute" data-outcome={d.outcome}>
                    <p className="font-semibold">{DISPUTE_OUTCOME_LABELS[d.outcome]}</p>
                    <p className="whitespace-pre-line">{d.reason}</p>
                    {d.decisionNote ? <p className="mt-1 border-l-4 border-graphite-300 pl-3">Moderator: {d.decisionNote}</p> : null}
                  </li>
                ))}
              </ul>
              {openDispute ? <p className="mt-2 text-sm text-graphite-600">A moderator decides; the payment stays as it is until then.</p> : null}
              {actions.includes("settle") ? (
                <ButtonLink href="/moderate/disputes" variant="secondary" className="mt-3">
                  Settle it on the disputes desk
                </ButtonLink>
              ) : null}
            </Panel>
          ) : null}
        </div>
      </div>
      {log ? (
        <>
          <SharedLog log={log} stages={session.stages} />
          <Panel title="Scope captures">
            <p className="mb-3 text-sm text-graphite-600">
              Open a capture to read its trace and figures{session.viewerRole === "reviewer" ? " and pin comments to points on it" : " and the reviewer's comments on it"}.
            </p>
            <ReviewCaptureList sessionId={session.id} captures={captures} />
          </Panel>
        </>
      ) : session.viewerRole === "reviewer" ? (
        <Alert tone="info" title="The log is shared once you accept">
          Until then you see the booking only.
        </Alert>
      ) : null}
      <MainsCaution />
    </div>
  );
}
