import "server-only";
import Stripe from "stripe";
import { payments } from "./client";

// The two provider calls behind a refund: money back to the buyer's card, and the seller's part
// taken back from their transfer. Both carry an idempotency key derived from our refund row's id,
// so however often a call is repeated (a timeout, a retry by the sweep) the money moves once.

export type ProviderOutcome<T> =
  | { kind: "done"; value: T }
  /** the provider answered and refused this request; nothing moved */
  | { kind: "refused"; message: string }
  /** no answer, or one that may change on a retry (outage, rate limit, conflict): it may or may not have happened */
  | { kind: "unknown"; message: string };

/** A 400, 402 or 404 is the provider's final word on this request; anything else might still have gone through. */
function classify(error: unknown): { kind: "refused" | "unknown"; message: string } {
  if (error instanceof Stripe.errors.StripeError) {
    const status = error.statusCode ?? 0;
    const final = (status === 400 || status === 402 || status === 404) && !(error instanceof Stripe.errors.StripeIdempotencyError);
    return { kind: final ? "refused" : "unknown", message: error.message };
  }
  return { kind: "unknown", message: error instanceof Error ? error.message : String(error) };
}

export function refundIdempotencyKey(refundId: string): string {
  return `fluxyard-refund-${refundId}`;
}

export function reversalIdempotencyKey(refundId: string): string {
  return `fluxyard-reversal-${refundId}`;
}

export type RefundRequest = { paymentIntentId: string; amountMinor: number; orderId: string; refundId: string };

/** Refunds `amountMinor` of the checkout's payment; repeating it with the same refund id refunds nothing more. */
export async function createProviderRefund(request: RefundRequest): Promise<ProviderOutcome<{ id: string }>> {
  try {
    const refund = await payments().refunds.create(
      {
        payment_intent: request.paymentIntentId,
        amount: request.amountMinor,
        reason: "requested_by_customer",
        metadata: { orderId: request.orderId, refundId: request.refundId },
      },
      { idempotencyKey: refundIdempotencyKey(request.refundId) },
    );
    if (refund.status === "failed" || refund.status === "canceled") return { kind: "refused", message: `The refund ${refund.id} ${refund.status}.` };
    return { kind: "done", value: { id: refund.id } };
  } catch (error) {
    return classify(error);
  }
}

/**
 * A refund we asked for earlier and never heard back about: the provider keeps idempotency keys
 * for a day, so a late retry first looks for it by the refund id in its metadata.
 */
export async function findProviderRefund(paymentIntentId: string, refundId: string): Promise<ProviderOutcome<{ id: string } | null>> {
  try {
    for await (const refund of payments().refunds.list({ payment_intent: paymentIntentId, limit: 100 })) {
      if (refund.metadata?.refundId === refundId && refund.status !== "failed" && refund.status !== "canceled") {
        return { kind: "done", value: { id: refund.id } };
      }
    }
    return { kind: "done", value: null };
  } catch (error) {
    return classify(error);
  }
}

export type ReversalRequest = { transferId: string; amountMinor: number; orderId: string; refundId: string };

/** Takes the seller's part of a refund back from the transfer of their share. */
export async function reverseSellerShare(request: ReversalRequest): Promise<ProviderOutcome<{ id: string }>> {
  try {
    const reversal = await payments().transfers.createReversal(
      request.transferId,
      { amount: request.amountMinor, metadata: { orderId: request.orderId, refundId: request.refundId } },
      { idempotencyKey: reversalIdempotencyKey(request.refundId) },
    );
    return { kind: "done", value: { id: reversal.id } };
  } catch (error) {
    return classify(error);
  }
}
