// Lighthouse 12 (node API) performance, accessibility and best-practices scores of the main pages
// in Debian's Chromium, started by chrome-launcher with the benchmark flags. Mobile (Lighthouse's
// default: simulated slow 4G and a 4× slower CPU) is the figure the targets apply to, as the
// median of five runs by performance score (Lighthouse's own advice against its run-to-run
// spread); desktop is run once for comparison. A signed-in page gets the session cookie as an
// extra header. For a page that misses a target the failing audits are printed and kept: which
// audit, which element or chunk. Full reports land in tests/.artifacts/bench/lighthouse/.
// Targets: performance ≥ 95, accessibility ≥ 95.
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import * as chromeLauncher from "chrome-launcher";
import lighthouse, { desktopConfig, type Flags, type Result } from "lighthouse";
import { ARTIFACTS_DIR, CHROMIUM_FLAGS, CHROMIUM_PATH, FULL_LISTINGS } from "./support/config";
import type { BenchContext } from "./support/context";
import { log } from "./support/environment";
import { settle } from "./support/load";
import { preparePages, type BenchPage } from "./support/pages";
import { round } from "./support/stats";

export const TARGETS = { performance: 95, accessibility: 95 };
const MOBILE_RUNS = 5;
const CATEGORIES = ["performance", "accessibility", "best-practices"] as const;
type Category = (typeof CATEGORIES)[number];

type Scores = Record<Category, number>;
type Finding = { id: string; title: string; score: number | null; displayValue?: string; items: string[] };
export type PageScores = {
  name: string;
  path: string;
  mobile: Scores & { runs: number[]; metrics: Record<string, string>; benchmarkIndex: number | null; warnings: string[] };
  desktop: Scores;
  findings: { performance: Finding[]; accessibility: Finding[]; bestPractices: Finding[] };
  met: { performance: boolean; accessibility: boolean };
};
export type LighthouseFigures = { lighthouse: string; chromium: string; method: string; targets: typeof TARGETS; pages: PageScores[]; skipped: string[] };

const score = (lhr: Result, c: Category) => Math.round((lhr.categories[c]?.score ?? 0) * 100);

function describeItem(item: Record<string, unknown>): string {
  const node = item.node as { selector?: string; snippet?: string } | undefined;
  if (node?.selector) return `${node.selector} ${node.snippet ?? ""}`.trim().slice(0, 200);
  const url = typeof item.url === "string" ? new URL(item.url, "http://x").pathname : undefined;
  const wasted = typeof item.wastedBytes === "number" ? ` (${round(item.wastedBytes / 1000, 1)} kB unused)` : "";
  const total = typeof item.totalBytes === "number" ? ` ${round(item.totalBytes / 1000, 1)} kB` : "";
  return url ? `${url}${total}${wasted}` : JSON.stringify(item).slice(0, 160);
}

function failing(lhr: Result, category: Category, onlyOpportunities = false): Finding[] {
  const refs = lhr.categories[category]?.auditRefs ?? [];
  return refs
    .map((ref) => lhr.audits[ref.id])
    .filter((a): a is NonNullable<typeof a> => Boolean(a) && a!.score !== null && a!.score < 1 && a!.scoreDisplayMode !== "informative" && a!.scoreDisplayMode !== "notApplicable")
    .filter((a) => !onlyOpportunities || ["opportunity", "table"].includes(String((a.details as { type?: string } | undefined)?.type)) || a.score! < 0.9)
    .map((a) => {
      const items = ((a.details as { items?: Record<string, unknown>[] } | undefined)?.items ?? []).slice(0, 5).map(describeItem);
      return { id: a.id, title: a.title, score: a.score, displayValue: a.displayValue, items };
    });
}

const METRICS = ["first-contentful-paint", "largest-contentful-paint", "total-blocking-time", "cumulative-layout-shift", "speed-index"];

const ATTEMPTS = 3;

/** One Lighthouse run; a run that failed to record (NO_NAVSTART and the like, on a busy machine) is tried again. */
async function audit(port: number, url: string, cookie: string | null, desktop: boolean): Promise<{ lhr: Result; trace: unknown }> {
  const flags: Flags = { port, output: "json", logLevel: "error", onlyCategories: [...CATEGORIES], ...(cookie ? { extraHeaders: { Cookie: cookie } } : {}) };
  let problem = "";
  for (let attempt = 1; attempt <= ATTEMPTS; attempt++) {
    const result = await lighthouse(url, flags, desktop ? desktopConfig : undefined);
    if (result && !result.lhr.runtimeError) return { lhr: result.lhr, trace: result.artifacts.Trace };
    problem = result?.lhr.runtimeError ? `${result.lhr.runtimeError.code}: ${result.lhr.runtimeError.message}` : "no result";
    log(`Lighthouse could not record ${url} (${problem}); attempt ${attempt} of ${ATTEMPTS}`);
  }
  throw new Error(`Lighthouse could not load ${url} in ${ATTEMPTS} attempts: ${problem}`);
}

async function auditPage(port: number, baseUrl: string, page: BenchPage, reportDir: string): Promise<PageScores> {
  const url = `${baseUrl}${page.path}`;
  const header = page.cookie ? `${page.cookie.name}=${page.cookie.value}` : null;
  const runs: { lhr: Result; trace: unknown }[] = [];
  for (let k = 0; k < MOBILE_RUNS; k++) runs.push(await audit(port, url, header, false));
  runs.sort((a, b) => score(a.lhr, "performance") - score(b.lhr, "performance"));
  const medianRun = runs[Math.floor(runs.length / 2)]!;
  const median = medianRun.lhr;
  const { lhr: desktop } = await audit(port, url, header, true);
  writeFileSync(path.join(reportDir, `${page.name}-mobile.json`), JSON.stringify(median));
  // BENCH_TRACES=1 keeps the median run's trace too, for a browser's performance panel.
  if (process.env.BENCH_TRACES === "1") writeFileSync(path.join(reportDir, `${page.name}-mobile.trace.json`), JSON.stringify(medianRun.trace));
  writeFileSync(path.join(reportDir, `${page.name}-desktop.json`), JSON.stringify(desktop));
  const scores = (lhr: Result) => Object.fromEntries(CATEGORIES.map((c) => [c, score(lhr, c)])) as Scores;
  const mobile = scores(median);
  return {
    name: page.name,
    path: page.path,
    mobile: {
      ...mobile,
      runs: runs.map((r) => score(r.lhr, "performance")),
      metrics: Object.fromEntries(METRICS.map((m) => [m, median.audits[m]?.displayValue ?? "?"])),
      benchmarkIndex: median.environment?.benchmarkIndex ?? null,
      warnings: median.runWarnings.map(String),
    },
    desktop: scores(desktop),
    findings: {
      performance: mobile.performance < TARGETS.performance ? failing(median, "performance", true) : [],
      accessibility: failing(median, "accessibility"),
      bestPractices: failing(median, "best-practices"),
    },
    met: { performance: mobile.performance >= TARGETS.performance, accessibility: mobile.accessibility >= TARGETS.accessibility },
  };
}

export async function runLighthouseBench(ctx: BenchContext): Promise<LighthouseFigures> {
  await ctx.ensureListings(FULL_LISTINGS);
  await ctx.env.ensureApp();
  const setup = await preparePages(ctx.env.pool, ctx.env.appEnv);
  const reportDir = path.join(ARTIFACTS_DIR, "lighthouse");
  mkdirSync(reportDir, { recursive: true });
  const chrome = await chromeLauncher.launch({ chromePath: process.env.CHROME_PATH || CHROMIUM_PATH, chromeFlags: CHROMIUM_FLAGS, logLevel: "error" });
  const pages: PageScores[] = [];
  let chromium = "";
  try {
    const version = (await (await fetch(`http://127.0.0.1:${chrome.port}/json/version`)).json()) as { Browser?: string };
    chromium = version.Browser ?? "";
    for (const page of setup.pages) {
      await settle(ctx.env.baseUrl);
      log(`Lighthouse: ${page.name} (${page.path}), ${MOBILE_RUNS}× mobile and once desktop …`);
      pages.push(await auditPage(chrome.port, ctx.env.baseUrl, page, reportDir));
    }
  } finally {
    chrome.kill();
  }
  console.log(`\n  Lighthouse 12, ${chromium} (mobile: median of ${MOBILE_RUNS} by performance; desktop once)`);
  console.log(`  page              perf  a11y  best   | desktop perf a11y best | mobile perf runs`);
  for (const p of pages) {
    const m = p.mobile;
    console.log(
      `  ${p.name.padEnd(16)} ${String(m.performance).padStart(4)}  ${String(m.accessibility).padStart(4)}  ${String(m["best-practices"]).padStart(4)}   |  ${String(p.desktop.performance).padStart(10)} ${String(p.desktop.accessibility).padStart(4)} ${String(p.desktop["best-practices"]).padStart(4)} | ${m.runs.join(", ")}`,
    );
    console.log(`      ${Object.entries(m.metrics).map(([k, v]) => `${k.replace(/-/g, " ")} ${v}`).join(" · ")}`);
    for (const [category, findings] of Object.entries(p.findings)) {
      for (const f of findings) {
        console.log(`      ${category}: ${f.id} — ${f.title}${f.displayValue ? ` (${f.displayValue})` : ""}`);
        for (const item of f.items.slice(0, 3)) console.log(`          ${item}`);
      }
    }
  }
  for (const s of setup.skipped) console.log(`  skipped: ${s}`);
  console.log("");
  return {
    lighthouse: (await import("lighthouse/package.json", { with: { type: "json" } }).catch(() => ({ default: { version: "12" } }))).default.version,
    chromium,
    method: `Lighthouse node API, default (mobile) config median of ${MOBILE_RUNS} runs by performance score, desktop config once; Chromium from ${CHROMIUM_PATH} via chrome-launcher with ${CHROMIUM_FLAGS.join(" ")}`,
    targets: TARGETS,
    pages,
    skipped: setup.skipped,
  };
}
