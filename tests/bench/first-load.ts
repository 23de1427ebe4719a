// First-load JavaScript of the main pages, gzip. Method: each page is opened in a fresh Chromium
// profile (empty cache) through playwright-core; every response of resource type "script" that
// the page requested before its load event is counted (Next.js puts a route's chunks in the HTML
// as async scripts, which hold the load event back), and its body is gzipped here at level 9 —
// the way Next.js's own "First Load JS" figure was computed — so the figure does not depend on
// whether the server compressed the response. Scripts fetched after the load event (router
// prefetches, lazy chunks) are listed apart and not counted. Target: ≤ 130 kB gzip per page.
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { gzipSync } from "node:zlib";
import { chromium } from "playwright-core";
import { CHROMIUM_FLAGS, CHROMIUM_PATH, FULL_LISTINGS } from "./support/config";
import type { BenchContext } from "./support/context";
import { log } from "./support/environment";
import { preparePages, type BenchPage } from "./support/pages";
import { round } from "./support/stats";

export const TARGET_KB = 130;

type Script = { url: string; bytes: number; gzipBytes: number };
export type PageJs = { name: string; path: string; status: number; firstLoadKb: number; rawKb: number; scripts: Script[]; afterLoad: Script[]; met: boolean };
export type FirstLoadFigures = { method: string; targetKb: number; pages: PageJs[]; skipped: string[] };

const kb = (bytes: number) => round(bytes / 1000, 1);

async function measurePage(baseUrl: string, page: BenchPage): Promise<PageJs> {
  const profile = mkdtempSync(path.join(os.tmpdir(), "fluxyard-bench-chromium-"));
  const context = await chromium.launchPersistentContext(profile, { executablePath: CHROMIUM_PATH, headless: true, args: CHROMIUM_FLAGS });
  try {
    if (page.cookie) await context.addCookies([{ ...page.cookie, domain: new URL(baseUrl).hostname, path: "/", httpOnly: true, sameSite: "Lax" }]);
    const tab = context.pages()[0] ?? (await context.newPage());
    let loaded = false;
    const pending: Promise<void>[] = [];
    const before: Script[] = [];
    const after: Script[] = [];
    tab.on("response", (response) => {
      if (response.request().resourceType() !== "script") return;
      const bucket = loaded ? after : before;
      pending.push(
        response.body().then(
          (body) => void bucket.push({ url: new URL(response.url()).pathname, bytes: body.length, gzipBytes: gzipSync(body, { level: 9 }).length }),
          () => undefined,
        ),
      );
    });
    tab.once("load", () => {
      loaded = true;
    });
    const response = await tab.goto(`${baseUrl}${page.path}`, { waitUntil: "load" });
    await tab.waitForLoadState("networkidle").catch(() => undefined);
    await Promise.all(pending);
    const gzip = before.reduce((s, x) => s + x.gzipBytes, 0);
    before.sort((a, b) => b.gzipBytes - a.gzipBytes);
    return {
      name: page.name,
      path: page.path,
      status: response?.status() ?? 0,
      firstLoadKb: kb(gzip),
      rawKb: kb(before.reduce((s, x) => s + x.bytes, 0)),
      scripts: before,
      afterLoad: after,
      met: kb(gzip) <= TARGET_KB,
    };
  } finally {
    await context.close();
    rmSync(profile, { recursive: true, force: true });
  }
}

export async function runFirstLoadBench(ctx: BenchContext): Promise<FirstLoadFigures> {
  await ctx.ensureListings(FULL_LISTINGS);
  await ctx.env.ensureApp();
  const setup = await preparePages(ctx.env.pool, ctx.env.appEnv);
  const pages: PageJs[] = [];
  for (const page of setup.pages) {
    log(`first-load JavaScript of ${page.name} (${page.path}) …`);
    const measured = await measurePage(ctx.env.baseUrl, page);
    if (measured.status !== 200) throw new Error(`${page.path} answered ${measured.status}`);
    pages.push(measured);
  }
  console.log(`\n  first-load JavaScript (gzip -9 of each script loaded before the load event)`);
  for (const p of pages) {
    console.log(`  ${p.name.padEnd(16)} ${p.firstLoadKb.toFixed(1).padStart(7)} kB gzip  (${p.rawKb.toFixed(0)} kB raw, ${p.scripts.length} files)  ${p.met ? "≤" : ">"} ${TARGET_KB} kB`);
    for (const s of p.scripts.slice(0, 3)) console.log(`      ${kb(s.gzipBytes).toFixed(1).padStart(6)} kB  ${s.url}`);
  }
  for (const s of setup.skipped) console.log(`  skipped: ${s}`);
  console.log("");
  return {
    method: "fresh Chromium profile per page; sum of gzip -9 sizes of every script response requested before the load event; scripts after load listed apart",
    targetKb: TARGET_KB,
    pages,
    skipped: setup.skipped,
  };
}
