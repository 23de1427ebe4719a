import "server-only";
import { eq } from "drizzle-orm";
import type Stripe from "stripe";
import { db, type Tx } from "@/db/client";
import { paymentEvents } from "@/db/schema";
import { completeCheckoutPayment, releaseCheckout } from "@/db/queries/checkout";
import { env } from "@/lib/env";
import { revalidateCheckoutListingPages } from "@/lib/listings/listing-pages";
import { dispatchMail } from "@/lib/mail/outbox";
import { payments } from "./client";
import { refundLatePayments, sendSellerShares } from "./checkout";
import { handleReviewPaymentEvent } from "@/lib/reviews/payments";

// The provider's signed events: verified first, then recorded by id in the same transaction as their
// effect, so an event is applied exactly once however often it arrives and in whatever order.
//
// Order of arrival (each effect locks the checkout row and is conditional on its status):
// - `expired` / `payment_failed` after `completed`: the checkout is paid, nothing changes.
// - `completed` after `expired` / `payment_failed` (the hold was already given back, e.g. a declined
//   card then a good one on the same page, or the payment racing the expiry): the stock is taken
//   again, all lines or none, with the same conditional update as at checkout. If it is all still
//   there the checkout becomes paid as usual. If not, the checkout stays failed, its orders cancelled,
//   the buyer is e-mailed, and after commit each order is refunded in full (idempotency key per order;
//   the sweep retries a refund that fails). A later `completed` for it changes nothing.

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

type Effect = {
  outcome: string;
  mailIds?: string[];
  /** after commit: send the sellers' shares, or refund a late payment */
  followUp?: { kind: "transfers" | "refund"; checkoutId: string };
  /** after commit: the checkout whose stock moved, for its listing pages */
  stockMoved?: string;
};

function checkoutIdOf(object: { metadata?: Stripe.Metadata | null; client_reference_id?: string | null }): string | null {
  const id = object.metadata?.checkoutId ?? object.client_reference_id ?? null;
  return id && UUID.test(id) ? id : null;
}

function idOf(value: string | { id: string } | null | undefined): string | null {
  if (!value) return null;
  return typeof value === "string" ? value : value.id;
}

async function sessionPaid(tx: Tx, session: Stripe.Checkout.Session, event: Stripe.Event): Promise<Effect> {
  const checkoutId = checkoutIdOf(session);
  if (!checkoutId) return { outcome: "not-ours" };
  // A session can complete with the money still on its way (or only held); only "paid" counts.
  if (session.payment_status !== "paid") return { outcome: `completed-${session.payment_status}` };
  const result = await completeCheckoutPayment(tx, {
    checkoutId,
    sessionId: session.id,
    paymentIntentId: idOf(session.payment_intent),
    paidAt: new Date(event.created * 1000),
  });
  switch (result.kind) {
    case "paid":
      return { outcome: result.reReserved ? "paid-after-release" : "paid", mailIds: result.mailIds, followUp: { kind: "transfers", checkoutId }, ...(result.reReserved ? { stockMoved: checkoutId } : {}) };
    case "refund-needed":
      return { outcome: "paid-too-late-refunding", mailIds: result.mailIds, followUp: { kind: "refund", checkoutId } };
    default:
      return { outcome: result.kind };
  }
}

async function released(tx: Tx, checkoutId: string | null, to: "expired" | "failed"): Promise<Effect> {
  if (!checkoutId) return { outcome: "not-ours" };
  const result = await releaseCheckout(tx, checkoutId, to);
  return { outcome: result.released ? to : `unchanged-${result.status}`, ...(result.released ? { stockMoved: checkoutId } : {}) };
}

async function applyEvent(tx: Tx, event: Stripe.Event): Promise<Effect> {
  switch (event.type) {
    case "checkout.session.completed":
    case "checkout.session.async_payment_succeeded":
      return sessionPaid(tx, event.data.object, event);
    case "checkout.session.expired":
      return released(tx, checkoutIdOf(event.data.object), "expired");
    case "checkout.session.async_payment_failed":
      return released(tx, checkoutIdOf(event.data.object), "failed");
    case "payment_intent.payment_failed":
      return released(tx, checkoutIdOf(event.data.object), "failed");
    default:
      return { outcome: "ignored" };
  }
}

function objectIdOf(event: Stripe.Event): string | null {
  const object = event.data.object as { id?: unknown };
  return typeof object.id === "string" ? object.id : null;
}

export type WebhookResult = { status: number; body: Record<string, unknown> };

/** Processes one verified event; duplicates answer 200 and change nothing. */
export async function processEvent(event: Stripe.Event): Promise<WebhookResult> {
  const result = await db.transaction(async (tx) => {
    const inserted = await tx
      .insert(paymentEvents)
      .values({
        id: event.id,
        type: event.type,
        objectId: objectIdOf(event),
        createdAtProvider: new Date(event.created * 1000),
        payload: event as unknown as Record<string, unknown>,
      })
      .onConflictDoNothing()
      .returning({ id: paymentEvents.id });
    if (inserted.length === 0) return null;
    const effect = await applyEvent(tx, event);
    await tx.update(paymentEvents).set({ outcome: effect.outcome }).where(eq(paymentEvents.id, event.id));
    return effect;
  });
  // A paid review booking is completed in its own transaction, idempotently (the builder's return page
  // does the same). Nothing else retries it, so it runs for a redelivered event too, and a failure
  // answers 500 so the provider sends the event again.
  await handleReviewPaymentEvent(event);
  if (!result) return { status: 200, body: { received: true, duplicate: true } };

  // After commit. Failures here are logged and retried by the sweep; the event stays processed.
  if (result.mailIds?.length) await dispatchMail(result.mailIds);
  if (result.stockMoved) await revalidateCheckoutListingPages(result.stockMoved);
  try {
    if (result.followUp?.kind === "transfers") await sendSellerShares({ checkoutId: result.followUp.checkoutId });
    if (result.followUp?.kind === "refund") await refundLatePayments({ checkoutId: result.followUp.checkoutId });
  } catch (error) {
    console.error(`[webhooks] follow-up of ${event.id} failed; the sweep retries it:`, (error as Error).message);
  }
  return { status: 200, body: { received: true, outcome: result.outcome } };
}

/** `POST /api/webhooks/payments`: 400 without a valid signature (nothing written), 500 on our errors so the provider retries. */
export async function handlePaymentsWebhook(request: Request): Promise<Response> {
  const signature = request.headers.get("stripe-signature");
  if (!signature) return Response.json({ error: "missing_signature", message: "The Stripe-Signature header is missing." }, { status: 400 });
  const body = await request.text();
  let event: Stripe.Event;
  try {
    event = await payments().webhooks.constructEventAsync(body, signature, env().STRIPE_WEBHOOK_SECRET);
  } catch {
    return Response.json({ error: "bad_signature", message: "The signature does not match the body." }, { status: 400 });
  }
  try {
    const result = await processEvent(event);
    return Response.json(result.body, { status: result.status });
  } catch (error) {
    console.error(`[webhooks] ${event.type} ${event.id} failed:`, error);
    return Response.json({ error: "internal_error", message: "The event could not be processed; it will be retried." }, { status: 500 });
  }
}
