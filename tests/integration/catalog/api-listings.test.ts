// GET /api/listings: the route handler called as Next calls it, against a real database.
// Status codes follow RFC 9110 (422 Unprocessable Content for a well-formed request with invalid
// values) and the project's JSON error shape in lib/http/json.ts.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { freshDatabase } from "../../support/test-database";
import { insertCatalogFixtures, LIVE } from "./fixtures";

let database: Awaited<ReturnType<typeof freshDatabase>>;
let GET: (request: Request) => Promise<Response>;

beforeAll(async () => {
  database = await freshDatabase("catalog_api");
  await insertCatalogFixtures(database.url);
  process.env.DATABASE_URL = database.url;
  ({ GET } = await import("@/app/api/listings/route"));
});

afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
  await database.drop();
});

const get = async (query: string) => {
  const response = await GET(new Request(`http://localhost/api/listings${query}`));
  return { status: response.status, headers: response.headers, json: await response.json() };
};

describe("GET /api/listings", () => {
  it("answers { items, total, page, pageSize } with live listings, publicly cacheable for a few seconds", async () => {
    const { status, headers, json } = await get("");
    expect(status).toBe(200);
    expect(Object.keys(json).sort()).toEqual(["items", "page", "pageSize", "total", "totalCapped"]);
    expect(json).toMatchObject({ total: LIVE.length, page: 1, pageSize: 24 });
    expect(json.items).toHaveLength(Math.min(24, LIVE.length));
    // RFC 9111 §5.2.2: public + max-age lets browsers and shared caches reuse it briefly.
    expect(headers.get("cache-control")).toMatch(/^public, max-age=5\b/);
  });

  it("passes every filter through: a typo search for in-stock chokes under €50", async () => {
    const { status, json } = await get("?q=choek&kind=magnetic&subtype=choke&inStock=1&maxPrice=5000&sort=price-asc");
    expect(status).toBe(200);
    expect(json.items.map((i: { slug: string }) => i.slug)).toEqual(["choke-22"]);
    expect(json.total).toBe(1);
  });

  it("reads page 2", async () => {
    const { json } = await get("?page=2&sort=price-asc");
    expect(json.page).toBe(2);
    expect(json.items).toHaveLength(LIVE.length - 24);
  });

  it("treats empty parameters, as an empty form sends them, as absent", async () => {
    const { status, json } = await get("?q=&kind=&subtype=&mains=&minPrice=&maxPrice=&seller=&sort=&page=");
    expect(status).toBe(200);
    expect(json.total).toBe(LIVE.length);
  });

  it.each([
    ["kind=gadget", "kind"],
    ["subtype=inductor", "subtype"],
    ["kind=board&subtype=choke", "subtype"],
    ["mains=maybe", "mains"],
    ["minPrice=-1", "minPrice"],
    ["minPrice=12.50", "minPrice"],
    ["maxPrice=lots", "maxPrice"],
    ["minPrice=5000&maxPrice=1000", "maxPrice"],
    ["inStock=perhaps", "inStock"],
    ["seller=Not%20a%20handle!", "seller"],
    ["sort=cheapest", "sort"],
    ["page=0", "page"],
    ["page=1.5", "page"],
    ["page=abc", "page"],
    ["page=1001", "page"],
    [`q=${"x".repeat(201)}`, "q"],
  ])("?%s → 422 with an error on %s", async (query, field) => {
    const { status, json } = await get(`?${query}`);
    expect(status).toBe(422);
    expect(json.error).toBe("invalid_input");
    expect(Object.keys(json.fieldErrors)).toEqual([field]);
    expect(json.fieldErrors[field][0]).toEqual(expect.any(String));
  });

  it("reports every bad parameter at once", async () => {
    const { status, json } = await get("?kind=gadget&page=0&sort=cheapest");
    expect(status).toBe(422);
    expect(Object.keys(json.fieldErrors).sort()).toEqual(["kind", "page", "sort"]);
  });
});
