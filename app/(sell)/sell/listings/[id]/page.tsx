import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { AccessDenied } from "@/components/access/access-denied";
import { valuesFromListing } from "@/components/listing-form/form-model";
import { ListingForm } from "@/components/listing-form/listing-form";
import { DecisionHistory } from "@/components/sell/decision-history";
import { RetireButton } from "@/components/sell/retire-button";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { ProductStateBadge } from "@/components/ui/state-badge";
import { getListingForOwner } from "@/db/queries/listings";
import { getSellerProfile } from "@/db/queries/sellers";
import { checkAccess } from "@/lib/auth/guard";
import { kindLabel } from "@/lib/listings/labels";
import { payoutReady } from "@/lib/payments/connect";

export const metadata: Metadata = { title: "Edit listing" };

const NOTICES: Record<string, { tone: "info" | "caution"; text: string }> = {
  created: { tone: "info", text: "Draft saved. Keep editing, or submit it once the safety check is clear." },
  "not-submitted": { tone: "caution", text: "Saved as a draft, but not submitted yet: see what the form and the live check still ask for." },
};

export default async function EditListingPage({ params, searchParams }: { params: Promise<{ id: string }>; searchParams: Promise<{ notice?: string }> }) {
  const { id } = await params;
  const access = await checkAccess(["seller"]);
  if (!access.ok) return <AccessDenied decision={access} next={`/sell/listings/${id}`} />;
  const [own, profile, { notice }] = await Promise.all([getListingForOwner(access.user.id, id), getSellerProfile(access.user.id), searchParams]);
  if (!own) notFound();
  const { listing } = own;
  const shown = notice ? NOTICES[notice] : undefined;
  const initial = valuesFromListing(listing, {
    photos: own.photos.map((p) => ({ key: p.key, url: p.url, thumbUrl: p.thumbUrl ?? p.url, alt: p.alt })),
    documents: own.documents,
    checkpoints: own.checkpoints,
    requirements: own.requirements,
  });
  return (
    <div className="space-y-6">
      <PageHeader
        eyebrow={
          <>
            <Link href="/sell">Seller desk</Link> · {kindLabel(listing.kind, listing.magneticSubtype)}
          </>
        }
        title={listing.title}
        lede={
          <span className="flex flex-wrap items-center gap-2 text-base">
            <ProductStateBadge kind="listing" state={listing.state} />
            <span>Sheet revision {listing.sheetRevision}</span>
            {listing.state === "live" ? <Link href={`/listings/${listing.slug}`}>See it in the catalog</Link> : null}
          </span>
        }
        actions={listing.state !== "retired" ? <RetireButton listingId={listing.id} /> : null}
      />
      {shown ? <Alert tone={shown.tone}>{shown.text}</Alert> : null}
      {listing.moderatorMessage && (listing.state === "sent_back" || listing.state === "held") ? (
        <Alert tone={listing.state === "held" ? "stop" : "caution"} title={listing.state === "held" ? "Held by a moderator" : "Sent back by a moderator"}>
          <p className="whitespace-pre-line">{listing.moderatorMessage}</p>
        </Alert>
      ) : null}
      {listing.state === "retired" ? (
        <Alert tone="info" title="Retired">This listing was withdrawn; it stays here for your records.</Alert>
      ) : listing.state === "in_review" ? (
        <Alert tone="info" title="In review">
          A moderator is checking the safety sheet. Price, stock and photos can still change; the sheet and figures stay as submitted until the decision.
        </Alert>
      ) : null}
      {listing.state !== "retired" ? (
        <ListingForm listingId={listing.id} initial={initial} state={listing.state} payoutReady={payoutReady(profile)} />
      ) : null}
      <Panel title="History">
        <DecisionHistory entries={own.decisions} sellerId={access.user.id} />
      </Panel>
    </div>
  );
}
