// searchListings against the real PostgreSQL full-text search and pg_trgm. Expected sets come
// from the fixture table itself (filtered in plain TypeScript), never from the query under test.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDatabase } from "../../support/test-database";
import { FIXTURES, insertCatalogFixtures, LIVE, SHOPS, type Fixture } from "./fixtures";

let database: Awaited<ReturnType<typeof freshDatabase>>;
type Catalog = typeof import("@/db/queries/catalog");
let catalog: Catalog;

beforeAll(async () => {
  database = await freshDatabase("catalog_search");
  await insertCatalogFixtures(database.url);
  process.env.DATABASE_URL = database.url;
  catalog = await import("@/db/queries/catalog");
});

afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
  await database.drop();
});

const keys = (items: { slug: string }[]) => items.map((i) => i.slug);
const keysOf = (fixtures: Fixture[]) => fixtures.map((f) => f.key);
const sorted = (list: string[]) => [...list].sort();
const HIDDEN_KEYS = keysOf(FIXTURES.filter((f) => f.state !== "live"));

/** Every page of a search, to check a filter over all results rather than the first page. */
async function everything(search: Parameters<Catalog["searchListings"]>[0]) {
  const first = await catalog.searchListings({ ...search, page: 1, pageSize: 100 });
  expect(first.total).toBe(first.items.length);
  return first;
}

describe("searchListings: what may come back", () => {
  it("without a search returns every live listing and none in draft, in review, sent back, held or retired", async () => {
    const all = await everything({});
    expect(sorted(keys(all.items))).toEqual(sorted(keysOf(LIVE)));
    expect(all.total).toBe(LIVE.length);
    for (const key of HIDDEN_KEYS) expect(keys(all.items)).not.toContain(key);
  });

  it("a search that every non-live listing's title matches still returns live listings only", async () => {
    const found = await everything({ q: "output choke" });
    expect(found.items.length).toBeGreaterThan(0);
    for (const key of HIDDEN_KEYS) expect(keys(found.items)).not.toContain(key);
    const typo = await everything({ q: "otuput choek" });
    for (const key of HIDDEN_KEYS) expect(keys(typo.items)).not.toContain(key);
  });

  it("each card carries the shop's name and the cover photo at position 0 (its thumbnail)", async () => {
    const { items } = await everything({ q: "gate drive" });
    const card = items.find((i) => i.slug === "gate-drive");
    expect(card).toMatchObject({
      title: "Half-bridge gate drive board",
      kind: "board",
      priceMinor: 3500,
      currency: "EUR",
      stock: 10,
      mainsConnected: true,
      shopName: SHOPS.boards.shopName,
      coverUrl: "/demo/gate-drive-photo-0-thumb.webp",
      coverAlt: "Half-bridge gate drive board, photo 1",
    });
  });
});

describe("searchListings: relevance", () => {
  // PostgreSQL 15 manual §12.3.3: ts_rank_cd weighs lexemes {D 0.1, C 0.2, B 0.4, A 1.0}; the
  // generated column labels title A, figures B, description C.
  it("a title match outranks a listing that mentions the word only in its description", async () => {
    const { items } = await everything({ q: "choke" });
    const order = keys(items);
    // Both chokes have the word in their titles; the bleeder board only in its description.
    expect(order).toContain("bleeder-board");
    expect(order.indexOf("choke-22")).toBeLessThan(order.indexOf("bleeder-board"));
    expect(order.indexOf("choke-40")).toBeLessThan(order.indexOf("bleeder-board"));
    expect(order.at(-1)).toBe("bleeder-board");
  });

  it("a match in the figures outranks one in the description (weights B over C)", async () => {
    // The current transformer's core material is in its figures; the gate drive board names
    // the same material in its description and went live later, so only the weights put the
    // transformer first.
    const order = keys((await everything({ q: "nanocrystalline" })).items);
    expect(order).toEqual(["sense-ct", "gate-drive"]);
  });

  // PostgreSQL 15 manual §12.6.6: the english Snowball stemmer reduces "chokes" and "choke" to one lexeme.
  it("English stemming: a plural finds the singular", async () => {
    const order = keys((await everything({ q: "chokes" })).items);
    expect(order).toEqual(expect.arrayContaining(["choke-22", "choke-40"]));
  });

  // PostgreSQL 15 manual §12.3.2, websearch_to_tsquery: "-" before a word means NOT.
  it("websearch syntax: a minus word excludes, on the typo path too", async () => {
    // Only the 22 µH choke's description mentions welding; its title alone would match
    // "output choke" exactly through the trigram path if that ignored the exclusion.
    const order = keys((await everything({ q: "output choke -welding" })).items);
    expect(sorted(order)).toEqual(["bleeder-board", "choke-40"]);
  });

  // PostgreSQL 15 manual F.35 (pg_trgm): strict_word_similarity("choek", "choke") shares 3 of 9
  // distinct trigrams, 0.33; "chopper" shares 3 of 11, 0.27 — so a 0.3 threshold keeps only the choke.
  it("a typo in the title still finds it: “choek” finds both chokes and nothing unrelated", async () => {
    const order = keys((await everything({ q: "choek" })).items);
    expect(sorted(order)).toEqual(["choke-22", "choke-40"]);
  });

  it("a typo in one of two words still ranks the listing first: “stick wleder” → the stick welder kit", async () => {
    const order = keys((await everything({ q: "stick wleder" })).items);
    expect(order[0]).toBe("stick-kit");
  });

  it("a search that matches nothing returns no items and a total of 0", async () => {
    expect(await catalog.searchListings({ q: "xylophone" })).toEqual({ items: [], total: 0, totalCapped: false, page: 1, pageSize: 24 });
  });
});

describe("searchListings: filters", () => {
  const cases: [string, Parameters<Catalog["searchListings"]>[0], (f: Fixture) => boolean][] = [
    ["kind", { kind: "kit" }, (f) => f.kind === "kit"],
    ["magnetic subtype", { subtype: "choke" }, (f) => f.subtype === "choke"],
    ["mains-connected", { mains: "yes" }, (f) => f.mains],
    ["not mains-connected", { mains: "no" }, (f) => !f.mains],
    ["lowest price, inclusive", { minPrice: 4800 }, (f) => f.priceMinor >= 4800],
    ["highest price, inclusive", { maxPrice: 3500 }, (f) => f.priceMinor <= 3500],
    ["price range", { minPrice: 1500, maxPrice: 9500 }, (f) => f.priceMinor >= 1500 && f.priceMinor <= 9500],
    ["in stock", { inStock: true }, (f) => f.stock > 0],
    ["seller", { seller: SHOPS.coils.slug }, (f) => f.shop === "coils"],
    ["several at once", { kind: "magnetic", inStock: true, maxPrice: 5000 }, (f) => f.kind === "magnetic" && f.stock > 0 && f.priceMinor <= 5000],
    ["a search with a filter", { q: "choke", inStock: true }, (f) => ["choke-22", "bleeder-board"].includes(f.key)],
  ];

  it.each(cases)("%s", async (_name, search, expected) => {
    const want = keysOf(LIVE.filter(expected));
    expect(want.length).toBeGreaterThan(0);
    // Each filter must actually narrow the catalog, or the case proves nothing.
    expect(want.length).toBeLessThan(LIVE.length);
    const got = await everything(search);
    expect(sorted(keys(got.items))).toEqual(sorted(want));
  });

  it("inStock false means no stock filter", async () => {
    expect((await everything({ inStock: false })).total).toBe(LIVE.length);
  });

  it("an unknown shop gives nothing", async () => {
    expect((await everything({ seller: "no-such-shop" })).total).toBe(0);
  });
});

describe("searchListings: sorting and paging", () => {
  it("price, low to high and high to low", async () => {
    const asc = (await everything({ sort: "price-asc" })).items.map((i) => i.priceMinor);
    const desc = (await everything({ sort: "price-desc" })).items.map((i) => i.priceMinor);
    const prices = LIVE.map((f) => f.priceMinor);
    expect(asc).toEqual([...prices].sort((a, b) => a - b));
    expect(desc).toEqual([...prices].sort((a, b) => b - a));
  });

  it("newest first without a search, and newest as a chosen sort with a search", async () => {
    const byAge = [...LIVE].sort((a, b) => (a.liveDaysAgo ?? 0) - (b.liveDaysAgo ?? 0));
    expect(keys((await everything({})).items)).toEqual(keysOf(byAge));
    const chokes = keys((await everything({ q: "choke", sort: "newest" })).items);
    expect(chokes).toEqual(keysOf(byAge.filter((f) => ["choke-22", "choke-40", "bleeder-board"].includes(f.key))));
  });

  it("pages of 5 cover every live listing once, with the same total on each page", async () => {
    const pageSize = 5;
    const seen: string[] = [];
    const pages = Math.ceil(LIVE.length / pageSize);
    for (let page = 1; page <= pages; page++) {
      const result = await catalog.searchListings({ sort: "price-asc", page, pageSize });
      expect(result).toMatchObject({ total: LIVE.length, page, pageSize });
      expect(result.items.length).toBe(page < pages ? pageSize : LIVE.length - pageSize * (pages - 1));
      seen.push(...keys(result.items));
    }
    expect(seen).toHaveLength(LIVE.length);
    expect(sorted(seen)).toEqual(sorted(keysOf(LIVE)));
    const beyond = await catalog.searchListings({ sort: "price-asc", page: pages + 1, pageSize });
    expect(beyond).toMatchObject({ items: [], total: LIVE.length, page: pages + 1 });
  });

  it("a filtered total counts the filtered listings, not the page", async () => {
    const kits = LIVE.filter((f) => f.kind === "board").length;
    const result = await catalog.searchListings({ kind: "board", pageSize: 4 });
    expect(result.items).toHaveLength(4);
    expect(result.total).toBe(kits);
  });
});

describe("searchListings: depth (how far a view looks and counts)", () => {
  // Common practice in large catalogs: a text search sorts a bounded set of matches and the
  // count stops past it ("more than N"), so a broad word does not read the whole catalog.
  // The depth is a parameter; these cases use 3 on the small fixture set.
  const byAge = [...LIVE].sort((a, b) => (a.liveDaysAgo ?? 0) - (b.liveDaysAgo ?? 0));

  it("without a search the total stops at the depth and says so; the pages still follow the sort", async () => {
    const result = await catalog.searchListings({ sort: "price-asc", pageSize: 100 }, { depth: 3 });
    expect(result).toMatchObject({ total: 3, totalCapped: true });
    expect(result.items.map((i) => i.priceMinor)).toEqual(LIVE.map((f) => f.priceMinor).sort((a, b) => a - b));
  });

  it("a view with no more matches than the depth gives the exact total, not capped", async () => {
    const kits = LIVE.filter((f) => f.kind === "kit").length;
    expect(kits).toBeLessThanOrEqual(3);
    expect(await catalog.searchListings({ kind: "kit" }, { depth: 3 })).toMatchObject({ total: kits, totalCapped: false });
    expect(await catalog.searchListings({ kind: "kit" }, { depth: kits })).toMatchObject({ total: kits, totalCapped: false });
  });

  it("a text search sorts only the newest matches up to the depth", async () => {
    // "kit" matches every kit; with depth 2 only the two that went live last are considered.
    const kits = byAge.filter((f) => f.kind === "kit");
    expect(kits.length).toBeGreaterThan(2);
    const result = await catalog.searchListings({ q: "kit", sort: "price-asc" }, { depth: 2 });
    expect(result).toMatchObject({ total: 2, totalCapped: true });
    const newestTwo = kits.slice(0, 2).sort((a, b) => a.priceMinor - b.priceMinor);
    expect(keys(result.items)).toEqual(keysOf(newestTwo));
  });

  it("close spellings are tried only when the words themselves find nothing", async () => {
    // PostgreSQL 15 manual §12.6.6 (Snowball english): "welding" stems to 'weld', "welder" stays
    // 'welder', so the words of "welding" match the 22 µH choke's description and not the stick
    // welder kit. pg_trgm (F.35): strict_word_similarity("welding", "welder") shares 4 of 11
    // trigrams, 0.36, over the 0.3 threshold, so a typo path that always ran would add the kit.
    const asWords = keys((await everything({ q: "welding" })).items);
    expect(asWords).toContain("choke-22");
    expect(asWords).not.toContain("stick-kit");
    // "weldin" matches no word, so the close spelling of the kit's title word finds it.
    expect(keys((await everything({ q: "weldin" })).items)).toContain("stick-kit");
    expect(sorted(keys((await everything({ q: "choek" })).items))).toEqual(["choke-22", "choke-40"]);
  });
});

describe("listCatalogSellers", () => {
  it("names the shops that have live listings, by name", async () => {
    expect(await catalog.listCatalogSellers()).toEqual([
      { slug: SHOPS.coils.slug, shopName: SHOPS.coils.shopName },
      { slug: SHOPS.boards.slug, shopName: SHOPS.boards.shopName },
    ]);
  });
});
