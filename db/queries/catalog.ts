import "server-only";
import { and, asc, desc, eq, ilike, inArray, or, sql } from "drizzle-orm";
import { db } from "@/db/client";
import {
  listingCheckpoints,
  listingDocuments,
  listingPhotos,
  listingRequirements,
  listings,
  sellerProfiles,
  uploads,
  users,
  type ListingKind,
} from "@/db/schema";

export const PAGE_SIZE = 24;

export type CatalogCard = {
  id: string;
  slug: string;
  title: string;
  kind: ListingKind;
  magneticSubtype: string | null;
  priceMinor: number;
  currency: string;
  stock: number;
  mainsConnected: boolean | null;
  shopName: string | null;
  coverUrl: string | null;
  coverAlt: string | null;
};

/** Live listings only, newest first; search and filters grow here with the catalog. */
export async function listLiveListings({ q, kind, page = 1 }: { q?: string; kind?: ListingKind; page?: number }) {
  const term = q?.trim();
  const where = and(
    eq(listings.state, "live"),
    kind ? eq(listings.kind, kind) : undefined,
    term ? or(ilike(listings.title, `%${term}%`), ilike(listings.descriptionMd, `%${term}%`)) : undefined,
  );
  const cover = db
    .select({ listingId: listingPhotos.listingId, url: sql<string>`coalesce(${uploads.thumbUrl}, ${uploads.url})`.as("cover_url"), alt: listingPhotos.alt })
    .from(listingPhotos)
    .innerJoin(uploads, eq(uploads.key, listingPhotos.uploadKey))
    .where(eq(listingPhotos.position, 0))
    .as("cover");
  const [items, [total]] = await Promise.all([
    db
      .select({
        id: listings.id,
        slug: listings.slug,
        title: listings.title,
        kind: listings.kind,
        magneticSubtype: listings.magneticSubtype,
        priceMinor: listings.priceMinor,
        currency: listings.currency,
        stock: listings.stock,
        mainsConnected: listings.mainsConnected,
        shopName: sellerProfiles.shopName,
        coverUrl: cover.url,
        coverAlt: cover.alt,
      })
      .from(listings)
      .leftJoin(sellerProfiles, eq(sellerProfiles.userId, listings.sellerId))
      .leftJoin(cover, eq(cover.listingId, listings.id))
      .where(where)
      .orderBy(desc(listings.liveAt), asc(listings.id))
      .limit(PAGE_SIZE)
      .offset((page - 1) * PAGE_SIZE),
    db.select({ n: sql<number>`count(*)::int` }).from(listings).where(where),
  ]);
  return { items: items satisfies CatalogCard[], total: total?.n ?? 0, page, pageSize: PAGE_SIZE };
}

/** A listing page as the public sees it: live or held (shown as held), or retired (shown as withdrawn). */
export async function getPublicListing(slug: string) {
  const [row] = await db
    .select({
      listing: listings,
      sellerName: users.name,
      shopName: sellerProfiles.shopName,
      shopSlug: sellerProfiles.slug,
      country: sellerProfiles.country,
      returnsPolicyMd: sellerProfiles.returnsPolicyMd,
      returnsWindowDays: sellerProfiles.returnsWindowDays,
    })
    .from(listings)
    .innerJoin(users, eq(users.id, listings.sellerId))
    .leftJoin(sellerProfiles, eq(sellerProfiles.userId, listings.sellerId))
    .where(and(eq(listings.slug, slug), inArray(listings.state, ["live", "held", "retired"])));
  if (!row) return null;
  const id = row.listing.id;
  const [photos, documents, checkpoints, requirements] = await Promise.all([
    db
      .select({ position: listingPhotos.position, alt: listingPhotos.alt, url: uploads.url, thumbUrl: uploads.thumbUrl, width: uploads.width, height: uploads.height })
      .from(listingPhotos)
      .innerJoin(uploads, eq(uploads.key, listingPhotos.uploadKey))
      .where(eq(listingPhotos.listingId, id))
      .orderBy(asc(listingPhotos.position)),
    db
      .select({ kind: listingDocuments.kind, title: listingDocuments.title, url: uploads.url, bytes: uploads.bytes })
      .from(listingDocuments)
      .innerJoin(uploads, eq(uploads.key, listingDocuments.uploadKey))
      .where(eq(listingDocuments.listingId, id))
      .orderBy(asc(listingDocuments.position)),
    db.select().from(listingCheckpoints).where(eq(listingCheckpoints.listingId, id)).orderBy(asc(listingCheckpoints.position)),
    db.select().from(listingRequirements).where(eq(listingRequirements.listingId, id)),
  ]);
  return { ...row, photos, documents, checkpoints, requirements };
}

export type PublicListing = NonNullable<Awaited<ReturnType<typeof getPublicListing>>>;
