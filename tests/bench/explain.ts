// EXPLAIN ANALYZE of the most frequent reads on the 100,000-listing database. The SQL is what the
// app's own query functions send (captured in app-side.ts from pg's Client#query), run again here
// under EXPLAIN (ANALYZE, BUFFERS) with the same parameters and, for a text search, the same
// SET LOCAL of the trigram threshold. Each plan is checked for index use: no sequential scan of a
// large table (a sequential scan reading more than a tenth of it). When PROPOSED_INDEXES names
// indexes not migrated yet, they are created in the benchmark database only, the plans run again
// (before/after), the query rewrites in REWRITES are measured beside them, and the indexes are
// dropped again so the other benchmarks measure the schema as migrated — unless `--keep-indexes`.
//
// Why these: a visitor's catalog search and catalog filter/sort (every catalog view and every
// keystroke of search-as-you-type), the listing page (by slug, plus the two "what fits" reads it
// always runs), a member's order list, and the Q&A list of a listing — it runs on every listing
// page view, far more often than the moderation queue, which a handful of staff open.
import type pg from "pg";
import { runAppSide } from "./support/app-side-client";
import type { CaptureCall, CapturedStatement } from "./support/app-side";
import { FULL_LISTINGS } from "./support/config";
import type { BenchContext } from "./support/context";
import { log } from "./support/environment";
import { round } from "./support/stats";

/**
 * Indexes the plans below call for, tried here before a migration adds them. Empty while every
 * proposal so far is migrated (drizzle/0008_catalog_indexes.sql); an entry names an index that
 * does not exist yet — one that exists already is left alone, never created or dropped here.
 */
export const PROPOSED_INDEXES: { name: string; sql: string; why: string }[] = [];

type Params = Awaited<ReturnType<typeof pickParameters>>;

/**
 * Rewritten SQL measured beside what the app sends, with the proposed indexes. Empty while the
 * app's query functions carry every rewrite so far (db/queries/catalog.ts: text search over the
 * newest 1,000 matches with a capped count, typo match only when the words find nothing, the
 * cheapest twelve per requirement through LATERAL, kits walked in title order).
 */
export const REWRITES: { label: string; instead: string; index?: { name: string; sql: string }; statements: (p: Params) => CapturedStatement[] }[] = [];

const CATALOG_TERM = "litz transformer";
const LARGE_TABLE_ROWS = 10_000;

type PlanNode = {
  "Node Type": string;
  "Relation Name"?: string;
  "Index Name"?: string;
  "Actual Total Time"?: number;
  "Actual Rows"?: number;
  "Actual Loops"?: number;
  "Rows Removed by Filter"?: number;
  "Index Cond"?: string;
  Filter?: string;
  "Sort Key"?: string[];
  "Shared Hit Blocks"?: number;
  "Shared Read Blocks"?: number;
  Plans?: PlanNode[];
};
type Explained = { statement: string; executionMs: number; planningMs: number; indexes: string[]; seqScans: string[]; usesIndex: boolean; plan: string[] };
type GroupResult = { label: string; statements: Explained[]; executionMs: number; usesIndex: boolean };

function* walk(node: PlanNode): Generator<PlanNode> {
  yield node;
  for (const child of node.Plans ?? []) yield* walk(child);
}

function renderPlan(node: PlanNode, depth = 0, out: string[] = []): string[] {
  const on = node["Relation Name"] ? ` on ${node["Relation Name"]}` : "";
  const using = node["Index Name"] ? ` using ${node["Index Name"]}` : "";
  const rows = node["Actual Rows"] !== undefined ? ` rows=${node["Actual Rows"]}${(node["Actual Loops"] ?? 1) > 1 ? `×${node["Actual Loops"]}` : ""}` : "";
  const time = node["Actual Total Time"] !== undefined ? ` ${round(node["Actual Total Time"], 2)} ms` : "";
  const removed = node["Rows Removed by Filter"] ? ` removed by filter=${node["Rows Removed by Filter"]}` : "";
  out.push(`${"  ".repeat(depth)}-> ${node["Node Type"]}${using}${on}${rows}${time}${removed}`);
  if (node["Index Cond"]) out.push(`${"  ".repeat(depth)}     index cond: ${node["Index Cond"].slice(0, 160)}`);
  if (node.Filter) out.push(`${"  ".repeat(depth)}     filter: ${node.Filter.slice(0, 160)}`);
  if (node["Sort Key"]) out.push(`${"  ".repeat(depth)}     sort: ${node["Sort Key"].join(", ").slice(0, 160)}`);
  for (const child of node.Plans ?? []) renderPlan(child, depth + 1, out);
  return out;
}

const isControl = (text: string) => /^\s*(begin|commit|rollback|start transaction)\b/i.test(text);
const isSetting = (text: string) => /^\s*select set_config\(/i.test(text);

/** Tables above LARGE_TABLE_ROWS, with their estimated row counts. */
async function largeTables(pool: pg.Pool): Promise<Map<string, number>> {
  const { rows } = await pool.query<{ relname: string; reltuples: number }>(
    "select relname, reltuples::float8 as reltuples from pg_class where relkind = 'r' and relnamespace = 'public'::regnamespace and reltuples > $1",
    [LARGE_TABLE_ROWS],
  );
  return new Map(rows.map((r) => [r.relname, r.reltuples]));
}

// A sequential scan that a LIMIT stops early (a capped count) reads a sliver of the table; one
// that reads more than this share of it is what an index should have spared.
const FULL_SCAN_SHARE = 0.1;

async function explainGroup(pool: pg.Pool, label: string, statements: CapturedStatement[], large: Map<string, number>): Promise<GroupResult> {
  const client = await pool.connect();
  const out: Explained[] = [];
  try {
    await client.query("begin read only");
    for (const s of statements) {
      if (isControl(s.text)) continue;
      if (isSetting(s.text)) {
        await client.query(s.text, s.values);
        continue;
      }
      // once to warm the cache, so before and after compare plans, not cold reads
      await client.query(`explain (analyze) ${s.text}`, s.values);
      const { rows } = await client.query<{ "QUERY PLAN": [{ Plan: PlanNode; "Execution Time": number; "Planning Time": number }] }>(
        `explain (analyze, buffers, format json) ${s.text}`,
        s.values,
      );
      const result = rows[0]!["QUERY PLAN"][0];
      const nodes = [...walk(result.Plan)];
      const indexes = [...new Set(nodes.filter((n) => n["Index Name"]).map((n) => `${n["Index Name"]} (${n["Node Type"]})`))];
      const scanned = (n: PlanNode) => ((n["Actual Rows"] ?? 0) + (n["Rows Removed by Filter"] ?? 0)) * (n["Actual Loops"] ?? 1);
      const seqScans = nodes
        .filter((n) => n["Node Type"] === "Seq Scan" && scanned(n) > FULL_SCAN_SHARE * (large.get(n["Relation Name"] ?? "") ?? Infinity))
        .map((n) => `Seq Scan on ${n["Relation Name"]} (${n["Actual Rows"]} rows kept, ${n["Rows Removed by Filter"] ?? 0} removed)`);
      const touchesLarge = nodes.some((n) => large.has(n["Relation Name"] ?? ""));
      const boundedOnly = nodes.some((n) => n["Node Type"] === "Limit") && nodes.every((n) => n["Node Type"] !== "Seq Scan" || scanned(n) <= FULL_SCAN_SHARE * (large.get(n["Relation Name"] ?? "") ?? Infinity));
      out.push({
        statement: s.text.replace(/\s+/g, " ").slice(0, 240),
        executionMs: round(result["Execution Time"], 2),
        planningMs: round(result["Planning Time"], 2),
        indexes,
        seqScans,
        // Index use, or a sequential scan that a LIMIT stops within FULL_SCAN_SHARE of the table.
        usesIndex: seqScans.length === 0 && (indexes.length > 0 || !touchesLarge || boundedOnly),
        plan: renderPlan(result.Plan),
      });
    }
  } finally {
    await client.query("rollback").catch(() => {});
    client.release();
  }
  return { label, statements: out, executionMs: round(out.reduce((s, x) => s + x.executionMs, 0), 2), usesIndex: out.every((x) => x.usesIndex) };
}

async function pickParameters(pool: pg.Pool) {
  const pick = async (text: string) => {
    const { rows } = await pool.query<{ v: string }>(text);
    if (!rows[0]) throw new Error(`no row for: ${text}`);
    return rows[0].v;
  };
  return {
    // the worst cases a page meets: the busiest buyer, the most-asked-about listing
    buyerId: await pick("select buyer_id as v from orders group by buyer_id order by count(*) desc, buyer_id limit 1"),
    askedListingId: await pick("select listing_id::text as v from questions where state = 'visible' and listing_id is not null group by listing_id order by count(*) desc, listing_id limit 1"),
    kitSlug: await pick("select slug as v from listings l where kind = 'kit' and state = 'live' and exists (select 1 from listing_requirements r where r.listing_id = l.id) order by id limit 1"),
    kitId: await pick("select id::text as v from listings l where kind = 'kit' and state = 'live' and exists (select 1 from listing_requirements r where r.listing_id = l.id) order by id limit 1"),
    chokeId: await pick("select id::text as v from listings where kind = 'magnetic' and magnetic_subtype = 'choke' and state = 'live' and seller_id like 'bench-%' order by id limit 1"),
  };
}

export function explainCalls(p: Params): { label: string; call: CaptureCall }[] {
  return [
    { label: "1 catalog search (text, relevance)", call: { fn: "searchListings", search: new URLSearchParams({ q: CATALOG_TERM }).toString() } },
    { label: "2a catalog filter and sort (choke, price cap, in stock, cheapest first)", call: { fn: "searchListings", search: "kind=magnetic&subtype=choke&maxPrice=5000&inStock=1&sort=price-asc" } },
    { label: "2b catalog, no filter (newest first, page 1)", call: { fn: "searchListings", search: "" } },
    { label: "3a listing by slug", call: { fn: "getPublicListing", slug: p.kitSlug } },
    { label: "3b listing page of a kit: magnetics that fit it", call: { fn: "magneticsFittingKit", listingId: p.kitId } },
    { label: "3c listing page of a choke: kits it fits", call: { fn: "kitsFittedByMagnetic", listingId: p.chokeId } },
    { label: "4 a member's orders", call: { fn: "listBuyerOrders", buyerId: p.buyerId } },
    { label: "5 Q&A list of a listing", call: { fn: "questionsForListing", listingId: p.askedListingId } },
  ];
}

function printGroup(g: GroupResult, verbose: boolean) {
  console.log(`\n  ${g.label}: ${g.executionMs} ms, index use ${g.usesIndex ? "✓" : "✗"}`);
  for (const s of g.statements) {
    console.log(`    ${s.usesIndex ? "✓" : "✗"} ${s.executionMs} ms  ${s.statement.slice(0, 110)}…`);
    if (s.indexes.length) console.log(`        indexes: ${s.indexes.join(", ")}`);
    for (const seq of s.seqScans) console.log(`        ${seq}`);
    if (verbose) for (const line of s.plan) console.log(`        ${line}`);
  }
}

export type ExplainFigures = {
  listings: number;
  parameters: Awaited<ReturnType<typeof pickParameters>>;
  before: GroupResult[];
  proposed: typeof PROPOSED_INDEXES;
  after: GroupResult[] | null;
  rewrites: { label: string; instead: string; index: string | null; result: GroupResult; afterIndexesMs: number | null }[];
  allUseIndexes: { before: boolean; after: boolean | null };
};

export async function runExplainBench(ctx: BenchContext): Promise<ExplainFigures> {
  await ctx.ensureListings(FULL_LISTINGS);
  const pool = ctx.env.pool;
  const parameters = await pickParameters(pool);
  const calls = explainCalls(parameters);
  log("capturing the SQL the app's query functions send …");
  const captured = await runAppSide({ kind: "capture", calls }, ctx.env.appEnv);
  const large = await largeTables(pool);
  const explainAll = async () => {
    const groups: GroupResult[] = [];
    for (const c of captured) groups.push(await explainGroup(pool, c.label, c.statements, large));
    return groups;
  };
  log("EXPLAIN ANALYZE with the migrated schema …");
  const before = await explainAll();
  console.log(`\n  EXPLAIN (ANALYZE, BUFFERS) on ${FULL_LISTINGS.toLocaleString("en")} listings — schema as migrated`);
  for (const g of before) printGroup(g, true);

  let after: GroupResult[] | null = null;
  const rewrites: ExplainFigures["rewrites"] = [];
  const existing = new Set((await pool.query<{ name: string }>("select indexname as name from pg_indexes where schemaname = 'public'")).rows.map((r) => r.name));
  const proposed = PROPOSED_INDEXES.filter((index) => !existing.has(index.name));
  for (const index of PROPOSED_INDEXES) if (existing.has(index.name)) log(`proposed index ${index.name} exists already (migrated?); left alone`);
  if (proposed.length > 0) {
    log(`creating ${proposed.length} proposed indexes in the benchmark database …`);
    try {
      for (const index of proposed) await pool.query(index.sql);
      await pool.query("analyze");
      after = await explainAll();
      console.log(`\n  the same with the proposed indexes`);
      for (const g of after) printGroup(g, true);
      console.log(`\n  before → after (ms)`);
      for (const [k, g] of before.entries()) console.log(`    ${String(g.executionMs).padStart(9)} → ${String(after[k]?.executionMs ?? "?").padStart(9)}  ${g.usesIndex ? "✓" : "✗"}→${after[k]?.usesIndex ? "✓" : "✗"}  ${g.label}`);

      log("query rewrites, with the proposed indexes …");
      for (const rewrite of REWRITES) {
        const ownIndex = rewrite.index && !existing.has(rewrite.index.name) ? rewrite.index : undefined;
        if (ownIndex) await pool.query(ownIndex.sql);
        try {
          if (ownIndex) await pool.query("analyze listings");
          const group = await explainGroup(pool, rewrite.label, rewrite.statements(parameters), large);
          const was = after.find((g) => g.label === rewrite.instead);
          rewrites.push({ label: rewrite.label, instead: rewrite.instead, index: rewrite.index?.sql ?? null, result: group, afterIndexesMs: was?.executionMs ?? null });
        } finally {
          if (ownIndex) await pool.query(`drop index if exists "${ownIndex.name}"`);
        }
      }
      console.log(`\n  query rewrites (with the proposed indexes)`);
      for (const r of rewrites) printGroup(r.result, true);
      console.log(`\n  as the app sends it → rewritten (ms), both with the proposed indexes`);
      for (const r of rewrites) console.log(`    ${String(r.afterIndexesMs ?? "?").padStart(9)} → ${String(r.result.executionMs).padStart(9)}  ${r.label}`);
    } finally {
      if (!process.argv.includes("--keep-indexes")) {
        for (const index of proposed) await pool.query(`drop index if exists "${index.name}"`);
        await pool.query("analyze");
      }
    }
  }
  console.log("");
  return {
    listings: FULL_LISTINGS,
    parameters,
    before,
    proposed,
    after,
    rewrites,
    allUseIndexes: { before: before.every((g) => g.usesIndex), after: after ? after.every((g) => g.usesIndex) : null },
  };
}
