// The catalog's URL/query schema. URL encoding follows the WHATWG URL Standard's
// application/x-www-form-urlencoded rules, which URLSearchParams implements.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { LISTING_KINDS, MAGNETIC_SUBTYPES } from "@/db/schema/listings";
import {
  CATALOG_KINDS,
  CATALOG_SORTS,
  CATALOG_SUBTYPES,
  catalogSearchString,
  effectiveSort,
  lenientCatalogQuery,
  parseCatalogQuery,
  type CatalogQuery,
} from "@/lib/validations/catalog";

const parse = (search: string) => parseCatalogQuery(new URLSearchParams(search));

describe("catalog query schema", () => {
  it("spells out the same kinds and subtypes as the database enums", () => {
    expect([...CATALOG_KINDS]).toEqual([...LISTING_KINDS]);
    expect([...CATALOG_SUBTYPES]).toEqual([...MAGNETIC_SUBTYPES]);
  });

  it("reads every parameter into its type", () => {
    expect(parse("q=+output+choke+&kind=magnetic&subtype=choke&mains=no&minPrice=1500&maxPrice=9000&inStock=1&seller=Larkspur-Coil-Room&sort=price-desc&page=3")).toEqual({
      ok: true,
      query: { q: "output choke", kind: "magnetic", subtype: "choke", mains: "no", minPrice: 1500, maxPrice: 9000, inStock: true, seller: "larkspur-coil-room", sort: "price-desc", page: 3 },
    });
  });

  it("an empty search string is an empty query, and blank fields are absent", () => {
    expect(parse("")).toEqual({ ok: true, query: {} });
    expect(parse("q=%20%20&kind=&page=")).toEqual({ ok: true, query: {} });
  });

  it("reads inStock words both ways", () => {
    for (const yes of ["1", "true", "yes", "on"]) expect(parse(`inStock=${yes}`)).toEqual({ ok: true, query: { inStock: true } });
    for (const no of ["0", "false", "no", "off"]) expect(parse(`inStock=${no}`)).toEqual({ ok: true, query: { inStock: false } });
  });

  it("takes the first of a repeated parameter", () => {
    expect(parse("kind=kit&kind=board")).toEqual({ ok: true, query: { kind: "kit" } });
    expect(parseCatalogQuery({ kind: ["board", "kit"] })).toEqual({ ok: true, query: { kind: "board" } });
  });

  it("ignores parameters it does not know", () => {
    expect(parse("utm_source=newsletter&kind=kit")).toEqual({ ok: true, query: { kind: "kit" } });
  });

  it("names each bad field", () => {
    const result = parse("kind=gadget&minPrice=-3&page=0");
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(Object.keys(result.fieldErrors).sort()).toEqual(["kind", "minPrice", "page"]);
  });

  it("checks the fields against each other once each is valid on its own", () => {
    expect(parse("minPrice=3000&maxPrice=2000")).toEqual({ ok: false, fieldErrors: { maxPrice: ["The highest price is below the lowest."] } });
    expect(parse("minPrice=3000&maxPrice=3000")).toEqual({ ok: true, query: { minPrice: 3000, maxPrice: 3000 } });
    expect(parse("kind=kit&subtype=choke")).toEqual({ ok: false, fieldErrors: { subtype: ["A subtype narrows magnetics only."] } });
    expect(parse("subtype=choke")).toEqual({ ok: true, query: { subtype: "choke" } });
  });

  it("a page opened from a stale link keeps the valid filters and reports the rest", () => {
    expect(lenientCatalogQuery(new URLSearchParams("kind=kit&sort=cheapest&page=2"))).toEqual({
      query: { kind: "kit", page: 2 },
      ignored: { sort: ["Sort is relevance, newest, price-asc or price-desc."] },
    });
  });
});

describe("effectiveSort", () => {
  it("relevance with a search, newest without one, a chosen sort otherwise", () => {
    expect(effectiveSort({})).toBe("newest");
    expect(effectiveSort({ q: "choke" })).toBe("relevance");
    expect(effectiveSort({ sort: "relevance" })).toBe("newest");
    expect(effectiveSort({ q: "choke", sort: "price-asc" })).toBe("price-asc");
    expect(effectiveSort({ sort: "newest", q: "choke" })).toBe("newest");
  });
});

describe("catalogSearchString", () => {
  it("leaves defaults out and writes keys in one order", () => {
    expect(catalogSearchString({})).toBe("");
    expect(catalogSearchString({ page: 1, sort: "newest", inStock: false })).toBe("");
    expect(catalogSearchString({ q: "choke", sort: "relevance" })).toBe("q=choke");
    expect(catalogSearchString({ page: 2, kind: "kit", q: "a&b c" })).toBe("q=a%26b+c&kind=kit&page=2");
  });

  const queryArb: fc.Arbitrary<CatalogQuery> = fc.record(
    {
      q: fc.string({ minLength: 1, maxLength: 40 }).map((s) => s.trim()).filter((s) => s !== ""),
      kind: fc.constantFrom(...CATALOG_KINDS),
      mains: fc.constantFrom("yes" as const, "no" as const),
      minPrice: fc.integer({ min: 0, max: 100_000 }),
      maxPrice: fc.integer({ min: 100_000, max: 999_999_999 }),
      inStock: fc.boolean(),
      seller: fc.stringMatching(/^[a-z0-9]{1,10}(-[a-z0-9]{1,10}){0,2}$/),
      sort: fc.constantFrom(...CATALOG_SORTS),
      page: fc.integer({ min: 1, max: 1000 }),
    },
    { requiredKeys: [] },
  );

  // What the string form keeps: the query with its defaults dropped.
  const normalised = (q: CatalogQuery): CatalogQuery => {
    const out: CatalogQuery = { ...q };
    if (!out.inStock) delete out.inStock;
    if (out.page === 1) delete out.page;
    const sort = effectiveSort(out);
    if (sort === effectiveSort({ q: out.q })) delete out.sort;
    else out.sort = sort;
    return out;
  };

  it("round-trips: parsing the string gives back the query, defaults aside", () => {
    fc.assert(
      fc.property(queryArb, (query) => {
        const parsed = parse(catalogSearchString(query));
        expect(parsed).toEqual({ ok: true, query: normalised(query) });
      }),
    );
  });

  it("is canonical: a query and its round trip give the same string", () => {
    fc.assert(
      fc.property(queryArb, (query) => {
        const once = catalogSearchString(query);
        const parsed = parse(once);
        if (!parsed.ok) throw new Error(once);
        expect(catalogSearchString(parsed.query)).toBe(once);
      }),
    );
  });
});
