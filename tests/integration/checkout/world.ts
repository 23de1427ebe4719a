// A checkout world for integration tests: its own database (freshDatabase + demo seed), the payments
// fake started in-test on a free port, sellers with onboarded connected accounts in that fake, and a
// tiny node:http server that forwards the fake's signed webhooks to the app's route (its exported POST).
import http from "node:http";
import { randomUUID } from "node:crypto";
import pg from "pg";
import Stripe from "stripe";
import { drizzle } from "drizzle-orm/node-postgres";
import { seedDemo } from "@/db/seed";
import * as schema from "@/db/schema";
import type { Db } from "@/db/client";
import { startPaymentsFake, type PaymentsFake } from "@/fakes/payments/server";
import type { SafetyDeclaration } from "@/lib/policy";
import { freshDatabase } from "../../support/test-database";

export const WEBHOOK_SECRET = "whsec_checkout_integration";
export const APP_URL = "http://localhost:3999";

export type World = {
  url: string;
  pool: pg.Pool;
  fake: PaymentsFake;
  stripe: Stripe;
  forwarder: { url: string; deliveries: { status: number; type: string }[] };
  sellers: { id: string; account: string }[];
  close(): Promise<void>;
};

/** The welder kit of the example: 230 V, 1000 µF, 47 kΩ bleeder, live heatsinks, 62 V OCV. */
export const MAINS_KIT: SafetyDeclaration = {
  mainsConnected: true,
  mainsVrms: 230,
  mainsTolerance: 0.1,
  busCapacitanceF: 1000e-6,
  bleederOhm: 47_000,
  liveHeatsinks: true,
  weldingSource: true,
  openCircuitV: 62,
  ocvKind: "dc",
  environment: "normal",
};
export const LOW_VOLTAGE: SafetyDeclaration = { mainsConnected: false, liveHeatsinks: false, weldingSource: false };

function startForwarder(): Promise<{ url: string; deliveries: { status: number; type: string }[]; close(): Promise<void> }> {
  const deliveries: { status: number; type: string }[] = [];
  const server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => chunks.push(c));
    req.on("end", async () => {
      const body = Buffer.concat(chunks).toString("utf8");
      const headers = new Headers();
      for (const [k, v] of Object.entries(req.headers)) if (typeof v === "string") headers.set(k, v);
      try {
        const { POST } = await import("@/app/api/webhooks/payments/route");
        const answer = await POST(new Request(`${APP_URL}/api/webhooks/payments`, { method: "POST", headers, body }));
        deliveries.push({ status: answer.status, type: (JSON.parse(body) as { type: string }).type });
        res.writeHead(answer.status, { "Content-Type": "application/json" });
        res.end(await answer.text());
      } catch (error) {
        res.writeHead(500);
        res.end(String(error));
      }
    });
  });
  return new Promise((resolve) =>
    server.listen(0, "127.0.0.1", () => {
      const { port } = server.address() as { port: number };
      resolve({ url: `http://127.0.0.1:${port}/hook`, deliveries, close: () => new Promise<void>((r) => server.close(() => r())) });
    }),
  );
}

export async function onboardedAccount(stripe: Stripe, fake: PaymentsFake, email: string): Promise<string> {
  const account = await stripe.accounts.create({ type: "express", country: "DE", email, capabilities: { transfers: { requested: true } } });
  const res = await fetch(`${fake.url}/api/test/complete-onboarding`, { method: "POST", headers: { "Content-Type": "application/json" }, body: JSON.stringify({ account: account.id }) });
  if (!res.ok) throw new Error(`onboarding failed: ${res.status}`);
  return account.id;
}

export async function fakeHook(fake: PaymentsFake, path: string, body: unknown): Promise<{ status: number; json: Record<string, any> }> {
  const res = await fetch(`${fake.url}/api/test${path}`, { method: "POST", headers: { "Content-Type": "application/json" }, body: JSON.stringify(body) });
  return { status: res.status, json: (await res.json()) as Record<string, any> };
}

/**
 * Starts the world. `forwardWebhooks: false` leaves the fake without an endpoint, for tests that
 * deliver (or withhold, or reorder) events themselves.
 */
export async function startWorld(label: string, options: { forwardWebhooks?: boolean; sellers?: number } = {}): Promise<World> {
  const database = await freshDatabase(label);
  await seedDemo(database.url);
  const forwarder = await startForwarder();
  const fake = await startPaymentsFake({
    port: 0,
    webhooks: options.forwardWebhooks === false ? [] : [{ url: forwarder.url, secret: WEBHOOK_SECRET }],
    webhookRetryBaseMs: 100,
    log: () => {},
  });
  const { port } = new URL(fake.url);
  const stripe = new Stripe("sk_test_checkout_integration", { host: "127.0.0.1", port: Number(port), protocol: "http", maxNetworkRetries: 0 });

  process.env.DATABASE_URL = database.url;
  process.env.STRIPE_API_URL = fake.url;
  process.env.STRIPE_SECRET_KEY = "sk_test_checkout_integration";
  process.env.STRIPE_WEBHOOK_SECRET = WEBHOOK_SECRET;
  process.env.APP_URL = APP_URL;
  const { _resetEnvForTests } = await import("@/lib/env");
  const { _resetPaymentsClientForTests } = await import("@/lib/payments/client");
  _resetEnvForTests();
  _resetPaymentsClientForTests();

  const pool = new pg.Pool({ connectionString: database.url, max: 4 });
  const sellerIds = ["demo-seller-kits", "demo-seller-magnetics", "seller-third"].slice(0, options.sellers ?? 2);
  if (sellerIds.includes("seller-third")) {
    await pool.query("insert into users (id, email, name) values ('seller-third', 'third.seller@example.test', 'Third Bench') on conflict do nothing");
  }
  const sellers: { id: string; account: string }[] = [];
  for (const id of sellerIds) {
    const account = await onboardedAccount(stripe, fake, `${id}@example.test`);
    await pool.query(
      `insert into seller_profiles (user_id, shop_name, slug, profile_md, country, returns_policy_md, payout_account_id, payouts_enabled, charges_enabled)
       values ($1, $2, $3, 'Invented test shop.', 'DE', 'Returns within 30 days.', $4, true, true)
       on conflict (user_id) do update set payout_account_id = excluded.payout_account_id, payouts_enabled = true, charges_enabled = true`,
      [id, `Shop of ${id}`, `shop-${id}`, account],
    );
    sellers.push({ id, account });
  }

  return {
    url: database.url,
    pool,
    fake,
    stripe,
    forwarder,
    sellers,
    close: async () => {
      // The fake first, so no late delivery reopens the app's pool on a database about to be dropped.
      await fake.close();
      await forwarder.close();
      const { closeDb } = await import("@/db/client");
      await closeDb();
      await pool.end();
      await database.drop();
    },
  };
}

export async function insertListing(
  world: World,
  input: { sellerId: string; title: string; priceMinor: number; stock: number; declaration?: SafetyDeclaration; currency?: string; sheetRevision?: number; kind?: "kit" | "board" },
): Promise<string> {
  const id = randomUUID();
  await world.pool.query(
    `insert into listings (id, seller_id, kind, title, slug, price_minor, currency, stock, declaration, safety_notes, sheet_revision, state, policy_revision, policy_status, live_at)
     values ($1, $2, $3, $4, $5, $6, $7, $8, $9, '[]', $10, 'live', 2, 'clear', now())`,
    [id, input.sellerId, input.kind ?? "kit", input.title, `${input.title.toLowerCase().replace(/[^a-z0-9]+/g, "-")}-${id.slice(0, 6)}`, input.priceMinor, input.currency ?? "EUR", input.stock, JSON.stringify(input.declaration ?? LOW_VOLTAGE), input.sheetRevision ?? 1],
  );
  return id;
}

export async function insertBuyers(world: World, count: number, prefix = "buyer"): Promise<{ id: string; email: string }[]> {
  const buyers = Array.from({ length: count }, (_, i) => ({ id: `${prefix}-${i + 1}`, email: `${prefix}.${i + 1}@example.test` }));
  for (const b of buyers) {
    await world.pool.query("insert into users (id, email, name) values ($1, $2, $3) on conflict do nothing", [b.id, b.email, `Buyer ${b.id}`]);
  }
  return buyers;
}

export async function stockOf(world: World, listingId: string): Promise<number> {
  const { rows } = await world.pool.query("select stock from listings where id = $1", [listingId]);
  return rows[0].stock;
}

export async function count(world: World, sqlText: string, params: unknown[] = []): Promise<number> {
  const { rows } = await world.pool.query(`select count(*)::int as n from (${sqlText}) q`, params);
  return rows[0].n;
}

/** A Db on its own connection, so several checkouts really run at the same time. */
export function separateDb(url: string): { db: Db; close(): Promise<void> } {
  const pool = new pg.Pool({ connectionString: url, max: 1 });
  return { db: drizzle(pool, { schema }) as unknown as Db, close: () => pool.end() };
}

export async function waitFor<T>(what: string, probe: () => Promise<T | null | undefined | false>, timeoutMs = 15_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const value = await probe();
    if (value) return value;
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

/** A signed delivery as the provider makes it (header from the SDK's own test helper). */
export async function deliver(event: unknown, options: { secret?: string; tamper?: (body: string) => string; signature?: string | null } = {}): Promise<Response> {
  const stripe = new Stripe("sk_test_signing_only");
  const body = JSON.stringify(event);
  const header = options.signature !== undefined ? options.signature : stripe.webhooks.generateTestHeaderString({ payload: body, secret: options.secret ?? WEBHOOK_SECRET });
  const sent = options.tamper ? options.tamper(body) : body;
  const headers = new Headers({ "Content-Type": "application/json" });
  if (header !== null) headers.set("Stripe-Signature", header);
  const { POST } = await import("@/app/api/webhooks/payments/route");
  return POST(new Request(`${APP_URL}/api/webhooks/payments`, { method: "POST", headers, body: sent }));
}

/** An event of the given type about an object, shaped like the provider's. */
export function eventOf(type: string, object: Record<string, unknown>, id = `evt_test_${randomUUID().replaceAll("-", "")}`) {
  return { id, object: "event", api_version: "2026-10-28.endive", created: Math.floor(Date.now() / 1000), livemode: false, pending_webhooks: 1, request: { id: null, idempotency_key: null }, type, data: { object } };
}

/** The provider's own event of a type for an object id, read back through the SDK. */
export async function providerEvent(world: World, type: string, objectId: string): Promise<Stripe.Event> {
  return waitFor(`${type} for ${objectId}`, async () => {
    const list = await world.stripe.events.list({ type, limit: 100 });
    return list.data.find((e) => (e.data.object as { id?: string }).id === objectId) ?? null;
  });
}
