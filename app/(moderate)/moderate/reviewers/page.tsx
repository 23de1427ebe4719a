import type { Metadata } from "next";
import { AccessDenied } from "@/components/access/access-denied";
import { Markdown } from "@/components/markdown";
import { RelativeTime } from "@/components/moderation/relative-time";
import { ExpertiseTags } from "@/components/reviews/expertise-tags";
import { ReviewModerationTabs } from "@/components/reviews/review-moderation-tabs";
import { VettingForms } from "@/components/reviews/vetting-forms";
import { Alert } from "@/components/ui/alert";
import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { pendingReviewerApplications, reviewModerationCounts } from "@/db/queries/reviews";
import { checkAccess } from "@/lib/auth/guard";
import { formatMoney } from "@/lib/format/money";
import { approveReviewerAction, declineReviewerAction } from "./actions";

export const metadata: Metadata = { title: "Reviewer applications" };
export const dynamic = "force-dynamic";

const DONE: Record<string, string> = {
  approved: "Approved. The reviewer role is granted, the profile made and the applicant e-mailed.",
  declined: "Declined. The applicant has been e-mailed your reason.",
};

export default async function ReviewerApplicationsPage({ searchParams }: { searchParams: Promise<{ done?: string }> }) {
  const access = await checkAccess(["moderator"]);
  if (!access.ok) return <AccessDenied decision={access} next="/moderate/reviewers" />;
  const [{ done }, applications, counts] = await Promise.all([searchParams, pendingReviewerApplications(), reviewModerationCounts()]);
  return (
    <div className="space-y-6" data-testid="reviewer-applications">
      <PageHeader
        eyebrow="Moderation"
        title="Reviewer applications"
        lede="Builders who want to review others' bring-ups for pay. Read the track record and check it against what they have done here."
      />
      <ReviewModerationTabs current="reviewers" counts={counts} />
      {done && DONE[done] ? <Alert tone="info" title={DONE[done]} /> : null}
      {applications.length === 0 ? (
        <EmptyState title="No application waits">New applications appear here, the oldest first.</EmptyState>
      ) : (
        <ol className="space-y-4">
          {applications.map((a) => {
            const name = a.applicantName ?? a.applicantEmail ?? "A member";
            return (
              <li key={a.id}>
                <Card className="space-y-4" data-testid={`reviewer-application-${a.id}`}>
                  <header className="space-y-1">
                    <h2 className="text-xl font-semibold">{name}</h2>
                    <p className="text-sm text-graphite-600">
                      <span className="font-mono">{a.applicantEmail}</span> · asks <span className="font-mono">{formatMoney(a.priceMinor, a.currency)}</span> per review · applied{" "}
                      <RelativeTime iso={a.createdAt.toISOString()} />
                    </p>
                    <p className="text-sm text-graphite-600">
                      Here: {a.logs} bring-up log{a.logs === 1 ? "" : "s"}, {a.answers} published answer{a.answers === 1 ? "" : "s"}.
                    </p>
                    <ExpertiseTags expertise={a.expertise} />
                  </header>
                  <div className="grid gap-4 md:grid-cols-2">
                    <section>
                      <h3 className="mb-1 font-semibold">Profile</h3>
                      <Markdown minHeadingLevel={4}>{a.profileMd}</Markdown>
                    </section>
                    <section>
                      <h3 className="mb-1 font-semibold">Track record</h3>
                      <Markdown minHeadingLevel={4}>{a.trackRecordMd}</Markdown>
                    </section>
                  </div>
                  {a.userId === access.user.id ? (
                    <Alert tone="caution" title="This is your own application">
                      Another moderator must decide it.
                    </Alert>
                  ) : (
                    <VettingForms applicantName={name} approve={approveReviewerAction.bind(null, a.id)} decline={declineReviewerAction.bind(null, a.id)} />
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
