import type { Metadata } from "next";
import Link from "next/link";
import { AccessDenied } from "@/components/access/access-denied";
import { BookingForm } from "@/components/reviews/booking-form";
import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { listLogs } from "@/db/queries/bench";
import { availableReviewers } from "@/db/queries/reviews";
import { checkAccess } from "@/lib/auth/guard";
import { expertiseLabel } from "@/lib/validations/reviews";
import { bookReview } from "./actions";

export const metadata: Metadata = { title: "Book a review" };
export const dynamic = "force-dynamic";

export default async function BookReviewPage({ searchParams }: { searchParams: Promise<{ reviewer?: string; log?: string; cancelled?: string; refused?: string }> }) {
  const access = await checkAccess();
  if (!access.ok) return <AccessDenied decision={access} next="/reviews/new" />;
  const [query, logs, reviewers] = await Promise.all([searchParams, listLogs(access.user.id), availableReviewers()]);
  const others = reviewers.filter((r) => r.userId !== access.user.id);
  return (
    <div className="max-w-reading space-y-6">
      <PageHeader eyebrow={<Link href="/reviews">Reviews</Link>} title="Book a review" lede="A vetted reviewer reads your log and writes a verdict for each checkpoint in the stages you choose." />
      {query.cancelled ? <Alert tone="info" title="Payment not made">You left the payment page; nothing was held or charged. You can book again below.</Alert> : null}
      {query.refused ? <Alert tone="caution" title="The booking could not be made">{query.refused}</Alert> : null}
      {logs.length === 0 ? (
        <EmptyState title="You have no bring-up log yet" action={<ButtonLink href="/bench">Open a bring-up log</ButtonLink>}>
          A review is of a log: start one from your kit&apos;s checkpoints and record a few readings first.
        </EmptyState>
      ) : others.length === 0 ? (
        <EmptyState title="No reviewer is taking bookings just now">Try again later; reviewers appear on the list once vetted.</EmptyState>
      ) : (
        <Panel title="Your booking">
          <BookingForm
            action={bookReview}
            logs={logs.map((l) => ({ id: l.id, title: l.title, stages: l.progress.map((p) => ({ stage: p.stage, label: p.label, checkpoints: p.checkpoints })) }))}
            reviewers={others.map((r) => ({ id: r.userId, name: r.name, priceMinor: r.priceMinor, currency: r.currency, expertise: r.expertise.map(expertiseLabel).join(", ") }))}
            initialLogId={query.log}
            initialReviewerId={query.reviewer}
          />
        </Panel>
      )}
    </div>
  );
}
