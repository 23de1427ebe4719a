import type { Metadata } from "next";
import Link from "next/link";
import { AccessDenied } from "@/components/access/access-denied";
import { ReviewerApplicationForm } from "@/components/reviews/reviewer-application-form";
import { ReviewerApplicationStatus } from "@/components/reviews/reviewer-application-status";
import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { getReviewerProfile, latestReviewerApplication } from "@/db/queries/reviews";
import { checkAccess } from "@/lib/auth/guard";
import { applyToReview } from "./actions";

export const metadata: Metadata = { title: "Become a reviewer" };
export const dynamic = "force-dynamic";

export default async function ApplyToReviewPage({ searchParams }: { searchParams: Promise<{ sent?: string }> }) {
  const access = await checkAccess();
  if (!access.ok) return <AccessDenied decision={access} next="/reviewers/apply" />;
  const [{ sent }, application, profile] = await Promise.all([searchParams, latestReviewerApplication(access.user.id), getReviewerProfile(access.user.id)]);
  const canApply = !profile && application?.status !== "pending";
  return (
    <div className="max-w-reading space-y-6">
      <PageHeader
        eyebrow={<Link href="/reviewers">Reviewers</Link>}
        title="Become a reviewer"
        lede="Experienced builders review other builders' bring-up logs — readings, scope captures and photos — and are paid per review. A moderator vets every reviewer."
      />
      {sent && application?.status === "pending" ? <Alert tone="info" title="Application sent">A moderator reads it; you will hear by e-mail.</Alert> : null}
      {profile ? (
        <Panel title="You are a reviewer">
          <p className="mb-3 text-sm">Your profile is on the reviewers list once your payout account is enabled.</p>
          <ButtonLink href="/reviews">Open your review desk</ButtonLink>
        </Panel>
      ) : null}
      {application ? <ReviewerApplicationStatus application={application} /> : null}
      {canApply ? (
        <Panel title={application ? "Apply again" : "Your application"}>
          <ReviewerApplicationForm action={applyToReview} />
        </Panel>
      ) : null}
    </div>
  );
}
