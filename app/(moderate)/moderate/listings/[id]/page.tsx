import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { AccessDenied } from "@/components/access/access-denied";
import { MainsCaution } from "@/components/caution";
import { Markdown } from "@/components/markdown";
import { DecisionHistory } from "@/components/moderation/decision-history";
import { HazardProfilePanel } from "@/components/moderation/hazard-profile-panel";
import { kindLabel } from "@/components/moderation/labels";
import { ApproveForm, HoldForm, RestoreForm, SendBackForm } from "@/components/moderation/listing-action-forms";
import { ListingCheckpoints, ListingRequirements } from "@/components/moderation/listing-kit-tables";
import { ListingFigures } from "@/components/moderation/listing-figures";
import { ListingMedia } from "@/components/moderation/listing-media";
import { PolicyCheckPanel } from "@/components/moderation/policy-check-panel";
import { RelativeTime } from "@/components/moderation/relative-time";
import { SnapshotDiffView } from "@/components/moderation/snapshot-diff-view";
import { Alert } from "@/components/ui/alert";
import { ErrorState } from "@/components/ui/error-state";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { ProductStateBadge } from "@/components/ui/state-badge";
import { formatMoney } from "@/lib/format/money";
import { listingForReview } from "@/db/queries/moderation";
import { currentPolicyRevision } from "@/db/queries/policy";
import { checkAccess } from "@/lib/auth/guard";
import { env } from "@/lib/env";
import { diffSnapshots } from "@/lib/moderation/diff";
import { isUuid } from "@/lib/moderation/ids";
import { checkSafetySheet, SAFETY_TOPIC_KEYS, type SafetySheetCheck } from "@/lib/policy";
import { approveListingAction, holdListingAction, restoreListingAction, sendBackListingAction } from "./actions";

export const metadata: Metadata = { title: "Review a listing" };
export const dynamic = "force-dynamic";

const DONE: Record<string, string> = {
  approve: "Approved. The listing is live and the seller has been e-mailed.",
  send_back: "Sent back. The seller has been e-mailed your reasons.",
  hold: "Held. The listing is out of the catalog and the seller has been e-mailed.",
  restore: "Restored. The listing is back in the catalog and the seller has been e-mailed.",
};

type Props = { params: Promise<{ id: string }>; searchParams: Promise<{ done?: string }> };

export default async function ListingReviewPage({ params, searchParams }: Props) {
  const [{ id }, { done }] = await Promise.all([params, searchParams]);
  const access = await checkAccess(["moderator"]);
  if (!access.ok) return <AccessDenied decision={access} next={`/moderate/listings/${id}`} />;
  if (!isUuid(id)) notFound();
  const [review, revision] = await Promise.all([listingForReview(id), currentPolicyRevision()]);
  if (!review) notFound();
  const { listing, seller } = review;

  let check: SafetySheetCheck | null = null;
  let checkError: string | null = null;
  try {
    check = checkSafetySheet({ declaration: listing.declaration, notes: listing.safetyNotes, revision });
  } catch (error) {
    checkError = (error as Error).message;
  }
  const ownListing = listing.sellerId === access.user.id;
  // Only a re-submission is compared: what is live or held is what was approved, or close to it (price, stock).
  const diff = review.approved && listing.state === "in_review" ? diffSnapshots(review.approved.snapshot, review.current, SAFETY_TOPIC_KEYS) : null;
  const suggestedTopics = [...new Set((check?.findings ?? []).map((f) => f.topic))];
  const uploadsOrigin = env().UPLOADS_PUBLIC_ORIGIN;

  return (
    <div className="space-y-6" data-testid="listing-review">
      <p className="text-sm">
        <Link href="/moderate">← Review queue</Link>
      </p>
      <PageHeader
        eyebrow={`Review · ${kindLabel(listing.kind, listing.magneticSubtype)}`}
        title={listing.title}
        lede={
          <>
            by {seller.shopName ?? seller.name ?? seller.email}
            {listing.submittedAt ? (
              <>
                {" "}
                · submitted <RelativeTime iso={listing.submittedAt.toISOString()} />
              </>
            ) : null}
          </>
        }
        actions={
          <span className="flex items-center gap-2 text-sm" data-testid="listing-state">
            State <ProductStateBadge kind="listing" state={listing.state} />
          </span>
        }
      />
      {done && DONE[done] ? <Alert tone="info" title={DONE[done]} /> : null}
      {listing.graceUntil && listing.state === "live" ? (
        <Alert tone="caution" title="Grace period running">
          This listing failed a newer policy revision. It is held automatically on {listing.graceUntil.toISOString().slice(0, 10)} unless the seller fixes the sheet.
        </Alert>
      ) : null}

      <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="space-y-6">
          {/* A re-submission is read for what changed first. */}
          {diff && review.approved ? (
            <Panel title={`Changes since the approved version of ${review.approved.approvedAt.toISOString().slice(0, 10)}`}>
              <SnapshotDiffView diff={diff} />
            </Panel>
          ) : null}

          <Panel title="Figures">
            <dl className="mb-4 grid grid-cols-2 gap-x-6 gap-y-1 text-sm sm:grid-cols-4">
              <dt className="text-graphite-600">Price</dt>
              <dd className="figure font-mono">{formatMoney(listing.priceMinor, listing.currency)}</dd>
              <dt className="text-graphite-600">Stock</dt>
              <dd className="figure font-mono">{listing.stock}</dd>
              <dt className="text-graphite-600">Shipping weight</dt>
              <dd className="figure font-mono">{listing.shippingWeightG} g</dd>
              <dt className="text-graphite-600">Sheet revision</dt>
              <dd className="figure font-mono">{listing.sheetRevision}</dd>
            </dl>
            <ListingFigures kind={listing.kind} subtype={listing.magneticSubtype} figures={listing.figures} />
          </Panel>

          <Panel title="Hazard profile">
            {check ? (
              <HazardProfilePanel declaration={listing.declaration} profile={check.profile} />
            ) : (
              <ErrorState title="The declaration cannot be computed">{checkError}</ErrorState>
            )}
          </Panel>

          <Panel title={`Safety sheet against policy revision ${revision.revision}`}>
            {check ? <PolicyCheckPanel check={check} notes={listing.safetyNotes} /> : <p>Fix the declaration first; the notes cannot be checked without it.</p>}
          </Panel>

          <Panel title="Description">
            {listing.descriptionMd.trim() ? (
              <Markdown imageOrigins={uploadsOrigin ? [uploadsOrigin] : []}>{listing.descriptionMd}</Markdown>
            ) : (
              <p className="text-graphite-600">No description.</p>
            )}
          </Panel>

          <Panel title="Photos and documents">
            <ListingMedia photos={review.photos} documents={review.documents} />
          </Panel>

          {listing.kind === "kit" ? (
            <Panel title="Bring-up checkpoints and requirements">
              <div className="space-y-4">
                <ListingCheckpoints rows={review.checkpoints} />
                <ListingRequirements rows={review.requirements} />
              </div>
            </Panel>
          ) : null}
          <MainsCaution variant="full" />
        </div>

        <aside className="space-y-6" aria-label="Decision">
          <Panel title="Decision">
            {ownListing ? (
              <Alert tone="caution" title="This is your own listing">
                Nobody moderates their own listing; another moderator must decide it.
              </Alert>
            ) : listing.state === "in_review" ? (
              <div className="space-y-6">
                <ApproveForm action={approveListingAction.bind(null, listing.id)} />
                <hr className="border-graphite-200" />
                <SendBackForm action={sendBackListingAction.bind(null, listing.id)} suggestedTopics={suggestedTopics} />
              </div>
            ) : listing.state === "live" ? (
              <HoldForm action={holdListingAction.bind(null, listing.id)} />
            ) : listing.state === "held" ? (
              <RestoreForm action={restoreListingAction.bind(null, listing.id)} />
            ) : (
              <p className="text-graphite-700">Nothing to decide while the listing is with its seller.</p>
            )}
            {listing.moderatorMessage && listing.state !== "in_review" ? (
              <div className="mt-4 text-sm">
                <p className="font-semibold">Latest message to the seller</p>
                <p className="whitespace-pre-line text-graphite-700">{listing.moderatorMessage}</p>
              </div>
            ) : null}
          </Panel>
          <Panel title="History">
            <DecisionHistory decisions={review.decisions} />
          </Panel>
        </aside>
      </div>
    </div>
  );
}
