import type { Metadata } from "next";
import Link from "next/link";
import { MainsCaution } from "@/components/caution";
import { ReviewerCard } from "@/components/reviews/reviewer-card";
import { ButtonLink } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { availableReviewers } from "@/db/queries/reviews";
import { getSessionUser } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "Reviewers" };
export const dynamic = "force-dynamic";

export default async function ReviewersPage() {
  const [reviewers, user] = await Promise.all([availableReviewers(), getSessionUser()]);
  return (
    <div className="space-y-6">
      <PageHeader
        title="Reviewers"
        lede="Experienced builders, vetted by our moderators, who read your bring-up log — readings, scope captures and photos — and write a verdict per checkpoint before your next power-up."
        actions={
          user ? (
            <ButtonLink href="/reviewers/apply" variant="secondary">
              Become a reviewer
            </ButtonLink>
          ) : null
        }
      />
      <div className="max-w-reading space-y-2 text-sm text-graphite-700">
        <p>
          Your payment is only held when you book. It is charged when the reviewer delivers the report, and released if they decline or do not
          answer within 48 hours. You can dispute a report within 7 days.
        </p>
        {!user ? (
          <p>
            <Link href="/sign-in?next=/reviewers">Sign in</Link> to book a review of one of your bring-up logs.
          </p>
        ) : null}
      </div>
      {reviewers.length === 0 ? (
        <EmptyState title="No reviewer is taking bookings just now">Reviewers appear here once vetted and ready to be paid.</EmptyState>
      ) : (
        <ul className="grid gap-4 lg:grid-cols-2">
          {reviewers.map((r) => (
            <li key={r.userId}>
              <ReviewerCard reviewer={r} bookable={user !== null && user.id !== r.userId} />
            </li>
          ))}
        </ul>
      )}
      <MainsCaution />
    </div>
  );
}
