// Gives the demo's seeded orders and review sessions real payments in the payments stand-in, so that a
// demo seller can refund or cancel, a reviewer can deliver (capture) or decline (release), and a
// moderator can settle a dispute, straight after `npm start`. Runs after the stand-in and the payout
// accounts are up (fakes/demo-payouts.ts) and before the app.
//
// The seed writes placeholder provider ids; this step reads what the database says happened (the
// amount, the capture, each transfer, refund and reversal, from the rows and their audit entries) and
// makes the same in the stand-in, then records the new ids. An id the stand-in already knows is kept,
// so a second start (the stand-in keeps its state in .data/payments.json) changes nothing.
import pg from "pg";
import Stripe from "stripe";
import { checkoutId, demoCheckouts } from "../db/seed-orders";
import { demoSessions, sessionId } from "../db/seed-reviews";
import { demoClock } from "../db/seed-support";

type Options = { databaseUrl: string; paymentsUrl: string; secretKey: string; log?: (line: string) => void };

export async function ensureDemoPayments({ databaseUrl, paymentsUrl, secretKey, log = () => {} }: Options): Promise<{ checkouts: number; sessions: number }> {
  const url = new URL(paymentsUrl);
  const stripe = new Stripe(secretKey, { host: url.hostname, port: Number(url.port), protocol: "http", maxNetworkRetries: 1, timeout: 10_000 });
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  // Only the ids matter here, not the scenario's times.
  const clock = demoClock(new Date());
  try {
    let checkouts = 0;
    for (const c of demoCheckouts(clock)) if (await ensureCheckout(stripe, client, checkoutId(c.n))) checkouts += 1;
    let sessions = 0;
    for (const s of demoSessions(clock)) if (await ensureSession(stripe, client, sessionId(s.n))) sessions += 1;
    if (checkouts + sessions > 0) log(`demo payments created in the payments stand-in: ${checkouts} checkouts, ${sessions} review sessions`);
    return { checkouts, sessions };
  } finally {
    await client.end();
  }
}

async function knownIntent(stripe: Stripe, id: string | null): Promise<boolean> {
  if (!id) return false;
  try {
    await stripe.paymentIntents.retrieve(id);
    return true;
  } catch {
    return false;
  }
}

const chargeOf = (intent: Stripe.PaymentIntent) => (typeof intent.latest_charge === "string" ? intent.latest_charge : (intent.latest_charge?.id ?? null));

/** A paid checkout: the charge, each seller's transfer, and each refund with the reversal of the seller's part. */
async function ensureCheckout(stripe: Stripe, client: pg.Client, id: string): Promise<boolean> {
  const { rows } = await client.query<{ status: string; total_minor: number; currency: string; payment_intent_id: string | null }>(
    "select status, total_minor, currency, payment_intent_id from checkouts where id = $1",
    [id],
  );
  const checkout = rows[0];
  if (!checkout || checkout.status !== "paid" || (await knownIntent(stripe, checkout.payment_intent_id))) return false;
  const currency = checkout.currency.toLowerCase();
  const intent = await stripe.paymentIntents.create({
    amount: checkout.total_minor,
    currency,
    confirm: true,
    payment_method: "pm_card_visa",
    allowed_payment_method_types: ["card"],
    transfer_group: id,
    metadata: { checkoutId: id, demo: "seeded" },
  });
  const charge = chargeOf(intent);
  if (!charge) throw new Error(`the payments stand-in gave no charge for the demo checkout ${id}`);

  const { rows: orders } = await client.query<{ id: string; number: string; seller_share_minor: number; transfer_id: string | null; destination: string | null }>(
    `select o.id, o.number, o.seller_share_minor, o.transfer_id, p.payout_account_id as destination
     from orders o left join seller_profiles p on p.user_id = o.seller_id where o.checkout_id = $1 order by o.number`,
    [id],
  );
  const transfers = new Map<string, string>();
  const refundIds = new Map<string, string>();
  for (const order of orders) {
    // Transfers first, while the charge still holds the money; the stand-in refuses to send more than is left on it.
    if (order.transfer_id && order.destination && order.seller_share_minor > 0) {
      const transfer = await stripe.transfers.create({
        amount: order.seller_share_minor,
        currency,
        destination: order.destination,
        source_transaction: charge,
        transfer_group: id,
        metadata: { orderId: order.id, orderNumber: order.number },
      });
      transfers.set(order.id, transfer.id);
    }
  }
  for (const order of orders) {
    const { rows: refunds } = await client.query<{ id: string; amount_minor: number; seller_minor: number | null }>(
      `select r.id, r.amount_minor,
              (select (a.details->>'sellerRefundMinor')::int from audit_log a where a.action = 'order.refund_settled' and a.details->>'refundId' = r.id::text limit 1) as seller_minor
       from refunds r where r.order_id = $1 and r.provider_refund_id is not null order by r.created_at, r.id`,
      [order.id],
    );
    for (const refund of refunds) {
      const transfer = transfers.get(order.id);
      if (transfer && refund.seller_minor && refund.seller_minor > 0) {
        await stripe.transfers.createReversal(transfer, { amount: refund.seller_minor, metadata: { refundId: refund.id } });
      }
      const made = await stripe.refunds.create({ payment_intent: intent.id, amount: refund.amount_minor, metadata: { orderId: order.id, refundId: refund.id } });
      refundIds.set(refund.id, made.id);
    }
  }

  await client.query("begin");
  try {
    await client.query("update checkouts set payment_intent_id = $2 where id = $1", [id, intent.id]);
    for (const [orderId, transferId] of transfers) await client.query("update orders set transfer_id = $2 where id = $1", [orderId, transferId]);
    for (const [refundId, providerId] of refundIds) await client.query("update refunds set provider_refund_id = $2 where id = $1", [refundId, providerId]);
    await client.query("commit");
  } catch (error) {
    await client.query("rollback");
    throw error;
  }
  return true;
}

/** A review session: held, released, or captured with the reviewer's transfer and any settled refund. */
async function ensureSession(stripe: Stripe, client: pg.Client, id: string): Promise<boolean> {
  const { rows } = await client.query<{
    state: string;
    price_minor: number;
    reviewer_share_minor: number;
    currency: string;
    payment_intent_id: string | null;
    captured_at: Date | null;
    released_at: Date | null;
    transfer_id: string | null;
    destination: string | null;
  }>(
    `select s.state, s.price_minor, s.reviewer_share_minor, s.currency, s.payment_intent_id, s.captured_at, s.released_at, s.transfer_id, p.payout_account_id as destination
     from review_sessions s left join reviewer_profiles p on p.user_id = s.reviewer_id where s.id = $1`,
    [id],
  );
  const session = rows[0];
  if (!session || (await knownIntent(stripe, session.payment_intent_id))) return false;
  const currency = session.currency.toLowerCase();
  let intent = await stripe.paymentIntents.create({
    amount: session.price_minor,
    currency,
    capture_method: "manual",
    confirm: true,
    payment_method: "pm_card_visa",
    allowed_payment_method_types: ["card"],
    transfer_group: `review-${id}`,
    metadata: { reviewSessionId: id, demo: "seeded" },
  });
  let transferId: string | null = null;
  if (session.released_at) {
    await stripe.paymentIntents.cancel(intent.id, { cancellation_reason: "abandoned" });
  } else if (session.captured_at) {
    intent = await stripe.paymentIntents.capture(intent.id);
    const charge = chargeOf(intent);
    if (session.transfer_id && session.destination && charge) {
      const { rows: sent } = await client.query<{ amount: number | null }>(
        "select (details->>'amountMinor')::int as amount from audit_log where action = 'review.share_transferred' and subject_type = 'review_session' and subject_id = $1 order by id desc limit 1",
        [id],
      );
      const amount = sent[0]?.amount ?? session.reviewer_share_minor;
      transferId = (await stripe.transfers.create({ amount, currency, destination: session.destination, source_transaction: charge, transfer_group: `review-${id}`, metadata: { reviewSessionId: id } })).id;
    }
    const { rows: settled } = await client.query<{ refund: number; reviewer: number }>(
      `select (details->>'refundMinor')::int as refund, coalesce((details->>'reviewerRefundMinor')::int, 0) as reviewer
       from audit_log where action = 'review.dispute_settled' and subject_type = 'review_session' and subject_id = $1 and (details->>'refundMinor')::int > 0 order by id`,
      [id],
    );
    for (const s of settled) {
      if (transferId && s.reviewer > 0) await stripe.transfers.createReversal(transferId, { amount: s.reviewer, metadata: { reviewSessionId: id } });
      await stripe.refunds.create({ payment_intent: intent.id, amount: s.refund, metadata: { reviewSessionId: id } });
    }
  }
  await client.query("update review_sessions set payment_intent_id = $2, transfer_id = coalesce($3, transfer_id) where id = $1", [id, intent.id, transferId]);
  return true;
}
