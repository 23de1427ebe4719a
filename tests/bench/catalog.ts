// Catalog search and filter under load: GET /api/listings with a mix of searches through
// autocannon, then the same searches through the app's own query function (searchListings, so
// the SQL is identical) straight against PostgreSQL with the same concurrency. Measured at
// 10,000 and again at 100,000 listings. Figures: app p95 / bare p95 (target ≤ 2) and the
// growth of p95 from 10k to 100k (target < 1.5×).
import { runAppSide } from "./support/app-side-client";
import type { CatalogBareResult } from "./support/app-side";
import { FULL_LISTINGS, LOAD, SMALL_LISTINGS } from "./support/config";
import type { BenchContext } from "./support/context";
import { log } from "./support/environment";
import { loadTest, okShare, settle, warnIfFailed, type LoadResult } from "./support/load";
import { ratio } from "./support/stats";

/** What people type and click: words, a typo, an exclusion, filters, sorts and a deep page. */
export const CATALOG_SEARCHES: Record<string, string>[] = [
  { q: "choke" },
  { q: "litz transformer" },
  { q: "half-bridge", kind: "kit" },
  { q: "choek" },
  { q: "induction -charger" },
  { q: "Orvik" },
  { q: "gate drive", sort: "price-asc" },
  { q: "40 kHz", kind: "magnetic" },
  { kind: "magnetic", subtype: "choke", sort: "price-asc" },
  { kind: "kit", minPrice: "10000", maxPrice: "40000", sort: "price-asc" },
  { mains: "yes", inStock: "1" },
  { sort: "price-desc", page: "5" },
  {},
  { kind: "board", page: "2" },
];

export const TARGETS = { appToBareP95: 2, growthP95: 1.5 };

export type CatalogAtSize = { listings: number; app: LoadResult & { okShare: number }; bare: CatalogBareResult; appToBareP95: number; warnings: string[] };
export type CatalogFigures = {
  searches: string[];
  load: typeof LOAD;
  at10k: CatalogAtSize;
  at100k: CatalogAtSize;
  growthP95: { app: number; bare: number };
  targets: typeof TARGETS;
  met: { appToBare10k: boolean; appToBare100k: boolean; growthApp: boolean };
};

const searchStrings = () => CATALOG_SEARCHES.map((s) => new URLSearchParams(s).toString());

async function measure(ctx: BenchContext, listings: number): Promise<CatalogAtSize> {
  await ctx.ensureListings(listings);
  await ctx.env.ensureApp();
  const searches = searchStrings();
  log(`catalog at ${listings.toLocaleString("en")} listings: GET /api/listings, ${LOAD.connections} connections, ${LOAD.durationS} s …`);
  const load = await loadTest({ baseUrl: ctx.env.baseUrl, paths: searches.map((s) => `/api/listings?${s}`) });
  const app = { ...load, okShare: okShare(load) };
  const warnings = [warnIfFailed(`GET /api/listings at ${listings} listings`, load)].filter((w): w is string => w !== null);
  // The app may still be finishing searches autocannon gave up on; they must not load the bare run.
  await settle(ctx.env.baseUrl);
  log(`catalog at ${listings.toLocaleString("en")} listings: searchListings() straight against PostgreSQL, ${LOAD.connections} at a time, ${LOAD.durationS} s …`);
  const bare = await runAppSide({ kind: "catalog-bare", searches, concurrency: LOAD.connections, durationS: LOAD.durationS, warmupS: LOAD.warmupS }, ctx.env.appEnv);
  if (bare.errors > 0) warnings.push(`searchListings() at ${listings} listings: ${bare.errors} calls failed (${bare.errorSample})`);
  const result = { listings, app, bare, appToBareP95: ratio(app.latencyMs.p95, bare.latencyMs.p95), warnings };
  printSize(result);
  return result;
}

function printSize(r: CatalogAtSize) {
  const n = r.listings.toLocaleString("en");
  console.log(`\n  catalog, ${n} listings            p50 ms   p95 ms   p99 ms    req/s`);
  const row = (label: string, l: { p50: number; p95: number; p99: number }, rps: number) =>
    console.log(`  ${label.padEnd(32)} ${l.p50.toFixed(1).padStart(7)}  ${l.p95.toFixed(1).padStart(7)}  ${l.p99.toFixed(1).padStart(7)}  ${rps.toFixed(0).padStart(7)}`);
  row("GET /api/listings (autocannon)", r.app.latencyMs, r.app.requestsPerSecond);
  if (r.app.okShare < 1) row("  of which 2xx answers", r.app.latencyOkMs, r.app.requestsPerSecond * r.app.okShare);
  row("searchListings() bare", r.bare.latencyMs, r.bare.requestsPerSecond);
  console.log(`  app p95 / bare p95: ${r.appToBareP95}× (target ≤ ${TARGETS.appToBareP95}); app answers 2xx: ${(r.app.okShare * 100).toFixed(1)} %`);
  for (const w of r.warnings) console.log(`  ! ${w}`);
  console.log(`  each search alone (median of 5, bare):`);
  for (const s of r.bare.perSearch) console.log(`    ${s.medianMs.toFixed(1).padStart(7)} ms  ${String(s.total).padStart(6)} found  ${s.search || "(no filter)"}`);
}

export async function runCatalogBench(ctx: BenchContext): Promise<CatalogFigures> {
  const at10k = await measure(ctx, SMALL_LISTINGS);
  const at100k = await measure(ctx, FULL_LISTINGS);
  const growthP95 = { app: ratio(at100k.app.latencyMs.p95, at10k.app.latencyMs.p95), bare: ratio(at100k.bare.latencyMs.p95, at10k.bare.latencyMs.p95) };
  console.log(`\n  p95 growth 10k → 100k listings: app ${growthP95.app}×, bare ${growthP95.bare}× (target < ${TARGETS.growthP95})\n`);
  return {
    searches: searchStrings(),
    load: LOAD,
    at10k,
    at100k,
    growthP95,
    targets: TARGETS,
    met: { appToBare10k: at10k.appToBareP95 <= TARGETS.appToBareP95, appToBare100k: at100k.appToBareP95 <= TARGETS.appToBareP95, growthApp: growthP95.app < TARGETS.growthP95 },
  };
}
