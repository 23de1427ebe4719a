import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { MainsCaution } from "@/components/caution";
import { AddToCartForm } from "@/components/cart/add-to-cart-form";
import { Markdown } from "@/components/markdown";
import { SafetySheetView } from "@/components/safety/safety-sheet-view";
import { Alert } from "@/components/ui/alert";
import { Figure } from "@/components/ui/figure";
import { Panel } from "@/components/ui/panel";
import { StateBadge } from "@/components/ui/state-badge";
import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";
import { cache, Suspense } from "react";
import { ListingQuestions } from "@/components/qa/listing-questions";
import { ListingFits } from "@/components/catalog/listing-fits";
import { MagneticDerivedFigures } from "@/components/catalog/magnetic-derived-figures";
import { SkeletonText } from "@/components/ui/skeleton";
import { getPublicListing } from "@/db/queries/catalog";
import { currentPolicyRevision } from "@/db/queries/policy";
import { env } from "@/lib/env";
import { formatMoney } from "@/lib/format/money";
import { kindLabel, STAGE_LABELS, subtypeLabel } from "@/lib/listings/labels";
import { checkSafetySheet } from "@/lib/policy";

// Rendered on a page's first request and then served from Next's cache: nothing below reads the
// session (the header's per-person part is fetched on the client). Every change to what the page
// shows calls lib/listings/listing-pages.ts, which refreshes it on this instance at once; the window
// bounds other instances, the worker's changes, and what it shows of other listings (the fits).
// Buying still goes through the server, which refuses a listing that is no longer live or in stock.
export const revalidate = 60;

export function generateStaticParams(): { slug: string }[] {
  return [];
}

type Props = { params: Promise<{ slug: string }> };

// The metadata and the page read the same listing once per render.
const publicListing = cache(getPublicListing);

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const listing = await publicListing((await params).slug);
  return { title: listing?.listing.title ?? "Listing not found" };
}

export default async function ListingPage({ params }: Props) {
  const { slug } = await params;
  const [data, revision] = await Promise.all([publicListing(slug), currentPolicyRevision()]);
  if (!data) notFound();
  const { listing } = data;
  const check = checkSafetySheet({ declaration: listing.declaration, notes: listing.safetyNotes, revision });
  const uploadsOrigin = env().UPLOADS_PUBLIC_ORIGIN;
  const imageOrigins = uploadsOrigin ? [uploadsOrigin] : [];
  const [cover, ...rest] = data.photos;
  const forSale = listing.state === "live";

  return (
    <article className="space-y-10" data-testid="listing-page" data-state={listing.state}>
      {listing.state === "held" ? (
        <Alert tone="stop" title="Held by a moderator">
          This listing is held and not for sale while its safety sheet is reviewed.
          {listing.moderatorMessage ? ` Reason given: ${listing.moderatorMessage}` : ""}
        </Alert>
      ) : null}
      {listing.state === "retired" ? (
        <Alert tone="info" title="Withdrawn">
          The seller has withdrawn this listing; it is no longer for sale.
        </Alert>
      ) : null}

      <div className="grid gap-8 lg:grid-cols-[3fr_2fr]">
        <section aria-label="Photos" className="space-y-3">
          {cover ? (
            // The cover is the page's largest paint: fetched first, ahead of the scripts.
            // eslint-disable-next-line @next/next/no-img-element -- served by the upload provider
            <img src={cover.url} alt={cover.alt || listing.title} width={cover.width ?? 1200} height={cover.height ?? 900} fetchPriority="high" className="w-full rounded-md border border-graphite-200 object-cover" />
          ) : null}
          {rest.length > 0 ? (
            <ul className="grid grid-cols-4 gap-2">
              {rest.map((p) => (
                <li key={p.position}>
                  <a href={p.url}>
                    {/* eslint-disable-next-line @next/next/no-img-element -- served by the upload provider */}
                    <img src={p.thumbUrl ?? p.url} alt={p.alt || `${listing.title}, photo ${p.position + 1}`} className="aspect-[4/3] w-full rounded border border-graphite-200 object-cover" loading="lazy" />
                  </a>
                </li>
              ))}
            </ul>
          ) : null}
        </section>

        <section aria-labelledby="listing-title" className="space-y-4">
          <div className="flex flex-wrap gap-2">
            <StateBadge label={kindLabel(listing.kind, listing.magneticSubtype)} />
            {listing.mainsConnected ? <StateBadge label="mains-connected" tone="caution" /> : null}
          </div>
          <h1 id="listing-title" className="text-3xl font-bold text-graphite-900">
            {listing.title}
          </h1>
          <p className="font-mono text-2xl text-graphite-900">{formatMoney(listing.priceMinor, listing.currency)}</p>
          <p className="text-sm text-graphite-700">
            {forSale ? (listing.stock > 0 ? `${listing.stock} in stock` : "Out of stock") : "Not for sale"} · ships at{" "}
            <Figure value={listing.shippingWeightG / 1000} unit="kg" prefixes={false} />
          </p>
          {forSale && listing.stock > 0 ? <AddToCartForm listingId={listing.id} stock={listing.stock} /> : null}
          <p className="text-sm text-graphite-700">
            Sold by <strong>{data.shopName ?? data.sellerName}</strong>
            {data.country ? ` (${data.country})` : ""}; returns within {data.returnsWindowDays ?? 30} days.
          </p>
          {listing.mainsConnected ? <MainsCaution variant="full" /> : null}
        </section>
      </div>

      <Panel title="Description">
        <Markdown imageOrigins={imageOrigins}>{listing.descriptionMd}</Markdown>
      </Panel>

      {data.checkpoints.length > 0 ? (
        <Panel title="Bring-up checkpoints">
          <p className="mb-3 max-w-reading text-sm text-graphite-700">What a builder measures at each stage, and the range the seller expects. A bring-up log starts from these.</p>
          <Table caption="Bring-up checkpoints" captionHidden>
            <THead>
              <TRow>
                <TH>Stage</TH>
                <TH>Checkpoint</TH>
                <TH>Measure</TH>
                <TH numeric>Expected</TH>
              </TRow>
            </THead>
            <TBody>
              {data.checkpoints.map((c) => (
                <TRow key={c.id}>
                  <TD>{STAGE_LABELS[c.stage]}</TD>
                  <TD>{c.name}</TD>
                  <TD>{c.measure}</TD>
                  <TD numeric>
                    {c.expectedMin} – {c.expectedMax} {c.unit}
                  </TD>
                </TRow>
              ))}
            </TBody>
          </Table>
        </Panel>
      ) : null}

      {data.requirements.length > 0 ? (
        <Panel title="Magnetics this kit needs">
          <ul className="space-y-1 text-sm">
            {data.requirements.map((r) => (
              <li key={r.id}>
                <strong>{r.label}</strong> ({subtypeLabel(r.subtype)})
                {r.minInductanceH ? (
                  <>
                    {" "}— at least <Figure value={r.minInductanceH} unit="H" />
                  </>
                ) : null}
                {r.atCurrentA ? (
                  <>
                    {" "}at <Figure value={r.atCurrentA} unit="A" />
                  </>
                ) : null}
              </li>
            ))}
          </ul>
        </Panel>
      ) : null}

      {/* Catalog: derived figures of a magnetic, and which kits and magnetics fit each other. */}
      {listing.kind === "magnetic" && listing.magneticSubtype ? <MagneticDerivedFigures subtype={listing.magneticSubtype} figures={listing.figures} /> : null}
      <Suspense fallback={<SkeletonText lines={2} />}>
        <ListingFits listingId={listing.id} kind={listing.kind} />
      </Suspense>
      {/* End of the catalog's sections. */}

      {data.documents.length > 0 ? (
        <Panel title="Documents">
          <ul className="space-y-1 text-sm">
            {data.documents.map((d) => (
              <li key={d.url}>
                <a href={d.url}>{d.title}</a> <span className="text-graphite-600">({d.kind}, PDF, <Figure value={d.bytes} unit="B" />)</span>
              </li>
            ))}
          </ul>
        </Panel>
      ) : null}

      <Panel title="Mains safety sheet">
        <SafetySheetView declaration={listing.declaration} notes={listing.safetyNotes} check={check} imageOrigins={imageOrigins} />
      </Panel>

      <Suspense fallback={<SkeletonText lines={4} />}>
        <ListingQuestions listingId={listing.id} canAsk={listing.state === "live"} />
      </Suspense>

      <p className="text-sm">
        <Link href="/catalog">Back to the catalog</Link>
      </p>
    </article>
  );
}
