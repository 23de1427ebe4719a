// Listing-page server rendering: requests per second of GET /listings/[slug] (full HTML, a mix
// of kits, magnetics and boards) against a trivial route of the same app (/api/health, one
// `select 1`) in the same run, with the same connections. The trivial route is measured before
// and after the pages and averaged, so a drift in the machine's speed does not tilt the ratio.
// Target: listing rps / trivial rps ≥ 0.5.
import { FULL_LISTINGS, LOAD } from "./support/config";
import type { BenchContext } from "./support/context";
import { log } from "./support/environment";
import { loadTest, warnIfFailed, type LoadResult } from "./support/load";
import { round, summarise } from "./support/stats";

export const TARGET_RATIO = 0.5;
const PER_KIND = 4;

export type RenderFigures = {
  load: typeof LOAD;
  listings: number;
  slugs: string[];
  trivialBefore: LoadResult;
  listingPages: LoadResult;
  trivialAfter: LoadResult;
  /** diagnostic: the pages without magnetics (see perPage for why) */
  boardsAndKits: LoadResult & { ratio: number };
  /** diagnostic: the home page, the cost of any full page of this layout */
  homePage: LoadResult & { ratio: number };
  trivialRequestsPerSecond: number;
  ratio: number;
  target: number;
  met: boolean;
  htmlBytes: { min: number; max: number };
  /** each page alone, median of three sequential requests */
  perPage: { path: string; medianMs: number; htmlBytes: number }[];
  warnings: string[];
};

/** Live listings of each kind, first by id, so every run renders the same pages. */
async function pickSlugs(ctx: BenchContext): Promise<{ slug: string; kind: string }[]> {
  const { rows } = await ctx.env.pool.query<{ slug: string; kind: string }>(
    `select slug, kind from (
       select slug, kind, magnetic_subtype, row_number() over (partition by kind, magnetic_subtype order by id) as n
       from listings where state = 'live' and seller_id like 'bench-%'
     ) ranked where n <= $1 order by kind, magnetic_subtype, n`,
    [PER_KIND],
  );
  return rows;
}

export async function runRenderBench(ctx: BenchContext): Promise<RenderFigures> {
  await ctx.ensureListings(FULL_LISTINGS);
  await ctx.env.ensureApp();
  const picked = await pickSlugs(ctx);
  const slugs = picked.map((p) => p.slug);
  const paths = slugs.map((s) => `/listings/${s}`);
  const nonMagneticPaths = picked.filter((p) => p.kind !== "magnetic").map((p) => `/listings/${p.slug}`);
  // Each page alone first (which also warms it): how long and how big, so a slow one can be named.
  const perPage: RenderFigures["perPage"] = [];
  for (const p of paths) {
    const times: number[] = [];
    let bytes = 0;
    for (let k = 0; k < 3; k++) {
      const started = performance.now();
      const res = await fetch(`${ctx.env.baseUrl}${p}`);
      if (!res.ok) throw new Error(`${p} answered ${res.status}`);
      bytes = (await res.text()).length;
      times.push(performance.now() - started);
    }
    perPage.push({ path: p, medianMs: summarise(times).p50, htmlBytes: bytes });
  }
  const sizes = perPage.map((p) => p.htmlBytes);
  log(`listing pages against /api/health, ${LOAD.connections} connections, ${LOAD.durationS} s each …`);
  const trivialBefore = await loadTest({ baseUrl: ctx.env.baseUrl, paths: ["/api/health"] });
  const listingPages = await loadTest({ baseUrl: ctx.env.baseUrl, paths });
  const trivialAfter = await loadTest({ baseUrl: ctx.env.baseUrl, paths: ["/api/health"] });
  // Diagnostics, not the figure: the same without magnetics, whose pages list every kit they fit;
  // and the home page, a full page of the same layout with one small query, as the floor of any page.
  const boardsAndKits = await loadTest({ baseUrl: ctx.env.baseUrl, paths: nonMagneticPaths });
  const homePage = await loadTest({ baseUrl: ctx.env.baseUrl, paths: ["/"] });
  const warnings = ([["/api/health before", trivialBefore], ["listing pages", listingPages], ["/api/health after", trivialAfter], ["boards and kits", boardsAndKits], ["home page", homePage]] as const)
    .map(([label, r]) => warnIfFailed(label, r))
    .filter((w): w is string => w !== null);
  // A trivial run that got no answers (the app still busy) says nothing about the trivial route.
  const trivialRuns = [trivialBefore, trivialAfter].filter((t) => t.requests > 0);
  const trivialRequestsPerSecond = round(trivialRuns.reduce((s, t) => s + t.requestsPerSecond, 0) / Math.max(1, trivialRuns.length), 1);
  // Three digits: a ratio far below the target is still a figure, not 0.
  const r = round(listingPages.requestsPerSecond / trivialRequestsPerSecond, 3);
  const boardsAndKitsRatio = round(boardsAndKits.requestsPerSecond / trivialRequestsPerSecond, 3);
  const homeRatio = round(homePage.requestsPerSecond / trivialRequestsPerSecond, 3);
  console.log(`\n  listing page rendering, ${FULL_LISTINGS.toLocaleString("en")} listings    req/s   p50 ms   p95 ms`);
  const row = (label: string, x: LoadResult) =>
    console.log(`  ${label.padEnd(40)} ${x.requestsPerSecond.toFixed(0).padStart(6)}  ${x.latencyMs.p50.toFixed(1).padStart(7)}  ${x.latencyMs.p95.toFixed(1).padStart(7)}`);
  row("/api/health (before)", trivialBefore);
  row(`/listings/[slug] (${slugs.length} pages)`, listingPages);
  row("/api/health (after)", trivialAfter);
  row(`boards and kits only (${nonMagneticPaths.length} pages)`, boardsAndKits);
  row("the home page", homePage);
  console.log(`  listing rps / trivial rps: ${r} (target ≥ ${TARGET_RATIO}); boards and kits only: ${boardsAndKitsRatio}; the home page: ${homeRatio}`);
  console.log(`  each page alone (median of 3):`);
  for (const p of perPage) console.log(`    ${p.medianMs.toFixed(0).padStart(6)} ms ${(p.htmlBytes / 1000).toFixed(0).padStart(7)} kB  ${p.path}`);
  console.log("");
  return {
    load: LOAD,
    listings: FULL_LISTINGS,
    slugs,
    trivialBefore,
    listingPages,
    trivialAfter,
    boardsAndKits: { ...boardsAndKits, ratio: boardsAndKitsRatio },
    homePage: { ...homePage, ratio: homeRatio },
    trivialRequestsPerSecond,
    ratio: r,
    target: TARGET_RATIO,
    met: r >= TARGET_RATIO,
    htmlBytes: { min: Math.min(...sizes), max: Math.max(...sizes) },
    perPage,
    warnings,
  };
}
