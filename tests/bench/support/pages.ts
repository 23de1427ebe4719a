// The pages whose first load and Lighthouse scores are measured, and the signed-in state they
// need: a session row for a generated member who owns a bring-up log with readings and has a cart
// with a mains-connected kit and a magnetic (so checkout shows its acknowledgement form), and a
// measured scope capture on that log for the capture viewer.
import { randomBytes } from "node:crypto";
import { existsSync } from "node:fs";
import path from "node:path";
import type pg from "pg";
import { runAppSide } from "./app-side-client";
import { ROOT } from "./config";

/** `cookie` is set for a page that needs a signed-in member. */
export type BenchPage = { name: string; path: string; cookie: { name: string; value: string } | null };
export type PageSetup = { pages: BenchPage[]; skipped: string[] };

/** Auth.js's cookie for database sessions over plain http (the __Secure- one is for https). */
export const SESSION_COOKIE = "authjs.session-token";
const DEMO_KIT_SLUG = "160a-half-bridge-stick-welder-kit";
const CAPTURE_VIEWER = path.join(ROOT, "app", "(bench)", "bench", "captures", "[id]", "page.tsx");

async function one<T extends pg.QueryResultRow>(pool: pg.Pool, text: string, values: unknown[] = []): Promise<T | null> {
  const { rows } = await pool.query<T>(text, values);
  return rows[0] ?? null;
}

export async function preparePages(pool: pg.Pool, appEnv: Record<string, string>): Promise<PageSetup> {
  const log = await one<{ id: string; owner_id: string }>(pool, "select l.id, l.owner_id from bring_up_logs l where l.owner_id like 'bench-member-%' and exists (select 1 from readings r where r.log_id = l.id) order by l.id limit 1");
  if (!log) throw new Error("no generated bring-up log: generate the catalog first");
  const userId = log.owner_id;
  const member = await signIn(pool, userId);

  const listing =
    (await one<{ slug: string }>(pool, "select slug from listings where slug = $1 and state = 'live'", [DEMO_KIT_SLUG])) ??
    (await one<{ slug: string }>(pool, "select slug from listings where kind = 'kit' and state = 'live' order by id limit 1"));
  const kit = await one<{ id: string }>(pool, "select id from listings where kind = 'kit' and state = 'live' and stock > 0 and mains_connected order by id limit 1");
  const magnetic = await one<{ id: string }>(pool, "select id from listings where kind = 'magnetic' and state = 'live' and stock > 0 order by id limit 1");
  if (!listing || !kit || !magnetic) throw new Error("the benchmark database has no live kit or magnetic to put in a cart");
  const cart = await one<{ id: string }>(pool, "insert into carts (user_id) values ($1) on conflict (user_id) do update set updated_at = now() returning id", [userId]);
  for (const listingId of [kit.id, magnetic.id]) {
    await pool.query("insert into cart_items (cart_id, listing_id, quantity) values ($1, $2, 1) on conflict do nothing", [cart!.id, listingId]);
  }

  const pages: BenchPage[] = [
    { name: "home", path: "/", cookie: null },
    { name: "catalog", path: "/catalog", cookie: null },
    { name: "listing", path: `/listings/${listing.slug}`, cookie: null },
    { name: "checkout", path: "/checkout", cookie: member },
    { name: "bring-up-log", path: `/bench/logs/${log.id}`, cookie: member },
  ];
  const skipped: string[] = [];
  if (!existsSync(CAPTURE_VIEWER)) {
    skipped.push("capture-viewer (app/(bench)/bench/captures/[id]/page.tsx does not exist yet)");
  } else {
    // A measured capture, seen by the owner of its log: the viewer with its trace, figures and confirm form.
    const capture = await measuredCapture(pool, appEnv, log.id, userId).catch((error: unknown) => {
      skipped.push(`capture-viewer (no measured capture: ${error instanceof Error ? error.message : String(error)})`);
      return null;
    });
    if (capture) pages.push({ name: "capture-viewer", path: `/bench/captures/${capture.id}`, cookie: await signIn(pool, capture.ownerId) });
  }
  // BENCH_PAGES=home,listing narrows a run to those pages (for trying a change); a full run takes all.
  const only = process.env.BENCH_PAGES?.split(",").map((n) => n.trim()).filter(Boolean);
  if (!only?.length) return { pages, skipped };
  const unknown = only.filter((n) => !pages.some((p) => p.name === n));
  if (unknown.length) throw new Error(`BENCH_PAGES names ${unknown.join(", ")}; the pages are ${pages.map((p) => p.name).join(", ")}`);
  return { pages: pages.filter((p) => only.includes(p.name)), skipped: [...skipped, `all but ${only.join(", ")} (BENCH_PAGES)`] };
}

/** The first measured capture in the database, else one made on the member's log through the app's capture code. */
async function measuredCapture(pool: pg.Pool, appEnv: Record<string, string>, logId: string, ownerId: string): Promise<{ id: string; ownerId: string }> {
  const found = await one<{ id: string; owner_id: string }>(
    pool,
    "select c.id, l.owner_id from captures c join bring_up_logs l on l.id = c.log_id where c.state = 'measured' order by c.created_at, c.id limit 1",
  );
  if (found) return { id: found.id, ownerId: found.owner_id };
  const reading = await one<{ id: string }>(pool, "select id from readings where log_id = $1 order by taken_at, id limit 1", [logId]);
  if (!reading) throw new Error("the member's log has no reading to carry a capture");
  const { captureId } = await runAppSide({ kind: "make-scope-capture", ownerId, logId, readingId: reading.id }, appEnv);
  return { id: captureId, ownerId };
}

/** A database session for the member, as Auth.js would have written it at sign-in. */
async function signIn(pool: pg.Pool, userId: string) {
  const value = `bench-${randomBytes(24).toString("hex")}`;
  await pool.query("insert into sessions (session_token, user_id, expires) values ($1, $2, now() + interval '1 day')", [value, userId]);
  return { name: SESSION_COOKIE, value };
}
