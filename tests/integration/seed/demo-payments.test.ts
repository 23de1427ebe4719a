// The demo's payments step (fakes/demo-payments.ts) against the payments stand-in, through the real
// SDK: after it, every seeded paid order and review session has its charge, transfer, refunds and
// reversals in the stand-in, matching the database; a second run creates nothing; and the product's
// own actions on the seeded data — refund, accept a return, cancel, decline, deliver, settle a
// dispute — go through, as they must when a demo user clicks them after `npm start`.
import pg from "pg";
import Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { seedDemo } from "@/db/seed";
import { logCheckpointId } from "@/db/seed-bench";
import { orderId } from "@/db/seed-orders";
import { sessionId } from "@/db/seed-reviews";
import { demoUuid } from "@/db/seed-support";
import { ensureDemoPayments } from "@/fakes/demo-payments";
import { ensureDemoPayoutAccounts } from "@/fakes/demo-payouts";
import { startPaymentsFake, type PaymentsFake } from "@/fakes/payments/server";
import { freshDatabase } from "../../support/test-database";

// Jobs are only a nudge after commit (the outbox row is the record); no pg-boss here.
vi.mock("@/lib/jobs/boss", () => ({ sendJob: async () => {} }));

const SECRET_KEY = "sk_test_demo_payments_integration";
let database: Awaited<ReturnType<typeof freshDatabase>>;
let fake: PaymentsFake;
let stripe: Stripe;
let pool: pg.Pool;
const runs: { checkouts: number; sessions: number }[] = [];

const REVIEWER = { id: "demo-reviewer", email: "tamsin.reviews@larkspur.test", name: "Tamsin Achterberg", roles: ["member" as const, "reviewer" as const] };
const MODERATOR = { id: "demo-moderator", email: "sefa.moderator@larkspur.test", name: "Sefa Marchetti-Obi", roles: ["member" as const, "moderator" as const] };

async function one<T = Record<string, unknown>>(sql: string, params: unknown[] = []): Promise<T> {
  return (await pool.query(sql, params)).rows[0] as T;
}

async function chargeOfIntent(intentId: string) {
  const intent = await stripe.paymentIntents.retrieve(intentId);
  return stripe.charges.retrieve(intent.latest_charge as string);
}

beforeAll(async () => {
  database = await freshDatabase("seed_demo_payments");
  await seedDemo(database.url, { everyState: true });
  fake = await startPaymentsFake({ port: 0, log: () => {} });
  const { hostname, port } = new URL(fake.url);
  stripe = new Stripe(SECRET_KEY, { host: hostname, port: Number(port), protocol: "http", maxNetworkRetries: 0 });
  pool = new pg.Pool({ connectionString: database.url, max: 3 });
  await ensureDemoPayoutAccounts({ databaseUrl: database.url, paymentsUrl: fake.url, secretKey: SECRET_KEY });
  runs.push(await ensureDemoPayments({ databaseUrl: database.url, paymentsUrl: fake.url, secretKey: SECRET_KEY }));
  runs.push(await ensureDemoPayments({ databaseUrl: database.url, paymentsUrl: fake.url, secretKey: SECRET_KEY }));

  process.env.DATABASE_URL = database.url;
  process.env.STRIPE_API_URL = fake.url;
  process.env.STRIPE_SECRET_KEY = SECRET_KEY;
  (await import("@/lib/env"))._resetEnvForTests();
  (await import("@/lib/payments/client"))._resetPaymentsClientForTests();
});

afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
  await pool?.end();
  await fake?.close();
  await database?.drop();
});

describe("the demo's payments in the stand-in", () => {
  it("makes every seeded paid checkout and review session once; a second start makes none", async () => {
    const paid = await one<{ n: number }>("select count(*)::int as n from checkouts where status = 'paid'");
    const sessions = await one<{ n: number }>("select count(*)::int as n from review_sessions");
    expect(runs).toEqual([
      { checkouts: paid.n, sessions: sessions.n },
      { checkouts: 0, sessions: 0 },
    ]);
    const left = await one<{ n: number }>(
      "select ((select count(*) from checkouts where payment_intent_id like 'pi_seed_%') + (select count(*) from orders where transfer_id like 'tr_seed_%') + (select count(*) from refunds where provider_refund_id like 're_seed_%') + (select count(*) from review_sessions where payment_intent_id like 'pi_seed_%' or transfer_id like 'tr_seed_%'))::int as n",
    );
    expect(left.n).toBe(0);
  });

  it("charges each checkout its total, refunds what the database refunded and takes the seller's part back from the transfer", async () => {
    const { rows } = await pool.query(`
      select c.payment_intent_id, c.total_minor,
             (select coalesce(sum(r.amount_minor), 0)::int from refunds r join orders o on o.id = r.order_id where o.checkout_id = c.id) as refunded
      from checkouts c where c.status = 'paid'`);
    for (const c of rows) {
      const intent = await stripe.paymentIntents.retrieve(c.payment_intent_id);
      expect(intent).toMatchObject({ status: "succeeded", amount: c.total_minor });
      expect((await chargeOfIntent(c.payment_intent_id)).amount_refunded).toBe(c.refunded);
    }
    const { rows: orders } = await pool.query("select number, transfer_id, subtotal_minor, seller_share_minor, refunded_minor from orders where transfer_id is not null");
    expect(orders.length).toBeGreaterThan(5);
    for (const o of orders) {
      const transfer = await stripe.transfers.retrieve(o.transfer_id);
      expect(transfer.amount, o.number).toBe(o.seller_share_minor);
      // The seller gives back their share of what was refunded, pro rata (the fee gives back the rest).
      expect(transfer.amount_reversed, o.number).toBe(Math.round((o.seller_share_minor * o.refunded_minor) / o.subtotal_minor));
    }
  });

  it("holds, releases or captures each review's payment as its state says, and refunds what a moderator decided", async () => {
    const { rows } = await pool.query("select state::text, payment_intent_id, transfer_id, refunded_minor from review_sessions");
    for (const s of rows) {
      const intent = await stripe.paymentIntents.retrieve(s.payment_intent_id);
      const expected = { requested: "requires_capture", accepted: "requires_capture", declined: "canceled", expired: "canceled" }[s.state as string] ?? "succeeded";
      expect(intent.status, s.state).toBe(expected);
      if (expected === "succeeded") {
        expect((await chargeOfIntent(s.payment_intent_id)).amount_refunded).toBe(s.refunded_minor);
        // 4500 paid, 360 fee: a refund of R takes R × 4140 / 4500 back from the reviewer.
        expect((await stripe.transfers.retrieve(s.transfer_id)).amount_reversed).toBe(Math.round((s.refunded_minor * 4140) / 4500));
      }
    }
  });
});

describe("a demo user acting on the seeded data", () => {
  it("the seller refunds part of a shipped order's line", async () => {
    const { refundLine } = await import("@/db/queries/orders");
    const order = await one<{ payment_intent_id: string }>("select c.payment_intent_id from orders o join checkouts c on c.id = o.checkout_id where o.id = $1", [orderId(3)]);
    const outcome = await refundLine({ orderId: orderId(3), lineId: demoUuid("order-line", 30), actorId: "demo-seller-kits", amountMinor: 1_000, reason: "One board arrived with a bent header." });
    expect(outcome.status).toBe("refunded");
    expect((await chargeOfIntent(order.payment_intent_id)).amount_refunded).toBe(1_000);
  });

  it("the seller accepts the waiting return, and the rest of the order goes back", async () => {
    const { acceptReturn } = await import("@/db/queries/orders");
    const { refunds } = await acceptReturn({ orderId: orderId(9), returnId: demoUuid("return", 90), actorId: "demo-seller-magnetics" });
    expect(refunds.map((r) => r.status)).toEqual(["refunded"]);
    expect(await one("select state::text, refunded_minor from orders where id = $1", [orderId(9)])).toEqual({ state: "refunded", refunded_minor: 6_400 });
  });

  it("the seller cancels the order waiting to be shipped", async () => {
    const { cancelOrder } = await import("@/db/queries/orders");
    const result = await cancelOrder({ orderId: orderId(4), actorId: "demo-seller-kits" });
    expect(result.refunds.map((r) => r.status)).toEqual(["refunded"]);
    expect(await one("select state::text, refunded_minor from orders where id = $1", [orderId(4)])).toEqual({ state: "cancelled", refunded_minor: 4_650 });
  });

  it("the reviewer declines the waiting request and the hold is released", async () => {
    const { declineReview } = await import("@/db/queries/reviews");
    expect(await declineReview({ actor: REVIEWER, sessionId: sessionId(1), reason: "Away from the bench this week." })).toEqual({ released: true });
    const s = await one<{ payment_intent_id: string }>("select payment_intent_id from review_sessions where id = $1", [sessionId(1)]);
    expect((await stripe.paymentIntents.retrieve(s.payment_intent_id)).status).toBe("canceled");
  });

  it("the reviewer delivers the accepted review; the payment is captured and the share sent", async () => {
    const { deliverReport } = await import("@/db/queries/reviews");
    // Log 3's checkpoints in the booked stages (control supply, series lamp, low current): positions 0–4.
    const verdicts = [0, 1, 2, 3, 4].map((p) => ({ checkpointId: logCheckpointId(3, p), verdict: "fine" as const, comment: "" }));
    expect(await deliverReport({ actor: REVIEWER, sessionId: sessionId(2), report: { verdicts, summaryMd: "All five readings in these stages are where the design puts them; go on to rated load." } })).toEqual({
      captured: true,
      transferred: true,
    });
    const s = await one<{ payment_intent_id: string; transfer_id: string }>("select payment_intent_id, transfer_id from review_sessions where id = $1", [sessionId(2)]);
    expect((await stripe.paymentIntents.retrieve(s.payment_intent_id)).status).toBe("succeeded");
    expect((await stripe.transfers.retrieve(s.transfer_id)).amount).toBe(4_140);
  });

  it("the moderator settles the open dispute with a part refund, taken partly from the reviewer's transfer", async () => {
    const { settleDispute } = await import("@/db/queries/reviews");
    await settleDispute({ actor: MODERATOR, sessionId: sessionId(7), decision: { outcome: "refund_partial", refundMinor: 1_500, note: "The stop verdict was for a reading already fixed; a third goes back." } });
    const s = await one<{ payment_intent_id: string; transfer_id: string; state: string }>("select payment_intent_id, transfer_id, state::text from review_sessions where id = $1", [sessionId(7)]);
    expect(s.state).toBe("closed");
    expect((await chargeOfIntent(s.payment_intent_id)).amount_refunded).toBe(1_500);
    // 1500 × 4140 / 4500 = 1380 (the fee's 120 is given up).
    expect((await stripe.transfers.retrieve(s.transfer_id)).amount_reversed).toBe(1_380);
  });
});
