/**
 * The catalog's query: one schema for the page's searchParams, GET /api/listings and the client
 * that keeps the URL in step, so a link, a reload and an API call all mean the same search.
 * Prices are integer minor units in the URL and the API; the filter controls show major units.
 */
import * as z from "zod/mini";
import { NUL_ERROR, NUL_FREE } from "./text";
import type { ListingKind, MagneticSubtype } from "@/db/schema/listings";
import { fieldErrorsFromZod, type FieldErrors } from "@/lib/http/field-errors";

// Written with zod/mini, whose functions are tree-shaken: the catalog's client code parses the URL
// with this schema, and the full zod would be most of that page's JavaScript beyond the framework.

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
// Well inside a PostgreSQL integer, like the listing form's own price bound.
const MAX_PRICE_MINOR = 999_999_999;

const TRUE_WORDS = ["1", "true", "yes", "on"] as const;
const FALSE_WORDS = ["0", "false", "no", "off"] as const;

// A form submitted with an empty field (`?kind=`) means "no filter", not an invalid kind.
const blankIsAbsent = (value: unknown) => (typeof value === "string" && value.trim() === "" ? undefined : value);
// Typed by hand: TypeScript cannot check a generic schema against the transform's output itself.
const optional = <S extends z.ZodMiniType>(schema: S) =>
  z.pipe(z.transform(blankIsAbsent), z.optional(schema)) as unknown as z.ZodMiniPipe<z.ZodMiniTransform<unknown, unknown>, z.ZodMiniOptional<S>>;

const minorUnits = (label: string) =>
  z.coerce
    .number({ error: `${label} must be a whole number of cents.` })
    .check(
      z.int({ error: `${label} must be a whole number of cents.` }),
      z.gte(0, { error: `${label} cannot be below zero.` }),
      z.lte(MAX_PRICE_MINOR, { error: `${label} is too large.` }),
    );

export const catalogQuerySchema = z
  .object({
    q: optional(z.string().check(z.regex(NUL_FREE, NUL_ERROR), z.trim(), z.maxLength(MAX_QUERY_LENGTH, { error: `Keep the search under ${MAX_QUERY_LENGTH} characters.` }))),
    kind: optional(z.enum(CATALOG_KINDS, { error: "Kind is one of board, magnetic or kit." })),
    subtype: optional(z.enum(CATALOG_SUBTYPES, { error: "Subtype is one of transformer, choke or current-transformer." })),
    mains: optional(z.enum(["yes", "no"], { error: "Mains-connected is yes or no." })),
    minPrice: optional(minorUnits("The lowest price")),
    maxPrice: optional(minorUnits("The highest price")),
    inStock: optional(
      z.pipe(
        z.enum([...TRUE_WORDS, ...FALSE_WORDS], { error: "In stock is 1 or 0." }),
        z.transform((v: (typeof TRUE_WORDS | typeof FALSE_WORDS)[number]) => (TRUE_WORDS as readonly string[]).includes(v)),
      ),
    ),
    seller: optional(
      z.string().check(
        z.regex(NUL_FREE, NUL_ERROR),
        z.trim(),
        z.toLowerCase(),
        z.maxLength(80, { error: "That shop handle is too long." }),
        z.regex(/^[a-z0-9]+(?:-[a-z0-9]+)*$/, { error: "A shop handle has letters, digits and dashes only." }),
      ),
    ),
    sort: optional(z.enum(CATALOG_SORTS, { error: "Sort is relevance, newest, price-asc or price-desc." })),
    page: optional(
      z.coerce
        .number({ error: "Page must be a whole number." })
        .check(
          z.int({ error: "Page must be a whole number." }),
          z.gte(1, { error: "Pages start at 1." }),
          z.lte(MAX_PAGE, { error: `Pages stop at ${MAX_PAGE}.` }),
        ),
    ),
  })
  .check(
    z.superRefine((v, ctx) => {
      if (v.minPrice !== undefined && v.maxPrice !== undefined && v.minPrice > v.maxPrice) {
        ctx.addIssue({ code: "custom", path: ["maxPrice"], message: "The highest price is below the lowest." });
      }
      if (v.subtype !== undefined && v.kind !== undefined && v.kind !== "magnetic") {
        ctx.addIssue({ code: "custom", path: ["subtype"], message: "A subtype narrows magnetics only." });
      }
    }),
  );

export type CatalogQuery = z.output<typeof catalogQuerySchema>;

export const CATALOG_PARAM_KEYS = ["q", "kind", "subtype", "mains", "minPrice", "maxPrice", "inStock", "seller", "sort", "page"] as const;

type SearchSource = URLSearchParams | Record<string, string | string[] | undefined>;

/** The first value of each known key; a repeated key (`?kind=a&kind=b`) is read as its first value. */
export function catalogParamsFrom(source: SearchSource): Record<string, string> {
  const out: Record<string, string> = {};
  for (const key of CATALOG_PARAM_KEYS) {
    const raw = source instanceof URLSearchParams ? source.get(key) : source[key];
    const value = Array.isArray(raw) ? raw[0] : raw;
    if (typeof value === "string") out[key] = value;
  }
  return out;
}

export type CatalogParse =
  | { ok: true; query: CatalogQuery }
  | { ok: false; fieldErrors: FieldErrors };

export function parseCatalogQuery(source: SearchSource): CatalogParse {
  const result = catalogQuerySchema.safeParse(catalogParamsFrom(source));
  return result.success ? { ok: true, query: result.data } : { ok: false, fieldErrors: fieldErrorsFromZod(result.error) };
}

/**
 * For a page a person opened: what is valid is kept and what is not is dropped (and reported),
 * so a stale bookmark still shows a catalog rather than an error.
 */
export function lenientCatalogQuery(source: SearchSource): { query: CatalogQuery; ignored: FieldErrors } {
  const first = parseCatalogQuery(source);
  if (first.ok) return { query: first.query, ignored: {} };
  const params = catalogParamsFrom(source);
  for (const key of Object.keys(first.fieldErrors)) delete params[key];
  const second = catalogQuerySchema.safeParse(params);
  return { query: second.success ? second.data : {}, ignored: first.fieldErrors };
}

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
