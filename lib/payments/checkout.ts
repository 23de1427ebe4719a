import "server-only";
import type Stripe from "stripe";
import {
  abandonCheckout,
  buyerCheckout,
  cancelOpenCheckout,
  CheckoutRefusal,
  createCheckout,
  expireOverdueCheckout,
  lateRefundsDue,
  overdueCheckouts,
  recordLateRefund,
  recordProviderSession,
  recordTransfer,
  transfersDue,
  type CreatedCheckout,
} from "@/db/queries/checkout";
import { SWEEP_GRACE_MS } from "@/lib/checkout/reservation";
import { env } from "@/lib/env";
import type { StartCheckoutInput } from "@/lib/validations/checkout";
import { payments } from "./client";

// The checkout's calls to the payment provider: open the hosted session, close it, send each seller's
// share once paid, refund a payment that arrived too late. State changes live in db/queries/checkout.ts.

export const PROVIDER_DOWN_MESSAGE = "The payment provider is not answering; nothing was charged and your cart is unchanged. Please try again in a few minutes.";

/** What we ask the provider for: our prices (re-read in the checkout's transaction), our expiry, our ids. */
export function sessionParams(checkout: CreatedCheckout, appUrl: string): Stripe.Checkout.SessionCreateParams {
  const currency = checkout.currency.toLowerCase();
  return {
    mode: "payment",
    customer_email: checkout.email,
    client_reference_id: checkout.checkoutId,
    metadata: { checkoutId: checkout.checkoutId },
    line_items: checkout.lines.map((line) => ({
      quantity: line.quantity,
      price_data: {
        currency,
        unit_amount: line.unitPriceMinor,
        product_data: { name: line.title, description: `Sold by ${line.shopName}` },
      },
    })),
    success_url: `${appUrl}/checkout/done?session={CHECKOUT_SESSION_ID}`,
    cancel_url: `${appUrl}/api/checkout/cancel?checkout=${checkout.checkoutId}`,
    // The session ends with the hold on the stock, so nobody pays for stock that was given back.
    expires_at: Math.floor(checkout.expiresAt.getTime() / 1000),
    payment_intent_data: { transfer_group: checkout.checkoutId, metadata: { checkoutId: checkout.checkoutId } },
  };
}

/** One session per checkout: the checkout id is the idempotency key, so a retried call never opens a second. */
export async function openPaymentSession(checkout: CreatedCheckout): Promise<Stripe.Checkout.Session> {
  return payments().checkout.sessions.create(sessionParams(checkout, env().APP_URL), { idempotencyKey: checkout.checkoutId });
}

export type StartCheckoutResult =
  | { ok: true; url: string; checkoutId: string }
  | { ok: false; code: CheckoutRefusal["code"] | "provider"; message: string; fieldErrors: Record<string, string[]> };

/**
 * The buyer's "Pay": the checkout and its reservations commit first; then the provider's session.
 * If the provider is down or refuses, the reservation is released and the checkout marked failed,
 * and the cart (never touched before payment) is as it was.
 */
export async function startCheckout(buyer: { id: string; email: string }, input: StartCheckoutInput): Promise<StartCheckoutResult> {
  let created: CreatedCheckout;
  try {
    created = await createCheckout({ buyer, ...input });
  } catch (error) {
    if (error instanceof CheckoutRefusal) return { ok: false, code: error.code, message: error.message, fieldErrors: error.fieldErrors };
    throw error;
  }
  let session: Stripe.Checkout.Session | undefined;
  try {
    session = await openPaymentSession(created);
    if (!session.url) throw new Error(`session ${session.id} came back without a URL`);
    await recordProviderSession(created.checkoutId, session.id);
    return { ok: true, url: session.url, checkoutId: created.checkoutId };
  } catch (error) {
    console.error(`[checkout] no payment session for ${created.checkoutId}; releasing its stock:`, (error as Error).message);
    if (session) await expireSessionQuietly(session.id);
    await abandonCheckout(created.checkoutId);
    return { ok: false, code: "provider", message: PROVIDER_DOWN_MESSAGE, fieldErrors: {} };
  }
}

async function expireSessionQuietly(sessionId: string): Promise<Stripe.Checkout.Session | null> {
  try {
    return await payments().checkout.sessions.expire(sessionId);
  } catch {
    // Already complete or expired, or the provider is down: the caller looks at the session itself.
    return null;
  }
}

/**
 * The buyer came back through the provider's cancel link. The session is expired at the provider
 * (so it cannot be paid later) and the stock released now. If it turns out to be paid already, the
 * buyer goes to the confirmation page instead.
 */
export async function cancelCheckout(checkoutId: string, buyerId: string): Promise<{ redirectTo: string }> {
  const checkout = await buyerCheckout(checkoutId, buyerId);
  if (!checkout) return { redirectTo: "/cart" };
  if (checkout.status === "paid" && checkout.sessionId) return { redirectTo: `/checkout/done?session=${encodeURIComponent(checkout.sessionId)}` };
  if (checkout.sessionId) {
    const expired = await expireSessionQuietly(checkout.sessionId);
    if (!expired) {
      const current = await payments()
        .checkout.sessions.retrieve(checkout.sessionId)
        .catch(() => null);
      if (current?.status === "complete") return { redirectTo: `/checkout/done?session=${encodeURIComponent(checkout.sessionId)}` };
    }
  }
  await cancelOpenCheckout(checkoutId);
  return { redirectTo: "/cart?cancelled=1" };
}

async function chargeOf(paymentIntentId: string, cache: Map<string, string | null>): Promise<string | null> {
  if (!cache.has(paymentIntentId)) {
    const intent = await payments().paymentIntents.retrieve(paymentIntentId);
    const charge = typeof intent.latest_charge === "string" ? intent.latest_charge : (intent.latest_charge?.id ?? null);
    cache.set(paymentIntentId, intent.status === "succeeded" ? charge : null);
  }
  return cache.get(paymentIntentId) ?? null;
}

/**
 * Sends each paid order's seller share to the seller's connected account, funded by the buyer's
 * charge. The order id keys the call, so a retry after a lost answer never pays twice. A failure is
 * logged and left for the sweep; it never touches the paid state.
 */
export async function sendSellerShares(filter: { checkoutId?: string } = {}): Promise<{ sent: number; failed: number }> {
  const charges = new Map<string, string | null>();
  let sent = 0;
  let failed = 0;
  for (const due of await transfersDue(filter)) {
    try {
      const charge = await chargeOf(due.paymentIntentId, charges);
      if (!charge) throw new Error(`payment ${due.paymentIntentId} has no succeeded charge yet`);
      const transfer = await payments().transfers.create(
        {
          amount: due.sellerShareMinor,
          currency: due.currency.toLowerCase(),
          destination: due.destination,
          transfer_group: due.checkoutId,
          source_transaction: charge,
          metadata: { orderId: due.orderId, orderNumber: due.number },
        },
        { idempotencyKey: `transfer-${due.orderId}` },
      );
      await recordTransfer(due.orderId, transfer.id);
      sent += 1;
    } catch (error) {
      failed += 1;
      console.error(`[checkout] transfer for order ${due.number} failed; the sweep retries it:`, (error as Error).message);
    }
  }
  return { sent, failed };
}

/** Refunds, in full and once per order, a payment that arrived after its stock was sold to someone else. */
export async function refundLatePayments(filter: { checkoutId?: string } = {}): Promise<{ refunded: number; failed: number }> {
  let refunded = 0;
  let failed = 0;
  for (const due of await lateRefundsDue(filter)) {
    try {
      const refund = await payments().refunds.create(
        { payment_intent: due.paymentIntentId, amount: due.subtotalMinor, metadata: { orderId: due.orderId, checkoutId: due.checkoutId } },
        { idempotencyKey: `late-refund-${due.orderId}` },
      );
      await recordLateRefund(due.orderId, due.subtotalMinor, refund.id);
      refunded += 1;
    } catch (error) {
      failed += 1;
      console.error(`[checkout] refund for order ${due.orderId} failed; the sweep retries it:`, (error as Error).message);
    }
  }
  return { refunded, failed };
}

/**
 * The scheduled sweep: holds whose expiry event never came are released (the session is closed at the
 * provider first, so it cannot be paid afterwards), and transfers or refunds that failed are retried.
 */
export async function sweepCheckouts(now = new Date()): Promise<{ expired: number; transfers: number; refunds: number }> {
  let expired = 0;
  for (const due of await overdueCheckouts(now, SWEEP_GRACE_MS)) {
    if (due.sessionId) {
      const closed = await expireSessionQuietly(due.sessionId);
      // Paid meanwhile, or the provider did not answer: its own event settles it, or the next sweep does.
      if (!closed) {
        const current = await payments()
          .checkout.sessions.retrieve(due.sessionId)
          .catch(() => null);
        if (!current || current.status === "complete" || current.status === "open") continue;
      }
    }
    if ((await expireOverdueCheckout(due.id)).released) expired += 1;
  }
  const transfers = await sendSellerShares();
  const refunds = await refundLatePayments();
  return { expired, transfers: transfers.sent, refunds: refunds.refunded };
}
