// Runs the app's own query functions outside Next.js against the benchmark database, in a child
// process started by app-side-client.ts with the app's environment (lib/env.ts reads it once):
//   catalog-bare     — searchListings() for a mix of searches, N at a time, timed per call
//   capture          — the SQL (text and parameters) that named app reads send to PostgreSQL
// Started as `node --import ./lib/jobs/register-hooks.mjs tests/bench/support/app-side.ts job.json out.json`,
// so "server-only" loads and the `@/` paths resolve as in the worker.
import { readFileSync, writeFileSync } from "node:fs";
import pg from "pg";
import { round, summarise } from "./stats";

export type CatalogBareJob = { kind: "catalog-bare"; searches: string[]; concurrency: number; durationS: number; warmupS: number };
export type CaptureCall =
  | { fn: "searchListings"; search: string }
  | { fn: "getPublicListing"; slug: string }
  | { fn: "kitsFittedByMagnetic"; listingId: string }
  | { fn: "magneticsFittingKit"; listingId: string }
  | { fn: "listBuyerOrders"; buyerId: string }
  | { fn: "questionsForListing"; listingId: string }
  | { fn: "reviewQueue" };
export type CaptureJob = { kind: "capture"; calls: { label: string; call: CaptureCall }[] };
/** A measured scope capture on one of the member's readings, through the app's own attach, claim, measure and store. */
export type MakeScopeCaptureJob = { kind: "make-scope-capture"; ownerId: string; logId: string; readingId: string };
export type Job = CatalogBareJob | CaptureJob | MakeScopeCaptureJob;

export type CapturedStatement = { text: string; values: unknown[] };
export type CaptureResult = { label: string; statements: CapturedStatement[] }[];
export type CatalogBareResult = {
  requests: number;
  durationS: number;
  requestsPerSecond: number;
  latencyMs: ReturnType<typeof summarise>;
  /** each search alone, one call at a time: which of the mix is slow, and how many it finds */
  perSearch: { search: string; medianMs: number; total: number }[];
  /** calls that threw (a pool or statement timeout); their time is in the latencies all the same */
  errors: number;
  errorSample: string | null;
};

const PER_SEARCH_RUNS = 5;

async function catalogBare(job: CatalogBareJob): Promise<CatalogBareResult> {
  const { searchListings } = await import("@/db/queries/catalog");
  const { parseCatalogQuery } = await import("@/lib/validations/catalog");
  const queries = job.searches.map((s) => {
    const parsed = parseCatalogQuery(new URLSearchParams(s));
    if (!parsed.ok) throw new Error(`not a valid catalog search: ${s}`);
    return parsed.query;
  });
  let errors = 0;
  let errorSample: string | null = null;
  // Like autocannon's connections: each worker walks the same list from its start, one call at a time.
  const run = async (seconds: number, latencies: number[] | null) => {
    const end = performance.now() + seconds * 1000;
    await Promise.all(
      Array.from({ length: job.concurrency }, async () => {
        for (let k = 0; performance.now() < end; k++) {
          const started = performance.now();
          try {
            await searchListings(queries[k % queries.length]!);
          } catch (error) {
            if (latencies) errors += 1;
            errorSample ??= error instanceof Error ? error.message : String(error);
          }
          latencies?.push(performance.now() - started);
        }
      }),
    );
  };
  await run(job.warmupS, null);
  const latencies: number[] = [];
  const started = performance.now();
  await run(job.durationS, latencies);
  const durationS = (performance.now() - started) / 1000;
  const perSearch = [];
  for (const [k, query] of queries.entries()) {
    const times: number[] = [];
    let total = 0;
    for (let run = 0; run < PER_SEARCH_RUNS; run++) {
      const t = performance.now();
      total = (await searchListings(query)).total;
      times.push(performance.now() - t);
    }
    perSearch.push({ search: job.searches[k] ?? "", medianMs: summarise(times).p50, total });
  }
  return { requests: latencies.length, durationS: round(durationS, 2), requestsPerSecond: round(latencies.length / durationS, 1), latencyMs: summarise(latencies), perSearch, errors, errorSample };
}

async function capture(job: CaptureJob): Promise<CaptureResult> {
  let current: CapturedStatement[] | null = null;
  // Every statement the app sends goes through pg.Client#query (the pool's included).
  const original = pg.Client.prototype.query as (...args: unknown[]) => unknown;
  (pg.Client.prototype as unknown as { query: (...args: unknown[]) => unknown }).query = function (this: pg.Client, ...args: unknown[]) {
    const [first, second] = args;
    if (current && first !== undefined) {
      const text = typeof first === "string" ? first : (first as { text: string }).text;
      // drizzle passes the parameters beside the query config; pg also takes them inside it
      const values = Array.isArray(second) ? second : typeof first === "string" ? [] : ((first as { values?: unknown[] }).values ?? []);
      current.push({ text, values });
    }
    return original.apply(this, args);
  };
  const catalog = await import("@/db/queries/catalog");
  const { listBuyerOrders } = await import("@/db/queries/orders");
  const { questionsForListing } = await import("@/db/queries/qa");
  const { reviewQueue } = await import("@/db/queries/moderation");
  const { parseCatalogQuery } = await import("@/lib/validations/catalog");
  const out: CaptureResult = [];
  for (const { label, call } of job.calls) {
    const statements: CapturedStatement[] = [];
    current = statements;
    switch (call.fn) {
      case "searchListings": {
        const parsed = parseCatalogQuery(new URLSearchParams(call.search));
        if (!parsed.ok) throw new Error(`not a valid catalog search: ${call.search}`);
        await catalog.searchListings(parsed.query);
        break;
      }
      case "getPublicListing":
        await catalog.getPublicListing(call.slug);
        break;
      case "kitsFittedByMagnetic":
        await catalog.kitsFittedByMagnetic(call.listingId);
        break;
      case "magneticsFittingKit":
        await catalog.magneticsFittingKit(call.listingId);
        break;
      case "listBuyerOrders":
        await listBuyerOrders(call.buyerId);
        break;
      case "questionsForListing":
        await questionsForListing(call.listingId);
        break;
      case "reviewQueue":
        await reviewQueue();
        break;
    }
    current = null;
    out.push({ label, statements });
  }
  return out;
}

async function makeScopeCapture(job: MakeScopeCaptureJob): Promise<{ captureId: string }> {
  const { randomBytes } = await import("node:crypto");
  const { db } = await import("@/db/client");
  const { uploads } = await import("@/db/schema");
  const { env } = await import("@/lib/env");
  const captures = await import("@/db/queries/captures");
  const { measureText } = await import("@/lib/captures/measure");
  const { twoChannelGateCapture } = await import("../../support/captures");
  // 20 kHz gate drive at 40 % duty, 10 MS/s for 2 ms: the size of a capture a builder uploads.
  const { text } = twoChannelGateCapture({ sampleRateHz: 10e6, samples: 20_000, frequencyHz: 20e3, dutyCyclePct: 40, lowV: 0, highV: 15, riseRampS: 120e-9, fallRampS: 120e-9, noiseRmsV: 0.05, seed: 11 });
  const key = `bench-capture-${randomBytes(8).toString("hex")}`;
  await db.insert(uploads).values({
    key,
    ownerId: job.ownerId,
    purpose: "capture",
    originalName: "gate-drive.csv",
    contentType: "text/csv",
    bytes: Buffer.byteLength(text),
    url: `${env().UPLOADS_PUBLIC_ORIGIN ?? "http://127.0.0.1"}/f/${key}`,
  });
  const { id } = await captures.attachCapture({ id: job.ownerId, roles: ["member"] }, job.logId, { readingId: job.readingId, uploadKey: key });
  if (!(await captures.claimCapture(id))) throw new Error(`capture ${id} could not be claimed for measuring`);
  await captures.storeMeasurement(id, await measureText(text, async () => {}));
  return { captureId: id };
}

async function main() {
  const [jobFile, outFile] = process.argv.slice(2);
  if (!jobFile || !outFile) throw new Error("usage: app-side.ts job.json out.json");
  const job = JSON.parse(readFileSync(jobFile, "utf8")) as Job;
  const result = job.kind === "catalog-bare" ? await catalogBare(job) : job.kind === "capture" ? await capture(job) : await makeScopeCapture(job);
  writeFileSync(outFile, JSON.stringify(result));
  const { closeDb } = await import("@/db/client");
  await closeDb();
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
