// Checkout sessions: expiry, and paying one with a test card (from the hosted page or
// the JSON test hook). Creation lives with the API parameters in api/checkout-sessions.
import { outcomeForCardNumber, TEST_CARDS } from "../card-outcomes";
import { changedFields, emitEvent, type FakeContext, type Origin } from "../context";
import { newId } from "../ids";
import type { CheckoutSession, PaymentError, PaymentIntent } from "../types";
import { confirmPaymentIntent, newPaymentIntent } from "./charging";

export function expireSession(ctx: FakeContext, session: CheckoutSession, origin: Origin): CheckoutSession {
  const before = structuredClone(session);
  session.status = "expired";
  session.url = null;
  ctx.store.changed();
  emitEvent(ctx, origin, "checkout.session.expired", session, changedFields(before, session));
  return session;
}

/** Expires every open session whose `expires_at` has passed; run by a one-second timer. */
export function expireDueSessions(ctx: FakeContext, origin: Origin): number {
  const now = ctx.clock.now();
  let count = 0;
  for (const session of Object.values(ctx.store.state.checkoutSessions)) {
    if (session.status === "open" && session.expires_at <= now) {
      expireSession(ctx, session, origin);
      count += 1;
    }
  }
  return count;
}

export type PayResult =
  | { kind: "missing" }
  | { kind: "not_open"; session: CheckoutSession }
  | { kind: "unknown_card"; message: string; session: CheckoutSession }
  | { kind: "declined"; error: PaymentError; session: CheckoutSession; intent: PaymentIntent }
  | { kind: "paid"; session: CheckoutSession; intent: PaymentIntent };

export function paySession(
  ctx: FakeContext,
  sessionId: string,
  input: { card: string; email?: string | null; name?: string | null },
  origin: Origin,
): PayResult {
  const { state } = ctx.store;
  const session = state.checkoutSessions[sessionId];
  if (!session) return { kind: "missing" };
  if (session.status !== "open") return { kind: "not_open", session };
  const outcome = outcomeForCardNumber(input.card);
  if (!outcome) {
    const known = TEST_CARDS.map((card) => card.grouped).join(", ");
    return { kind: "unknown_card", message: `That is not one of the test card numbers (${known}).`, session };
  }
  const intentData = state.sessionIntentData[session.id];
  // One intent per session, reused when the buyer tries again after a decline.
  let intent = session.payment_intent ? state.paymentIntents[session.payment_intent] : undefined;
  if (!intent) {
    intent = newPaymentIntent(
      ctx,
      {
        allowed_payment_method_types: session.allowed_payment_method_types,
        amount: session.amount_total,
        currency: session.currency,
        application_fee_amount: intentData?.application_fee_amount ?? null,
        automatic_payment_methods: null,
        capture_method: intentData?.capture_method ?? "automatic",
        description: intentData?.description ?? null,
        metadata: { ...(intentData?.metadata ?? {}) },
        payment_method: null,
        payment_method_types: ["card"],
        receipt_email: intentData?.receipt_email ?? null,
        transfer_data: intentData?.transfer_data ?? null,
        transfer_group: intentData?.transfer_group ?? null,
      },
      origin,
    );
    session.payment_intent = intent.id;
  }
  const email = input.email || session.customer_email;
  const billing = { email: email ?? null, name: input.name || null };
  const error = confirmPaymentIntent(ctx, intent, newId("pm"), outcome, origin, billing);
  if (error) {
    ctx.store.changed();
    return { kind: "declined", error, session, intent };
  }
  const before = structuredClone(session);
  session.status = "complete";
  // Money only held (manual capture) is not yet received, so the session reads unpaid
  // until capture (the provider's documented meaning of payment_status, from memory).
  session.payment_status = intent.status === "succeeded" ? "paid" : "unpaid";
  session.customer_details = billing;
  session.url = null;
  ctx.store.changed();
  emitEvent(ctx, origin, "checkout.session.completed", session, changedFields(before, session));
  return { kind: "paid", session, intent };
}

export function successRedirect(session: CheckoutSession): string {
  return session.success_url.replace(/\{CHECKOUT_SESSION_ID\}/g, session.id);
}
