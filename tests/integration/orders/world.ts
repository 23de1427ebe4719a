// A database with the demo accounts, the payments fake on a free port and the app's modules pointed at
// both; orders are written straight into the database in the `paid` state, as the checkout's
// verified webhook would leave them, with a real paid intent and transfer in the fake.
import { randomBytes } from "node:crypto";
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import Stripe from "stripe";
import { seedDemo } from "@/db/seed";
import * as schema from "@/db/schema";
import { startPaymentsFake, type PaymentsFake } from "@/fakes/payments/server";
import { freshDatabase } from "../../support/test-database";

export const SELLER = "demo-seller-kits";
export const OTHER_SELLER = "demo-seller-magnetics";
export const BUYER = "demo-builder";
export const OTHER_BUYER = "demo-reviewer";
const SECRET_KEY = "sk_test_orders_integration";

export type World = {
  pool: pg.Pool;
  stripe: Stripe;
  fake: PaymentsFake;
  paymentsDown(down: boolean): Promise<void>;
  close(): Promise<void>;
};

export async function startWorld(label: string): Promise<World> {
  const database = await freshDatabase(label);
  await seedDemo(database.url);
  const fake = await startPaymentsFake({ port: 0, log: () => {} });
  process.env.DATABASE_URL = database.url;
  process.env.STRIPE_API_URL = fake.url;
  process.env.STRIPE_SECRET_KEY = SECRET_KEY;
  (await import("@/lib/env"))._resetEnvForTests();
  (await import("@/lib/payments/client"))._resetPaymentsClientForTests();
  const { hostname, port } = new URL(fake.url);
  const stripe = new Stripe(SECRET_KEY, { host: hostname, port: Number(port), protocol: "http", maxNetworkRetries: 0 });
  const pool = new pg.Pool({ connectionString: database.url, max: 4 });
  return {
    pool,
    stripe,
    fake,
    paymentsDown: async (down) => {
      await fetch(`${fake.url}/api/test/fail-mode`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ down }) });
    },
    close: async () => {
      const { closeDb } = await import("@/db/client");
      await closeDb();
      await pool.end();
      await fake.close();
      await database.drop();
    },
  };
}

const profiled = new WeakMap<World, Map<string, string>>();

/** The seller's profile with a connected account that has finished onboarding in the fake. */
export async function sellerAccount(world: World, sellerId: string, returnsWindowDays = 14): Promise<string> {
  const known = profiled.get(world) ?? new Map<string, string>();
  profiled.set(world, known);
  const existing = known.get(sellerId);
  if (existing) return existing;
  const account = await world.stripe.accounts.create({
    type: "express",
    country: "DE",
    email: `${sellerId}@larkspur.test`,
    capabilities: { card_payments: { requested: true }, transfers: { requested: true } },
  });
  await fetch(`${world.fake.url}/api/test/complete-onboarding`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ account: account.id }) });
  const db = drizzle(world.pool, { schema });
  await db
    .insert(schema.sellerProfiles)
    .values({
      userId: sellerId,
      shopName: `Shop of ${sellerId}`,
      slug: sellerId,
      profileMd: "Invented workshop for the tests.",
      country: "DE",
      returnsPolicyMd: "Returns within the window, unused and discharged.",
      returnsWindowDays,
      payoutAccountId: account.id,
      chargesEnabled: true,
      payoutsEnabled: true,
    })
    // The demo seed may already have made the profile; the tests need its window and a real account.
    .onConflictDoUpdate({ target: schema.sellerProfiles.userId, set: { returnsWindowDays, payoutAccountId: account.id, chargesEnabled: true, payoutsEnabled: true } });
  known.set(sellerId, account.id);
  return account.id;
}

export type PaidOrder = {
  orderId: string;
  number: string;
  lineIds: string[];
  listingIds: string[];
  intentId: string;
  chargeId: string;
  transferId: string | null;
  subtotalMinor: number;
  feeMinor: number;
  sellerShareMinor: number;
};

export type LineSpec = { title: string; unitPriceMinor: number; quantity: number; stockLeft: number };

export async function createPaidOrder(
  world: World,
  { lines, feeMinor, sellerId = SELLER, buyerId = BUYER, transfer = true }: { lines: LineSpec[]; feeMinor: number; sellerId?: string; buyerId?: string; transfer?: boolean },
): Promise<PaidOrder> {
  const db = drizzle(world.pool, { schema });
  const account = await sellerAccount(world, sellerId);
  const subtotal = lines.reduce((sum, l) => sum + l.unitPriceMinor * l.quantity, 0);
  const intent = await world.stripe.paymentIntents.create({
    amount: subtotal,
    currency: "eur",
    confirm: true,
    payment_method: "pm_card_visa",
    allowed_payment_method_types: ["card"],
  });
  const chargeId = intent.latest_charge as string;
  const tr = transfer ? await world.stripe.transfers.create({ amount: subtotal - feeMinor, currency: "eur", destination: account, source_transaction: chargeId }) : null;
  const tag = randomBytes(3).toString("hex");
  const listingRows = await db
    .insert(schema.listings)
    .values(
      lines.map((l, i) => ({
        sellerId,
        kind: "board" as const,
        title: l.title,
        slug: `${tag}-${i}-board`,
        descriptionMd: "A test board.",
        priceMinor: l.unitPriceMinor,
        currency: "EUR",
        stock: l.stockLeft,
        declaration: { mainsConnected: true, mainsVrms: 230, busCapacitanceF: 0.00047, bleederOhm: 47_000, liveHeatsinks: false, weldingSource: false },
        state: "live" as const,
        sheetRevision: 2,
      })),
    )
    .returning({ id: schema.listings.id });
  const now = new Date();
  const [checkout] = await db
    .insert(schema.checkouts)
    .values({ buyerId, email: `${buyerId}@larkspur.test`, currency: "EUR", totalMinor: subtotal, feeBps: 800, status: "paid", paymentIntentId: intent.id, expiresAt: new Date(now.getTime() + 3_600_000), paidAt: now })
    .returning({ id: schema.checkouts.id });
  const number = `FY-T-${tag.toUpperCase()}`;
  const [order] = await db
    .insert(schema.orders)
    .values({
      number,
      checkoutId: checkout!.id,
      buyerId,
      sellerId,
      state: "paid",
      currency: "EUR",
      subtotalMinor: subtotal,
      feeMinor,
      sellerShareMinor: subtotal - feeMinor,
      transferId: tr?.id ?? null,
      paidAt: now,
    })
    .returning({ id: schema.orders.id });
  const lineRows = await db
    .insert(schema.orderLines)
    .values(lines.map((l, i) => ({ orderId: order!.id, listingId: listingRows[i]!.id, title: l.title, unitPriceMinor: l.unitPriceMinor, quantity: l.quantity, sheetRevision: 2 })))
    .returning({ id: schema.orderLines.id });
  await db.insert(schema.orderAcknowledgements).values(
    listingRows.map((r) => ({ checkoutId: checkout!.id, listingId: r.id, sheetRevision: 2, policyRevision: 1, hazards: ["connects to 230 V mains", "its bus reaches 358 V"] })),
  );
  return {
    orderId: order!.id,
    number,
    lineIds: lineRows.map((r) => r.id),
    listingIds: listingRows.map((r) => r.id),
    intentId: intent.id,
    chargeId,
    transferId: tr?.id ?? null,
    subtotalMinor: subtotal,
    feeMinor,
    sellerShareMinor: subtotal - feeMinor,
  };
}

export async function orderRow(world: World, orderId: string) {
  const { rows } = await world.pool.query(
    "select state, refunded_minor, carrier, tracking_ref, shipped_at, delivered_at, cancelled_at from orders where id = $1",
    [orderId],
  );
  return rows[0] as { state: string; refunded_minor: number; carrier: string | null; tracking_ref: string | null; shipped_at: Date | null; delivered_at: Date | null; cancelled_at: Date | null };
}

export async function auditActions(world: World, subjectId: string): Promise<string[]> {
  const { rows } = await world.pool.query("select action from audit_log where subject_id = $1 order by id", [subjectId]);
  return rows.map((r) => r.action as string);
}

export async function outbox(world: World, template: string): Promise<{ to: string; props: Record<string, unknown> }[]> {
  const { rows } = await world.pool.query("select \"to\", props from mail_outbox where template = $1 order by created_at", [template]);
  return rows;
}
