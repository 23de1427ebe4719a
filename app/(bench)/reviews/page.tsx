import type { Metadata } from "next";
import { AccessDenied } from "@/components/access/access-denied";
import { ReviewerDeskPanel } from "@/components/reviews/reviewer-desk-panel";
import { SessionsTable } from "@/components/reviews/sessions-table";
import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { getReviewerProfile, sessionsOf } from "@/db/queries/reviews";
import { hasRole } from "@/lib/auth/access";
import { checkAccess } from "@/lib/auth/guard";
import { changeAvailability, connectReviewerPayout } from "./actions";

export const metadata: Metadata = { title: "Reviews" };
export const dynamic = "force-dynamic";

export default async function ReviewsPage({ searchParams }: { searchParams: Promise<{ payout?: string; payment?: string }> }) {
  const access = await checkAccess();
  if (!access.ok) return <AccessDenied decision={access} next="/reviews" />;
  const reviewer = hasRole(access.user, "reviewer");
  const [query, sessions, profile] = await Promise.all([searchParams, sessionsOf(access.user.id), reviewer ? getReviewerProfile(access.user.id) : null]);
  const waiting = sessions.asReviewer.filter((s) => s.state === "requested").length;
  return (
    <div className="space-y-6">
      <PageHeader
        title="Reviews"
        lede="Paid reviews of bring-up logs: the ones you booked and, as a reviewer, the ones you were asked for."
        actions={<ButtonLink href="/reviews/new">Book a review</ButtonLink>}
      />
      {query.payment === "pending" ? (
        <Alert tone="info" title="Payment not confirmed yet">
          The payment provider has not confirmed the hold on your card yet. The booking appears here as soon as it does.
        </Alert>
      ) : null}
      {reviewer ? (
        <div className="grid gap-6 lg:grid-cols-[2fr_1fr]">
          <Panel title={waiting > 0 ? `Asked of you (${waiting} waiting for your answer)` : "Asked of you"}>
            {sessions.asReviewer.length === 0 ? (
              <p className="text-sm text-graphite-600">No requests yet. Builders book you from the reviewers list.</p>
            ) : (
              <SessionsTable sessions={sessions.asReviewer} as="reviewer" caption="Review requests to you" />
            )}
          </Panel>
          <ReviewerDeskPanel profile={profile} payout={query.payout} connect={connectReviewerPayout} availability={changeAvailability} />
        </div>
      ) : null}
      <Panel title="Booked by you">
        {sessions.asBuilder.length === 0 ? (
          <EmptyState title="You have not booked a review yet" action={<ButtonLink href="/reviewers">See the reviewers</ButtonLink>}>
            Record a few readings in a bring-up log, then ask an experienced builder to look at them before your next power-up.
          </EmptyState>
        ) : (
          <SessionsTable sessions={sessions.asBuilder} as="builder" caption="Reviews you booked" />
        )}
      </Panel>
    </div>
  );
}
