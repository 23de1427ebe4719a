import "server-only";
import { and, asc, desc, eq, gt, gte, inArray, lte, sql, type SQL, type SQLWrapper } from "drizzle-orm";
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
import { CATALOG_DEPTH } from "@/lib/listings/catalog-limits";
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

export type CatalogResult = {
  items: CatalogCard[];
  /** exact up to CATALOG_DEPTH; when `totalCapped`, there are more than this */
  total: number;
  totalCapped: boolean;
  page: number;
  pageSize: number;
};

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

/** How a search's words are matched: as words (full text), or as close spellings of the title's words. */
type MatchMode = "words" | "close";

/**
 * The words of the search in the full-text column, or (mode "close") a title whose words are
 * close to the wanted words (typos). The close match still honours the excluded words, so
 * "choke -toroidal" does not bring the toroid back through the typo path.
 */
function textMatch(term: string, mode: MatchMode): SQL {
  if (mode === "words") return sql`${searchVector} @@ ${tsQuery(term)}`;
  const excluded = [...term.matchAll(EXCLUDED)].map((m) => m[1] ?? "");
  const wanted = term.replace(EXCLUDED, " ").trim();
  if (!wanted) return sql`false`;
  return and(
    sql`${wanted} <<% ${listings.title}`,
    excluded.length > 0 ? sql`not (${searchVector} @@ ${tsQuery(excluded.join(" or "))})` : undefined,
  ) as SQL;
}

function catalogWhere(search: CatalogSearch, text: TextSearch | undefined): SQL | undefined {
  return and(
    eq(listings.state, "live"),
    text ? textMatch(text.term, text.mode) : undefined,
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

const NEWEST = [sql`${listings.liveAt} desc nulls last`, asc(listings.id)];

function catalogOrder(search: CatalogSearch, term: string | undefined): SQL[] {
  switch (effectiveSort({ q: term, sort: search.sort })) {
    case "relevance":
      return [desc(relevance(term ?? "")), ...NEWEST];
    case "price-asc":
      return [asc(listings.priceMinor), asc(listings.id)];
    case "price-desc":
      return [desc(listings.priceMinor), asc(listings.id)];
    case "newest":
      return NEWEST;
  }
}

type TextSearch = { term: string; mode: MatchMode };

/** Matching live listings up to `depth + 1`, so the caller knows whether there are more than `depth`. */
async function countUpTo(executor: Executor, where: SQL | undefined, depth: number): Promise<number> {
  const upTo = executor
    .select({ one: sql`1`.as("one") })
    .from(listings)
    .leftJoin(sellerProfiles, eq(sellerProfiles.userId, listings.sellerId))
    .where(where)
    .limit(depth + 1)
    .as("up_to");
  const [row] = await executor.select({ n: sql<number>`count(*)::int` }).from(upTo);
  return row?.n ?? 0;
}

const CARD_COLUMNS = (cover: ReturnType<typeof coverPhoto>) => ({
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
});

/** Filters alone: the page through the filters' indexes, and a count that stops past `depth`. */
async function filterWith(executor: Executor, search: CatalogSearch, page: number, pageSize: number, depth: number) {
  const where = catalogWhere(search, undefined);
  const cover = coverPhoto(executor);
  const items = await executor
    .select(CARD_COLUMNS(cover))
    .from(listings)
    .leftJoin(sellerProfiles, eq(sellerProfiles.userId, listings.sellerId))
    .leftJoinLateral(cover, sql`true`)
    .where(where)
    .orderBy(...catalogOrder(search, undefined))
    .limit(pageSize)
    .offset((page - 1) * pageSize);
  const found = await countUpTo(executor, where, depth);
  return { items: items satisfies CatalogCard[], total: Math.min(found, depth), totalCapped: found > depth };
}

/**
 * A text search sorts the newest `depth` matches, read in live_at order, so a broad word costs
 * the same in a catalog of 10,000 as of 100,000. The same read counts them (one past `depth`
 * tells "more than"), so the matches are read once.
 */
async function textSearchWith(executor: Executor, search: CatalogSearch, text: TextSearch, page: number, pageSize: number, depth: number) {
  const where = catalogWhere(search, text);
  const cover = coverPhoto(executor);
  const newest = executor
    .select({ id: listings.id, liveAt: listings.liveAt })
    .from(listings)
    .leftJoin(sellerProfiles, eq(sellerProfiles.userId, listings.sellerId))
    .where(where)
    .orderBy(...NEWEST)
    .limit(depth + 1)
    .as("newest");
  const considered = executor
    .select({
      id: newest.id,
      found: sql<number>`(count(*) over ())::int`.as("found"),
      position: sql<number>`row_number() over (order by ${newest.liveAt} desc nulls last, ${newest.id})`.as("position"),
    })
    .from(newest)
    .as("considered");
  const rows = await executor
    .select({ ...CARD_COLUMNS(cover), found: considered.found })
    .from(listings)
    .innerJoin(considered, eq(considered.id, listings.id))
    .leftJoin(sellerProfiles, eq(sellerProfiles.userId, listings.sellerId))
    .leftJoinLateral(cover, sql`true`)
    .where(lte(considered.position, depth))
    .orderBy(...catalogOrder(search, text.term))
    .limit(pageSize)
    .offset((page - 1) * pageSize);
  // A page past the last has no row to carry the count.
  const found = rows[0]?.found ?? (page > 1 ? await countUpTo(executor, where, depth) : 0);
  const items: CatalogCard[] = rows.map(({ found: _found, ...card }) => card);
  return { items, total: Math.min(found, depth), totalCapped: found > depth };
}

/**
 * Live listings matching the catalog's search, filters and sort: one page of them and the total
 * (exact up to `depth`, then capped with `totalCapped`). The search's words are matched as words
 * first; only when that finds nothing are close spellings of the title's words tried (typos).
 */
export async function searchListings(search: CatalogSearch, { depth = CATALOG_DEPTH }: { depth?: number } = {}): Promise<CatalogResult> {
  const pageSize = Math.min(100, Math.max(1, Math.trunc(search.pageSize ?? CATALOG_PAGE_SIZE)));
  const page = Math.max(1, Math.trunc(search.page ?? 1));
  const term = search.q?.trim() || undefined;
  if (!term) return { ...(await filterWith(db, search, page, pageSize, depth)), page, pageSize };
  const found = await db.transaction(
    async (tx) => {
      const asWords = await textSearchWith(tx, search, { term, mode: "words" }, page, pageSize, depth);
      if (asWords.total > 0) return asWords;
      // The trigram operator takes its threshold from a setting; SET LOCAL keeps it to this search
      // and lets the title's trigram index answer `<<%` at our threshold.
      await tx.execute(sql`select set_config('pg_trgm.strict_word_similarity_threshold', ${String(TYPO_THRESHOLD)}, true)`);
      return textSearchWith(tx, search, { term, mode: "close" }, page, pageSize, depth);
    },
    { accessMode: "read only" },
  );
  return { ...found, page, pageSize };
}

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
  // Live kits walked in title order (listings_live_kits_title_idx) until `limit` have a requirement
  // the part meets; the label is the first such requirement's.
  const fitting = db
    .select({ label: listingRequirements.label })
    .from(listingRequirements)
    .innerJoin(magnetic, eq(magnetic.id, magneticId))
    .where(and(eq(listingRequirements.listingId, kit.id), eq(magnetic.kind, "magnetic"), fitCondition(magnetic, listingRequirements)))
    .orderBy(asc(listingRequirements.label))
    .limit(1)
    .as("fitting");
  return db
    .select({
      id: kit.id,
      slug: kit.slug,
      title: kit.title,
      priceMinor: kit.priceMinor,
      currency: kit.currency,
      stock: kit.stock,
      requirementLabel: fitting.label,
    })
    .from(kit)
    .crossJoinLateral(fitting)
    .where(and(eq(kit.state, "live"), eq(kit.kind, "kit")))
    .orderBy(asc(kit.title), asc(kit.id))
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
  // Per requirement, the live magnetics of its subtype walked cheapest first (listings_live_facets_idx)
  // until twelve fit, instead of ranking every fitting magnetic.
  const cheapest = db
    .select({
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
    .from(magnetic)
    .leftJoin(sellerProfiles, eq(sellerProfiles.userId, magnetic.sellerId))
    .where(and(eq(magnetic.state, "live"), eq(magnetic.kind, "magnetic"), fitCondition(magnetic, listingRequirements)))
    .orderBy(asc(magnetic.priceMinor), asc(magnetic.id))
    .limit(MAGNETICS_PER_REQUIREMENT)
    .as("cheapest");
  const rows = await db
    .select({
      requirementId: listingRequirements.id,
      id: cheapest.id,
      slug: cheapest.slug,
      title: cheapest.title,
      priceMinor: cheapest.priceMinor,
      currency: cheapest.currency,
      stock: cheapest.stock,
      inductanceH: cheapest.inductanceH,
      ratedCurrentA: cheapest.ratedCurrentA,
      shopName: cheapest.shopName,
    })
    .from(listingRequirements)
    .crossJoinLateral(cheapest)
    .where(eq(listingRequirements.listingId, kitId))
    .orderBy(asc(cheapest.priceMinor), asc(cheapest.id));
  return requirements.map((r) => ({
    ...r,
    magnetics: rows.filter((m) => m.requirementId === r.requirementId).map(({ requirementId: _r, ...m }) => m),
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
