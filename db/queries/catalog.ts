import "server-only";
import { and, asc, desc, eq, gt, gte, inArray, lte, or, sql, type SQL, type SQLWrapper } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { db, type Executor } from "@/db/client";
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
  type MagneticSubtype,
} from "@/db/schema";
import { CATALOG_PAGE_SIZE, effectiveSort, type CatalogQuery } from "@/lib/validations/catalog";

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

export type CatalogResult = { items: CatalogCard[]; total: number; page: number; pageSize: number };

export type CatalogSearch = CatalogQuery & { pageSize?: number };

// strict_word_similarity compares the search with whole words of the title: "choek" against
// "choke" scores 0.33, against "chopper" 0.27. Plain similarity() is diluted by the rest of a
// long title ("choek" vs a 40-character title scores under 0.1), so `title % q` misses typos.
const TYPO_THRESHOLD = 0.3;

// Migrations 0004 and 0006 add this column outside the Drizzle schema.
const searchVector = sql`${listings}.search_vector`;

// Migration 0006 stems title, figures and description alike with 'english', as the query is.
function tsQuery(term: string): SQL {
  return sql`websearch_to_tsquery('english', ${term})`;
}

/** The first photo of each listing, read per row through (listing_id, position). */
function coverPhoto(executor: Executor) {
  return executor
    .select({ url: sql<string>`coalesce(${uploads.thumbUrl}, ${uploads.url})`.as("cover_url"), alt: listingPhotos.alt })
    .from(listingPhotos)
    .innerJoin(uploads, eq(uploads.key, listingPhotos.uploadKey))
    .where(eq(listingPhotos.listingId, listings.id))
    .orderBy(asc(listingPhotos.position))
    .limit(1)
    .as("cover");
}

// websearch syntax: a word or "phrase" right after a minus is excluded.
const EXCLUDED = /(?:^|\s)-("[^"]*"|[^\s"]+)/g;

/**
 * Full-text match, or a title whose words are close to the search (typos). The close match
 * compares only the wanted words and still honours the excluded ones, so "choke -toroidal"
 * does not bring the toroid back through the typo path.
 */
function textMatch(term: string): SQL {
  const excluded = [...term.matchAll(EXCLUDED)].map((m) => m[1] ?? "");
  const wanted = term.replace(EXCLUDED, " ").trim();
  const fuzzy = wanted
    ? and(
        sql`${wanted} <<% ${listings.title}`,
        excluded.length > 0 ? sql`not (${searchVector} @@ ${tsQuery(excluded.join(" or "))})` : undefined,
      )
    : undefined;
  return or(sql`${searchVector} @@ ${tsQuery(term)}`, fuzzy) ?? sql`false`;
}

function catalogWhere(search: CatalogSearch, term: string | undefined): SQL | undefined {
  return and(
    eq(listings.state, "live"),
    term ? textMatch(term) : undefined,
    search.kind ? eq(listings.kind, search.kind) : undefined,
    search.subtype ? eq(listings.magneticSubtype, search.subtype) : undefined,
    search.mains === "yes" ? sql`${listings.mainsConnected} is true` : undefined,
    search.mains === "no" ? sql`${listings.mainsConnected} is not true` : undefined,
    search.minPrice !== undefined ? gte(listings.priceMinor, search.minPrice) : undefined,
    search.maxPrice !== undefined ? lte(listings.priceMinor, search.maxPrice) : undefined,
    search.inStock ? gt(listings.stock, 0) : undefined,
    search.seller ? eq(sellerProfiles.slug, search.seller) : undefined,
  );
}

/**
 * Full-text rank (title A > figures B > description C, from the generated column) plus how
 * closely a word of the title matches, so an exact title hit leads and a typo still scores.
 */
function relevance(term: string): SQL<number> {
  return sql<number>`(ts_rank_cd(${searchVector}, ${tsQuery(term)}) + strict_word_similarity(${term}, ${listings.title}))`;
}

function catalogOrder(search: CatalogSearch, term: string | undefined): SQL[] {
  switch (effectiveSort({ q: term, sort: search.sort })) {
    case "relevance":
      return [desc(relevance(term ?? "")), sql`${listings.liveAt} desc nulls last`, asc(listings.id)];
    case "price-asc":
      return [asc(listings.priceMinor), asc(listings.id)];
    case "price-desc":
      return [desc(listings.priceMinor), asc(listings.id)];
    case "newest":
      return [sql`${listings.liveAt} desc nulls last`, asc(listings.id)];
  }
}

async function searchWith(executor: Executor, search: CatalogSearch, term: string | undefined, page: number, pageSize: number) {
  const where = catalogWhere(search, term);
  const cover = coverPhoto(executor);
  const items = await executor
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
    .leftJoinLateral(cover, sql`true`)
    .where(where)
    .orderBy(...catalogOrder(search, term))
    .limit(pageSize)
    .offset((page - 1) * pageSize);
  const [count] = await executor
    .select({ n: sql<number>`count(*)::int` })
    .from(listings)
    .leftJoin(sellerProfiles, eq(sellerProfiles.userId, listings.sellerId))
    .where(where);
  return { items: items satisfies CatalogCard[], total: count?.n ?? 0 };
}

/** Live listings matching the catalog's search, filters and sort, one page of them and the total. */
export async function searchListings(search: CatalogSearch): Promise<CatalogResult> {
  const pageSize = Math.min(100, Math.max(1, Math.trunc(search.pageSize ?? CATALOG_PAGE_SIZE)));
  const page = Math.max(1, Math.trunc(search.page ?? 1));
  const term = search.q?.trim() || undefined;
  if (!term) return { ...(await searchWith(db, search, term, page, pageSize)), page, pageSize };
  // The trigram operator takes its threshold from a setting; SET LOCAL keeps it to this search
  // and lets the title's trigram index answer `<<%` at our threshold.
  const found = await db.transaction(
    async (tx) => {
      await tx.execute(sql`select set_config('pg_trgm.strict_word_similarity_threshold', ${String(TYPO_THRESHOLD)}, true)`);
      return searchWith(tx, search, term, page, pageSize);
    },
    { accessMode: "read only" },
  );
  return { ...found, page, pageSize };
}

/** Shops with at least one live listing, for the catalog's seller filter. */
export async function listCatalogSellers(): Promise<{ slug: string; shopName: string }[]> {
  return db
    .select({ slug: sellerProfiles.slug, shopName: sellerProfiles.shopName })
    .from(sellerProfiles)
    .where(sql`exists (select 1 from ${listings} where ${listings.sellerId} = ${sellerProfiles.userId} and ${listings.state} = 'live')`)
    .orderBy(asc(sellerProfiles.shopName));
}

// ——— Which magnetics fit which kits ———

// Figures travel through JSON and a double-precision column, so a value typed as exactly the
// requirement must not fail on the last bit; the same slack as lib/listings/fit.ts.
const FIT_SLACK = 1e-9;

/** A magnetic fits a requirement: same subtype, L ≥ the minimum, rated current ≥ the stated current. */
type MagneticColumns = Record<"magneticSubtype" | "inductanceH" | "ratedCurrentA", SQLWrapper>;

function fitCondition(magnetic: MagneticColumns, requirement: typeof listingRequirements): SQL {
  return sql`${magnetic.magneticSubtype} = ${requirement.subtype}
    and (${requirement.minInductanceH} is null or ${magnetic.inductanceH} >= ${requirement.minInductanceH} * ${1 - FIT_SLACK}::float8)
    and (${requirement.atCurrentA} is null or ${magnetic.ratedCurrentA} >= ${requirement.atCurrentA} * ${1 - FIT_SLACK}::float8)`;
}

export type FittedKit = {
  id: string;
  slug: string;
  title: string;
  priceMinor: number;
  currency: string;
  stock: number;
  /** the kit's requirement the magnetic meets (the first by label when it meets several) */
  requirementLabel: string;
};

// A part may fit thousands of kits in a large catalog; the page names a handful and says there are more.
export const KITS_PER_MAGNETIC = 12;

/** Live kits with a requirement that the given magnetic meets; each kit once, by title, at most `limit`. */
export async function kitsFittedByMagnetic(magneticId: string, limit = KITS_PER_MAGNETIC + 1): Promise<FittedKit[]> {
  const magnetic = alias(listings, "magnetic");
  const kit = alias(listings, "kit");
  return db
    .selectDistinctOn([kit.title, kit.id], {
      id: kit.id,
      slug: kit.slug,
      title: kit.title,
      priceMinor: kit.priceMinor,
      currency: kit.currency,
      stock: kit.stock,
      requirementLabel: listingRequirements.label,
    })
    .from(magnetic)
    .innerJoin(listingRequirements, fitCondition(magnetic, listingRequirements))
    .innerJoin(kit, eq(kit.id, listingRequirements.listingId))
    .where(and(eq(magnetic.id, magneticId), eq(magnetic.kind, "magnetic"), eq(kit.state, "live"), eq(kit.kind, "kit")))
    .orderBy(asc(kit.title), asc(kit.id), asc(listingRequirements.label))
    .limit(limit);
}

export type FittingMagnetic = {
  id: string;
  slug: string;
  title: string;
  priceMinor: number;
  currency: string;
  stock: number;
  inductanceH: number | null;
  ratedCurrentA: number | null;
  shopName: string | null;
};

export type RequirementFits = {
  requirementId: string;
  label: string;
  subtype: MagneticSubtype;
  minInductanceH: number | null;
  atCurrentA: number | null;
  magnetics: FittingMagnetic[];
};

// A page lists a handful per requirement; the catalog is the place to browse all of them.
const MAGNETICS_PER_REQUIREMENT = 12;

/** Each requirement of a kit with the live magnetics that meet it, cheapest first. */
export async function magneticsFittingKit(kitId: string): Promise<RequirementFits[]> {
  const magnetic = alias(listings, "magnetic");
  const requirements = await db
    .select({
      requirementId: listingRequirements.id,
      label: listingRequirements.label,
      subtype: listingRequirements.subtype,
      minInductanceH: listingRequirements.minInductanceH,
      atCurrentA: listingRequirements.atCurrentA,
    })
    .from(listingRequirements)
    .where(eq(listingRequirements.listingId, kitId))
    .orderBy(asc(listingRequirements.label), asc(listingRequirements.id));
  if (requirements.length === 0) return [];
  const ranked = db
    .select({
      requirementId: sql<string>`${listingRequirements.id}`.as("requirement_id"),
      rank: sql<number>`row_number() over (partition by ${listingRequirements.id} order by ${magnetic.priceMinor}, ${magnetic.id})`.as("rank"),
      id: magnetic.id,
      slug: magnetic.slug,
      title: magnetic.title,
      priceMinor: magnetic.priceMinor,
      currency: magnetic.currency,
      stock: magnetic.stock,
      inductanceH: magnetic.inductanceH,
      ratedCurrentA: magnetic.ratedCurrentA,
      shopName: sellerProfiles.shopName,
    })
    .from(listingRequirements)
    .innerJoin(magnetic, and(eq(magnetic.state, "live"), eq(magnetic.kind, "magnetic"), fitCondition(magnetic, listingRequirements)))
    .leftJoin(sellerProfiles, eq(sellerProfiles.userId, magnetic.sellerId))
    .where(inArray(listingRequirements.id, requirements.map((r) => r.requirementId)))
    .as("ranked");
  const rows = await db
    .select()
    .from(ranked)
    .where(lte(ranked.rank, MAGNETICS_PER_REQUIREMENT))
    .orderBy(asc(ranked.priceMinor), asc(ranked.id));
  return requirements.map((r) => ({
    ...r,
    magnetics: rows.filter((m) => m.requirementId === r.requirementId).map(({ requirementId: _r, rank: _k, ...m }) => m),
  }));
}

// ——— The listing page ———

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
