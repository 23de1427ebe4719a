import type { Metadata } from "next";
import { AccessDenied } from "@/components/access/access-denied";
import { Markdown } from "@/components/markdown";
import { ApplicationDecisionForms } from "@/components/moderation/application-decision-forms";
import { DeskTabs } from "@/components/moderation/desk-tabs";
import { RelativeTime } from "@/components/moderation/relative-time";
import { Alert } from "@/components/ui/alert";
import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { moderationCounts } from "@/db/queries/moderation";
import { pendingApplications } from "@/db/queries/seller-applications";
import { checkAccess } from "@/lib/auth/guard";
import { approveApplicationAction, declineApplicationAction } from "./actions";

export const metadata: Metadata = { title: "Seller applications" };
export const dynamic = "force-dynamic";

const DONE: Record<string, string> = {
  approved: "Approved. The seller role is granted, the shop is open and the applicant has been e-mailed.",
  declined: "Declined. The applicant has been e-mailed your reason.",
};

function countryName(code: string): string {
  try {
    return new Intl.DisplayNames(["en"], { type: "region" }).of(code) ?? code;
  } catch {
    return code;
  }
}

export default async function SellerApplicationsPage({ searchParams }: { searchParams: Promise<{ done?: string }> }) {
  const access = await checkAccess(["moderator"]);
  if (!access.ok) return <AccessDenied decision={access} next="/moderate/applications" />;
  const [{ done }, applications, counts] = await Promise.all([searchParams, pendingApplications(), moderationCounts()]);
  return (
    <div className="space-y-6" data-testid="seller-applications">
      <PageHeader eyebrow="Moderation" title="Seller applications" lede="Members who want to sell. Read the profile and the returns policy; approving opens their shop." />
      <DeskTabs current="applications" counts={counts} />
      {done && DONE[done] ? <Alert tone="info" title={DONE[done]} /> : null}
      {applications.length === 0 ? (
        <EmptyState title="No application waits">New applications appear here, the oldest first.</EmptyState>
      ) : (
        <ol className="space-y-4">
          {applications.map((a) => (
            <li key={a.id}>
              <Card className="space-y-4" data-testid={`application-${a.id}`}>
                <header>
                  <h2 className="text-xl font-semibold">{a.shopName}</h2>
                  <p className="text-sm text-graphite-600">
                    {a.applicantName ?? "—"} · <span className="font-mono">{a.applicantEmail}</span> · ships from {countryName(a.country)} · applied{" "}
                    <RelativeTime iso={a.createdAt.toISOString()} />
                  </p>
                </header>
                <div className="grid gap-4 md:grid-cols-2">
                  <section>
                    <h3 className="mb-1 font-semibold">Profile</h3>
                    <Markdown minHeadingLevel={4}>{a.profileMd}</Markdown>
                  </section>
                  <section>
                    <h3 className="mb-1 font-semibold">
                      Returns policy <span className="font-normal text-graphite-600">· window {a.returnsWindowDays} days</span>
                    </h3>
                    <Markdown minHeadingLevel={4}>{a.returnsPolicyMd}</Markdown>
                  </section>
                </div>
                {a.userId === access.user.id ? (
                  <Alert tone="caution" title="This is your own application">
                    Another moderator must decide it.
                  </Alert>
                ) : (
                  <ApplicationDecisionForms
                    shopName={a.shopName}
                    approve={approveApplicationAction.bind(null, a.id)}
                    decline={declineApplicationAction.bind(null, a.id)}
                  />
                )}
              </Card>
            </li>
          ))}
        </ol>
      )}
    </div>
  );
}
