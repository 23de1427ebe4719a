/**
 * The catalog's query: one schema for the page's searchParams, GET /api/listings and the client
 * that keeps the URL in step, so a link, a reload and an API call all mean the same search.
 * Prices are integer minor units in the URL and the API; the filter controls show major units.
 */
import * as z from "zod/mini";
import { NUL_ERROR, NUL_FREE } from "./text";
import { fieldErrorsFromZod, type FieldErrors } from "@/lib/http/field-errors";
import { CATALOG_KINDS, CATALOG_SORTS, CATALOG_SUBTYPES, MAX_PAGE, MAX_QUERY_LENGTH, type CatalogQuery } from "./catalog-query";

export * from "./catalog-query";

// Written with zod/mini, whose functions are tree-shaken. The catalog's client code takes its
// query from the server page and imports only ./catalog-query.ts, which has no Zod at all; it
// loads this module lazily for the rare URL the server's render does not match.

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

// The hand-written CatalogQuery of ./catalog-query.ts must be exactly what the schema gives.
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const schemaGivesCatalogQuery: Same<z.output<typeof catalogQuerySchema>, CatalogQuery> = true;
void schemaGivesCatalogQuery;

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

