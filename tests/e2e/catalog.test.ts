// The catalog in Chromium: search as you type without a page load, filter, sort, and a URL that
// brings the same results back on reload; the listing page's fit section and derived figures.
import { randomBytes } from "node:crypto";
import { drizzle } from "drizzle-orm/node-postgres";
import { eq } from "drizzle-orm";
import pg from "pg";
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from "vitest";
import * as schema from "@/db/schema";
import type { ListingKind, MagneticSubtype } from "@/db/schema/listings";
import { openBrowser, screenshot, type Session } from "./support/browser";

const TAG = randomBytes(3).toString("hex");
const slug = (key: string) => `${key}-${TAG}`;

type Row = {
  key: string;
  title: string;
  kind: ListingKind;
  subtype?: MagneticSubtype;
  priceMinor: number;
  stock: number;
  mains: boolean;
  seller: "demo-seller-magnetics" | "demo-seller-kits";
  photo: string;
  inductanceH?: number;
  ratedCurrentA?: number;
  figures?: Record<string, unknown>;
  requirement?: { subtype: MagneticSubtype; label: string; minInductanceH: number; atCurrentA: number };
  state?: "live" | "held";
};

// L = AL·N² = 100 nH × 15² = 22.5 µH; at 120 A on 3 cm² the peak flux is B = L·I/(N·Ae) = 0.6 T
// (both from McLyman, Transformer and Inductor Design Handbook, ch. 8).
const chokeFigures = {
  coreMaterial: "iron-powder",
  coreAreaM2: 3e-4,
  pathLengthM: 0.1,
  gapM: 0,
  alNh: 100,
  meanTurnLengthM: 0.08,
  windings: [{ name: "main", role: "winding", turns: 15, material: "copper", areaM2: 2e-5, strands: 1, currentA: 120 }],
  ratedCurrentA: 120,
  switchingFrequencyHz: 40_000,
};

const ROWS: Row[] = [
  { key: "weld-choke", title: "Welder output choke 22 µH, 120 A", kind: "magnetic", subtype: "choke", priceMinor: 4800, stock: 3, mains: false, seller: "demo-seller-magnetics", photo: "/demo/choke-output.webp", inductanceH: 22.5e-6, ratedCurrentA: 120, figures: chokeFigures },
  { key: "main-xfmr", title: "Main ferrite transformer for a half bridge", kind: "magnetic", subtype: "transformer", priceMinor: 9500, stock: 1, mains: true, seller: "demo-seller-magnetics", photo: "/demo/transformer-main.webp" },
  { key: "sense-ct", title: "Current-sense transformer 1:100", kind: "magnetic", subtype: "current-transformer", priceMinor: 1200, stock: 12, mains: false, seller: "demo-seller-magnetics", photo: "/demo/ct-current-sense.webp" },
  { key: "gate-board", title: "Half-bridge gate drive board", kind: "board", priceMinor: 3500, stock: 10, mains: true, seller: "demo-seller-kits", photo: "/demo/board-gate-drive.webp" },
  { key: "bench-board", title: "Bench supply control board", kind: "board", priceMinor: 2900, stock: 0, mains: true, seller: "demo-seller-kits", photo: "/demo/board-bench-supply.webp" },
  { key: "stick-kit", title: "Stick welder inverter kit 160 A", kind: "kit", priceMinor: 24900, stock: 2, mains: true, seller: "demo-seller-kits", photo: "/demo/kit-stick-welder.webp", requirement: { subtype: "choke", label: "Output choke", minInductanceH: 18e-6, atCurrentA: 110 } },
  { key: "heater-kit", title: "Induction heater kit 1 kW", kind: "kit", priceMinor: 18900, stock: 4, mains: true, seller: "demo-seller-kits", photo: "/demo/kit-induction-heater.webp", requirement: { subtype: "choke", label: "Tank choke", minInductanceH: 30e-6, atCurrentA: 50 } },
  { key: "spare-kit", title: "Spare parts kit for inverter builds", kind: "kit", priceMinor: 5900, stock: 9, mains: false, seller: "demo-seller-kits", photo: "/demo/kit-stick-welder.webp" },
  // Enough boards that the catalog has a second page whatever the demo seed holds.
  ...Array.from({ length: 16 }, (_, i): Row => ({ key: `filler-${i + 1}`, title: `Breakout board number ${i + 1}`, kind: "board", priceMinor: 700 + i * 10, stock: 1, mains: false, seller: "demo-seller-kits", photo: "/demo/board-gate-drive.webp" })),
  // Held: must never show, though it is cheap and its title matches.
  { key: "held-choke", title: "Held output choke 30 µH", kind: "magnetic", subtype: "choke", priceMinor: 100, stock: 5, mains: false, seller: "demo-seller-magnetics", photo: "/demo/choke-output.webp", inductanceH: 30e-6, ratedCurrentA: 150, state: "held" },
];

let pool: pg.Pool;

beforeAll(async () => {
  const url = process.env.E2E_DATABASE_URL;
  if (!url) throw new Error("E2E_DATABASE_URL is not set: run through `npm test -- --e2e-only`");
  pool = new pg.Pool({ connectionString: url, max: 2 });
  const db = drizzle(pool, { schema });
  for (const [userId, shopName] of [
    ["demo-seller-magnetics", "Larkspur Coil Room"],
    ["demo-seller-kits", "Yard Kitworks"],
  ] as const) {
    const shopSlug = shopName.toLowerCase().replace(/\s+/g, "-");
    await db
      .insert(schema.sellerProfiles)
      .values({ userId, shopName, slug: shopSlug, profileMd: "An invented shop.", country: "NL", returnsPolicyMd: "Unused parts within 30 days.", payoutAccountId: `acct_e2e_catalog_${shopSlug}` })
      .onConflictDoNothing();
  }
  for (const [i, row] of ROWS.entries()) {
    const [listing] = await db
      .insert(schema.listings)
      .values({
        sellerId: row.seller,
        kind: row.kind,
        magneticSubtype: row.subtype ?? null,
        title: row.title,
        slug: slug(row.key),
        descriptionMd: `An invented listing for the catalog's browser test.`,
        priceMinor: row.priceMinor,
        stock: row.stock,
        figures: row.figures ?? {},
        declaration: row.mains
          ? { mainsConnected: true, mainsVrms: 230, mainsTolerance: 0.1, busCapacitanceF: 940e-6, bleederOhm: 47_000, liveHeatsinks: false, weldingSource: false }
          : { mainsConnected: false, liveHeatsinks: false, weldingSource: false },
        state: row.state ?? "live",
        inductanceH: row.inductanceH ?? null,
        ratedCurrentA: row.ratedCurrentA ?? null,
        liveAt: new Date(Date.now() - (i + 1) * 3_600_000),
      })
      .returning({ id: schema.listings.id });
    const key = `e2e-catalog-${TAG}-${row.key}`;
    await db.insert(schema.uploads).values({ key, ownerId: row.seller, purpose: "listing-photo", originalName: `${row.key}.webp`, contentType: "image/webp", bytes: 1000, url: row.photo, thumbUrl: row.photo.replace(".webp", "-thumb.webp"), width: 1200, height: 900 });
    await db.insert(schema.listingPhotos).values({ listingId: listing!.id, uploadKey: key, position: 0, alt: row.title });
    if (row.requirement) await db.insert(schema.listingRequirements).values({ listingId: listing!.id, ...row.requirement });
  }
});

afterAll(async () => {
  const db = drizzle(pool, { schema });
  for (const row of ROWS) await db.delete(schema.listings).where(eq(schema.listings.slug, slug(row.key)));
  await pool.end();
});

describe("the catalog in Chromium", () => {
  let s: Session;
  beforeEach(async () => {
    s = await openBrowser();
  });
  afterEach(async () => {
    await s.close();
  });

  const cardSlugs = () => s.page.locator('[data-testid^="listing-card-"]').evaluateAll((els) => els.map((e) => e.getAttribute("data-testid")!.replace("listing-card-", "")));
  const cardPrices = () =>
    s.page.locator('[data-testid="catalog-results"] [data-price-minor]').evaluateAll((els) => els.map((e) => Number(e.getAttribute("data-price-minor"))));
  const apiCalls: string[] = [];

  it("results follow the search box as a person types, without loading a new page", async () => {
    const { page } = s;
    page.on("request", (r) => {
      if (r.url().includes("/api/listings")) apiCalls.push(r.url());
    });
    await page.goto("/catalog");
    // The first page comes from the server: results are there before any API call.
    expect(await cardSlugs()).toEqual(expect.arrayContaining([slug("weld-choke"), slug("gate-board"), slug("stick-kit")]));
    expect(await cardSlugs()).not.toContain(slug("held-choke"));
    expect(apiCalls).toEqual([]);
    await screenshot(page, "catalog-first-page");

    // Markers that a full page load would wipe, and a watch for the loading skeleton.
    await page.evaluate(() => {
      const w = window as unknown as { __catalogMarker: string; __sawSkeleton: string[] };
      w.__catalogMarker = "still here";
      w.__sawSkeleton = [];
      new MutationObserver((mutations) => {
        for (const m of mutations)
          for (const node of m.addedNodes) {
            if (!(node instanceof HTMLElement) || !node.textContent?.includes("Loading the catalog")) continue;
            if (node.getClientRects().length > 0) w.__sawSkeleton.push(node.outerHTML.slice(0, 200));
          }
      }).observe(document.body, { childList: true, subtree: true });
    });

    const box = page.getByLabel("Search the catalog");
    await box.click();
    // A typo on purpose: the trigram match still finds the choke.
    await box.pressSequentially("choek", { delay: 40 });
    await expect.poll(cardSlugs).toContain(slug("weld-choke"));
    await expect.poll(cardSlugs).not.toContain(slug("gate-board"));
    await expect.poll(() => page.getByTestId("catalog-count").textContent()).toMatch(/listings? for “choek”/);
    await expect.poll(() => new URL(page.url()).searchParams.get("q")).toBe("choek");

    expect(await page.evaluate(() => (window as unknown as { __catalogMarker?: string }).__catalogMarker)).toBe("still here");
    // loading.tsx is for arriving at the page, never shown over results being refined.
    expect(await page.evaluate(() => (window as unknown as { __sawSkeleton?: string[] }).__sawSkeleton)).toEqual([]);
    // Still typing in the same box: no remount took the focus away.
    expect(await box.evaluate((el) => el === document.activeElement)).toBe(true);
    // Five keys inside one pause make one request, not five.
    const searches = apiCalls.filter((u) => u.includes("q="));
    expect(searches.length).toBeGreaterThanOrEqual(1);
    expect(searches.length).toBeLessThan(5);
    await screenshot(page, "catalog-typed-typo");

    // Into a listing and back: the search is still there, in the box and in the results.
    await page.getByTestId(`listing-card-${slug("weld-choke")}`).click();
    await page.getByTestId("listing-page").waitFor();
    await page.goBack();
    await expect.poll(() => box.inputValue()).toBe("choek");
    await expect.poll(cardSlugs).toContain(slug("weld-choke"));
    await expect.poll(cardSlugs).not.toContain(slug("gate-board"));

    // The header's link to the catalog starts afresh.
    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Catalog" }).click();
    await expect.poll(() => new URL(page.url()).search).toBe("");
    await expect.poll(() => box.inputValue()).toBe("");
    await expect.poll(cardSlugs).toContain(slug("gate-board"));

    // Typing with pauses: every pause replaces the URL and the page renders again on the
    // server, and none of those renders may take the words back out of the box.
    await box.click();
    await box.pressSequentially("choke", { delay: 320 });
    await expect.poll(() => new URL(page.url()).searchParams.get("q")).toBe("choke");
    await expect.poll(cardSlugs).toContain(slug("weld-choke"));
    expect(await box.inputValue()).toBe("choke");
  });

  it("pages through the catalog with its page links, without a page load", async () => {
    const { page } = s;
    await page.goto("/catalog?sort=price-asc");
    await page.evaluate(() => ((window as unknown as { __catalogMarker: string }).__catalogMarker = "still here"));
    const first = await cardSlugs();
    expect(first).toHaveLength(24);
    await page.getByRole("navigation", { name: "Pages" }).getByRole("link", { name: "Next page" }).click();
    await expect.poll(() => new URL(page.url()).searchParams.get("page")).toBe("2");
    await expect.poll(async () => (await cardSlugs())[0]).not.toBe(first[0]);
    const second = await cardSlugs();
    expect(second.filter((x) => first.includes(x))).toEqual([]);
    expect(await page.getByTestId("catalog-count").textContent()).toMatch(/page 2 of \d+/);
    expect(await page.evaluate(() => (window as unknown as { __catalogMarker?: string }).__catalogMarker)).toBe("still here");
    await screenshot(page, "catalog-page-2");
  });

  it("filters by kind and sorts by price, and the URL brings the same results back on reload", async () => {
    const { page } = s;
    await page.goto("/catalog");
    await page.evaluate(() => ((window as unknown as { __catalogMarker: string }).__catalogMarker = "still here"));
    await page.getByLabel("Kind").selectOption("kit");
    await expect.poll(() => new URL(page.url()).searchParams.get("kind")).toBe("kit");
    await expect.poll(cardSlugs).not.toContain(slug("gate-board"));
    const kitBadges = await page.locator('[data-testid="catalog-results"] li').evaluateAll((els) => els.map((e) => e.querySelector("[data-tone]")?.textContent));
    expect(kitBadges.length).toBeGreaterThanOrEqual(3);
    expect(new Set(kitBadges)).toEqual(new Set(["Kit"]));

    await page.getByLabel("Sort by").selectOption("price-asc");
    await expect.poll(() => new URL(page.url()).searchParams.get("sort")).toBe("price-asc");
    await expect.poll(async () => {
      const prices = await cardPrices();
      return prices.every((p, i) => i === 0 || (prices[i - 1] ?? 0) <= p);
    }).toBe(true);
    const ours = (await cardSlugs()).filter((x) => x.endsWith(TAG));
    expect(ours).toEqual([slug("spare-kit"), slug("heater-kit"), slug("stick-kit")]);
    expect(await page.evaluate(() => (window as unknown as { __catalogMarker?: string }).__catalogMarker)).toBe("still here");
    await screenshot(page, "catalog-kits-by-price");

    const before = await cardSlugs();
    const address = page.url();
    await page.reload();
    expect(page.url()).toBe(address);
    expect(await page.evaluate(() => (window as unknown as { __catalogMarker?: string }).__catalogMarker)).toBeUndefined();
    expect(await cardSlugs()).toEqual(before);
    expect(await page.getByLabel("Kind").inputValue()).toBe("kit");
    expect(await page.getByLabel("Sort by").inputValue()).toBe("price-asc");

    // More filters: mains-connected kits in stock.
    await page.getByLabel("Mains connection").selectOption("no");
    await expect.poll(() => new URL(page.url()).searchParams.get("mains")).toBe("no");
    await expect.poll(async () => (await cardSlugs()).filter((x) => x.endsWith(TAG))).toEqual([slug("spare-kit")]);
    await page.getByLabel("Lowest price").fill("60");
    await expect.poll(() => new URL(page.url()).searchParams.get("minPrice")).toBe("6000");
    await page.getByText("Nothing matches").waitFor();
    await screenshot(page, "catalog-nothing-matches");
    await page.getByRole("button", { name: "Clear filters" }).first().click();
    await expect.poll(() => new URL(page.url()).search).toBe("?sort=price-asc");
    expect(await page.getByLabel("Lowest price").inputValue()).toBe("");
  });

  it("a bad address is not an error page: the valid part is kept and the rest named", async () => {
    const { page } = s;
    const response = await page.goto("/catalog?kind=kit&sort=cheapest");
    expect(response?.status()).toBe(200);
    await page.getByText("Part of this address was not understood").waitFor();
    expect(await page.getByLabel("Kind").inputValue()).toBe("kit");
    const api = await page.request.get("/api/listings?sort=cheapest");
    expect(api.status()).toBe(422);
    // The production server keeps the route's own caching header (RFC 9111 §5.2.2).
    const ok = await page.request.get("/api/listings?kind=kit");
    expect(ok.status()).toBe(200);
    expect(ok.headers()["cache-control"]).toMatch(/^public, max-age=5\b/);
    expect((await api.json()).fieldErrors.sort).toEqual(expect.any(Array));
  });

  it("a magnetic's page lists the kits it fits and its derived figures; a kit's page the magnetics that fit it", async () => {
    const { page } = s;
    await page.goto(`/listings/${slug("weld-choke")}`);
    const fits = page.getByTestId("kits-this-part-fits");
    await fits.waitFor();
    expect(await fits.textContent()).toContain("Stick welder inverter kit 160 A");
    // 22.5 µH does not reach the heater kit's 30 µH.
    expect(await fits.textContent()).not.toContain("Induction heater kit");
    const derived = page.getByTestId("derived-figures");
    expect(await derived.textContent()).toContain("22.5 µH");
    expect(await derived.textContent()).toContain("600 mT");
    await screenshot(page, "listing-magnetic-fits");

    await page.goto(`/listings/${slug("stick-kit")}`);
    const magnetics = page.getByTestId("magnetics-that-fit");
    await magnetics.waitFor();
    expect(await magnetics.textContent()).toContain("Welder output choke 22 µH, 120 A");
    expect(await magnetics.textContent()).not.toContain("Held output choke");
    await screenshot(page, "listing-kit-fits");
  });
});
