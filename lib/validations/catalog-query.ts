/**
 * The catalog's query without its schema (./catalog.ts): the names, bounds, canonical search
 * string and price conversions that the catalog's client code needs. No Zod here, so the catalog
 * page does not ship it.
 */
import type { ListingKind, MagneticSubtype } from "@/db/schema/listings";

// Spelled out rather than imported so the client bundle does not pull in the Drizzle schema;
// tests/unit/catalog checks they equal the schema's enums.
export const CATALOG_KINDS = ["board", "magnetic", "kit"] as const satisfies readonly ListingKind[];
export const CATALOG_SUBTYPES = ["transformer", "choke", "current-transformer"] as const satisfies readonly MagneticSubtype[];

export const CATALOG_SORTS = ["relevance", "newest", "price-asc", "price-desc"] as const;
export type CatalogSort = (typeof CATALOG_SORTS)[number];

export const CATALOG_PAGE_SIZE = 24;
export const MAX_QUERY_LENGTH = 200;
// Deep pages are for scrapers, not people; a bound keeps OFFSET cheap.
export const MAX_PAGE = 1000;
export type CatalogQuery = {
  q?: string;
  kind?: (typeof CATALOG_KINDS)[number];
  subtype?: (typeof CATALOG_SUBTYPES)[number];
  mains?: "yes" | "no";
  minPrice?: number;
  maxPrice?: number;
  inStock?: boolean;
  seller?: string;
  sort?: CatalogSort;
  page?: number;
};

/** Relevance needs words to rank by; without a search the newest come first. */
export function effectiveSort(query: Pick<CatalogQuery, "q" | "sort">): CatalogSort {
  if (query.sort && (query.sort !== "relevance" || query.q)) return query.sort;
  return query.q ? "relevance" : "newest";
}

/**
 * The canonical search string of a query: keys in a fixed order, defaults left out (page 1, the
 * default sort), so equal searches give equal URLs and equal cache keys.
 */
export function catalogSearchString(query: CatalogQuery): string {
  const params = new URLSearchParams();
  if (query.q) params.set("q", query.q);
  if (query.kind) params.set("kind", query.kind);
  if (query.subtype) params.set("subtype", query.subtype);
  if (query.mains) params.set("mains", query.mains);
  if (query.minPrice !== undefined) params.set("minPrice", String(query.minPrice));
  if (query.maxPrice !== undefined) params.set("maxPrice", String(query.maxPrice));
  if (query.inStock) params.set("inStock", "1");
  if (query.seller) params.set("seller", query.seller);
  const sort = effectiveSort(query);
  if (sort !== effectiveSort({ q: query.q })) params.set("sort", sort);
  if (query.page && query.page > 1) params.set("page", String(query.page));
  return params.toString();
}

// ——— Price filter in major units ———

// Listings are priced in currencies with two minor digits (lib/validations/listings.ts CURRENCIES).
const MINOR_DIGITS = 2;
const MAJOR_AMOUNT = /^(\d{1,7})(?:\.(\d{1,2}))?$/;

/**
 * "25" → 2500, "12.5" → 1250; "" → null (no bound); anything else → undefined (not an amount).
 * Joined as digits, never multiplied as a float.
 */
export function majorToMinor(text: string): number | null | undefined {
  const trimmed = text.trim();
  if (trimmed === "") return null;
  const match = MAJOR_AMOUNT.exec(trimmed);
  if (!match) return undefined;
  return Number.parseInt(`${match[1] ?? "0"}${(match[2] ?? "").padEnd(MINOR_DIGITS, "0")}`, 10);
}

/** 2500 → "25", 1250 → "12.50": what the price field shows for a bound in the URL. */
export function minorToMajor(minor: number | undefined): string {
  if (minor === undefined) return "";
  const whole = Math.trunc(minor / 100);
  const cents = minor % 100;
  return cents === 0 ? String(whole) : `${whole}.${String(cents).padStart(MINOR_DIGITS, "0")}`;
}
