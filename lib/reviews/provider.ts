import "server-only";
import Stripe from "stripe";
import { payments } from "@/lib/payments/client";
import type { ProviderOutcome } from "@/lib/payments/refunds";

// The payment provider's side of a review session: the booking's hosted checkout (manual capture,
// so the money is only held), and capture, release, the reviewer's transfer, refunds. Every call that
// moves money carries an idempotency key made from our own ids, so a retry never moves it twice.

export type { ProviderOutcome } from "@/lib/payments/refunds";

export const reviewIdempotencyKeys = {
  checkout: (reviewSessionId: string) => `fluxyard-review-checkout-${reviewSessionId}`,
  capture: (reviewSessionId: string) => `fluxyard-review-capture-${reviewSessionId}`,
  release: (reviewSessionId: string) => `fluxyard-review-release-${reviewSessionId}`,
  transfer: (reviewSessionId: string) => `fluxyard-review-transfer-${reviewSessionId}`,
  refund: (disputeId: string) => `fluxyard-review-refund-${disputeId}`,
  reversal: (disputeId: string) => `fluxyard-review-reversal-${disputeId}`,
};

/** A 400, 402 or 404 is the provider's final word on this request; anything else might still have gone through. */
function classify(error: unknown): { kind: "refused" | "unknown"; message: string } {
  if (error instanceof Stripe.errors.StripeError) {
    const status = error.statusCode ?? 0;
    const final = (status === 400 || status === 402 || status === 404) && !(error instanceof Stripe.errors.StripeIdempotencyError);
    return { kind: final ? "refused" : "unknown", message: error.message };
  }
  return { kind: "unknown", message: error instanceof Error ? error.message : String(error) };
}

function idOf(value: string | { id: string } | null | undefined): string | null {
  if (!value) return null;
  return typeof value === "string" ? value : value.id;
}

/** What the booking's payment session carries, so the authorised payment can be matched to a booking without trusting the browser. */
export type BookingMetadata = {
  reviewSessionId: string;
  logId: string;
  builderId: string;
  reviewerId: string;
  stages: string;
  priceMinor: string;
  feeBps: string;
  message: string;
};

export type BookingCheckoutRequest = {
  metadata: BookingMetadata;
  priceMinor: number;
  currency: string;
  email: string | null;
  description: string;
  successUrl: string;
  cancelUrl: string;
  expiresAt: Date;
};

/** A hosted payment page that only authorises (manual capture); the money moves when the report is delivered. */
export async function openBookingCheckout(request: BookingCheckoutRequest): Promise<Stripe.Checkout.Session> {
  const metadata = { ...request.metadata };
  return payments().checkout.sessions.create(
    {
      mode: "payment",
      ...(request.email ? { customer_email: request.email } : {}),
      metadata,
      line_items: [
        {
          quantity: 1,
          price_data: { currency: request.currency.toLowerCase(), unit_amount: request.priceMinor, product_data: { name: "Bring-up review", description: request.description } },
        },
      ],
      success_url: request.successUrl,
      cancel_url: request.cancelUrl,
      expires_at: Math.floor(request.expiresAt.getTime() / 1000),
      payment_intent_data: { capture_method: "manual", transfer_group: `review-${metadata.reviewSessionId}`, metadata },
    },
    { idempotencyKey: reviewIdempotencyKeys.checkout(metadata.reviewSessionId) },
  );
}

export type HeldPayment = { sessionId: string; paymentIntentId: string; amountMinor: number; currency: string; metadata: Record<string, string> };

/**
 * Reads a booking's payment session back from the provider. Returns the held payment only when the
 * session is complete and its intent authorised and waiting for capture; null otherwise.
 */
export async function heldPaymentOf(sessionId: string): Promise<HeldPayment | null> {
  const session = await payments().checkout.sessions.retrieve(sessionId, { expand: ["payment_intent"] });
  return heldPaymentFromSession(session);
}

export async function heldPaymentFromSession(session: Stripe.Checkout.Session): Promise<HeldPayment | null> {
  if (session.status !== "complete") return null;
  const intentId = idOf(session.payment_intent);
  if (!intentId) return null;
  const intent = typeof session.payment_intent === "object" && session.payment_intent ? session.payment_intent : await payments().paymentIntents.retrieve(intentId);
  if (intent.status !== "requires_capture" || intent.capture_method !== "manual") return null;
  return { sessionId: session.id, paymentIntentId: intent.id, amountMinor: intent.amount_capturable, currency: intent.currency.toUpperCase(), metadata: { ...(session.metadata ?? {}) } };
}

/** Captures the held payment once; a repeat (same key, or an intent already captured) reports it done. */
export async function captureHeldPayment(paymentIntentId: string, reviewSessionId: string): Promise<ProviderOutcome<{ chargeId: string | null }>> {
  try {
    const intent = await payments().paymentIntents.capture(paymentIntentId, {}, { idempotencyKey: reviewIdempotencyKeys.capture(reviewSessionId) });
    return { kind: "done", value: { chargeId: idOf(intent.latest_charge) } };
  } catch (error) {
    const outcome = classify(error);
    if (outcome.kind === "refused") {
      // Captured by an earlier attempt whose answer was lost: the intent says so.
      const intent = await payments()
        .paymentIntents.retrieve(paymentIntentId)
        .catch(() => null);
      if (intent?.status === "succeeded") return { kind: "done", value: { chargeId: idOf(intent.latest_charge) } };
    }
    return outcome;
  }
}

/** Releases the hold (cancels the intent); an intent already cancelled counts as released. */
export async function releaseHeldPayment(paymentIntentId: string, reviewSessionId: string): Promise<ProviderOutcome<null>> {
  try {
    await payments().paymentIntents.cancel(paymentIntentId, { cancellation_reason: "abandoned" }, { idempotencyKey: reviewIdempotencyKeys.release(reviewSessionId) });
    return { kind: "done", value: null };
  } catch (error) {
    const outcome = classify(error);
    if (outcome.kind === "refused") {
      const intent = await payments()
        .paymentIntents.retrieve(paymentIntentId)
        .catch(() => null);
      if (intent?.status === "canceled") return { kind: "done", value: null };
    }
    return outcome;
  }
}

export type ShareTransfer = { reviewSessionId: string; paymentIntentId: string; amountMinor: number; currency: string; destination: string };

/** The reviewer's share, funded by the captured charge of this session. */
export async function transferReviewerShare(request: ShareTransfer): Promise<ProviderOutcome<{ id: string }>> {
  try {
    const intent = await payments().paymentIntents.retrieve(request.paymentIntentId);
    const charge = idOf(intent.latest_charge);
    if (intent.status !== "succeeded" || !charge) return { kind: "unknown", message: `payment ${intent.id} is ${intent.status}, not captured yet` };
    const transfer = await payments().transfers.create(
      {
        amount: request.amountMinor,
        currency: request.currency.toLowerCase(),
        destination: request.destination,
        source_transaction: charge,
        transfer_group: `review-${request.reviewSessionId}`,
        metadata: { reviewSessionId: request.reviewSessionId },
      },
      { idempotencyKey: reviewIdempotencyKeys.transfer(request.reviewSessionId) },
    );
    return { kind: "done", value: { id: transfer.id } };
  } catch (error) {
    return classify(error);
  }
}

export async function refundReviewPayment(request: { disputeId: string; reviewSessionId: string; paymentIntentId: string; amountMinor: number }): Promise<ProviderOutcome<{ id: string }>> {
  try {
    const refund = await payments().refunds.create(
      {
        payment_intent: request.paymentIntentId,
        amount: request.amountMinor,
        reason: "requested_by_customer",
        metadata: { reviewSessionId: request.reviewSessionId, disputeId: request.disputeId },
      },
      { idempotencyKey: reviewIdempotencyKeys.refund(request.disputeId) },
    );
    if (refund.status === "failed" || refund.status === "canceled") return { kind: "refused", message: `The refund ${refund.id} ${refund.status}.` };
    return { kind: "done", value: { id: refund.id } };
  } catch (error) {
    return classify(error);
  }
}

/** Takes the reviewer's part of a refund back from the transfer of their share. */
export async function reverseReviewerShare(request: { disputeId: string; transferId: string; amountMinor: number }): Promise<ProviderOutcome<{ id: string }>> {
  try {
    const reversal = await payments().transfers.createReversal(
      request.transferId,
      { amount: request.amountMinor, metadata: { disputeId: request.disputeId } },
      { idempotencyKey: reviewIdempotencyKeys.reversal(request.disputeId) },
    );
    return { kind: "done", value: { id: reversal.id } };
  } catch (error) {
    return classify(error);
  }
}
