import "server-only";
import type Stripe from "stripe";
import { quoteBooking, recordAuthorisedBooking, ReviewError } from "@/db/queries/reviews";
import type { SessionUser } from "@/lib/auth/access";
import { env } from "@/lib/env";
import type { BookingInput } from "@/lib/validations/reviews";
import { stageList } from "./labels";
import { heldPaymentFromSession, heldPaymentOf, openBookingCheckout, releaseHeldPayment, type HeldPayment } from "./provider";

// Paying for a review: the builder is sent to the provider's hosted page, which only authorises the
// price (manual capture). The booking itself is recorded once the provider reports the hold, from
// whichever arrives first: the builder's return to /reviews/booked (we read the session back from the
// provider with our key, never trusting the URL) or the provider's signed checkout.session.completed
// event, handed here by the payments webhook.

export const REVIEW_PAYMENT_DOWN = "The payment provider is not answering; nothing was charged. Please try again in a few minutes.";
// The hosted page stays payable for an hour; the provider accepts 30 minutes to 24 hours.
const CHECKOUT_LIFETIME_MS = 60 * 60 * 1000;

/** Checks and prices the booking, then opens the payment page; returns where to send the builder. */
export async function startBooking(builder: SessionUser, input: BookingInput, now = new Date()): Promise<{ url: string; reviewSessionId: string }> {
  const quote = await quoteBooking(builder, input);
  const base = env().APP_URL;
  let session: Stripe.Checkout.Session;
  try {
    session = await openBookingCheckout({
      metadata: {
        reviewSessionId: quote.reviewSessionId,
        logId: quote.logId,
        builderId: quote.builderId,
        reviewerId: quote.reviewerId,
        stages: quote.stages.join(","),
        priceMinor: String(quote.priceMinor),
        feeBps: String(quote.feeBps),
        message: quote.message,
      },
      priceMinor: quote.priceMinor,
      currency: quote.currency,
      email: builder.email,
      description: `“${quote.logTitle}” reviewed by ${quote.reviewerName}: ${stageList(quote.stages)}`,
      successUrl: `${base}/reviews/booked?session={CHECKOUT_SESSION_ID}`,
      cancelUrl: `${base}/reviews/new?log=${quote.logId}&reviewer=${encodeURIComponent(quote.reviewerId)}&cancelled=1`,
      expiresAt: new Date(now.getTime() + CHECKOUT_LIFETIME_MS),
    });
  } catch (error) {
    console.error("[reviews] no payment page for a booking:", (error as Error).message);
    throw new ReviewError(503, REVIEW_PAYMENT_DOWN);
  }
  if (!session.url) throw new ReviewError(503, REVIEW_PAYMENT_DOWN);
  return { url: session.url, reviewSessionId: quote.reviewSessionId };
}

export type BookingCompletion =
  | { kind: "booked"; sessionId: string }
  /** not paid (yet), or the provider could not be asked */
  | { kind: "pending" }
  /** paid, but the booking could not stand; the hold is released */
  | { kind: "refused"; message: string }
  | { kind: "not-ours" };

async function complete(held: HeldPayment | null, expectedBuilderId?: string): Promise<BookingCompletion> {
  if (!held) return { kind: "pending" };
  const reviewSessionId = held.metadata.reviewSessionId;
  if (!reviewSessionId) return { kind: "not-ours" };
  if (expectedBuilderId !== undefined && held.metadata.builderId !== expectedBuilderId) return { kind: "not-ours" };
  const recorded = await recordAuthorisedBooking(held);
  if (recorded.kind !== "refused") return { kind: "booked", sessionId: recorded.sessionId };
  const released = await releaseHeldPayment(held.paymentIntentId, reviewSessionId);
  if (released.kind !== "done") console.error(`[reviews] refused booking ${reviewSessionId}: its hold could not be released yet:`, released.message);
  return { kind: "refused", message: `${recorded.message} The amount held on your card is released.` };
}

/** The builder's return from the payment page: only their own, paid session becomes a booking. */
export async function completeBookingFromReturn(checkoutSessionId: string, builderId: string): Promise<BookingCompletion> {
  if (!/^cs_[A-Za-z0-9_]+$/.test(checkoutSessionId)) return { kind: "not-ours" };
  let held: HeldPayment | null;
  try {
    held = await heldPaymentOf(checkoutSessionId);
  } catch (error) {
    console.error("[reviews] could not read a booking's payment session:", (error as Error).message);
    return { kind: "pending" };
  }
  return complete(held, builderId);
}

/**
 * For the payments webhook (already verified and recorded by it): a completed checkout whose
 * metadata names a review session becomes that booking. Anything else is not handled here.
 * Safe to call more than once for one event; the session id is the booking's primary key.
 */
export async function handleReviewPaymentEvent(event: Stripe.Event): Promise<{ handled: boolean; outcome: string }> {
  if (event.type !== "checkout.session.completed" && event.type !== "checkout.session.async_payment_succeeded") return { handled: false, outcome: "not-ours" };
  const session = event.data.object;
  if (!session.metadata?.reviewSessionId) return { handled: false, outcome: "not-ours" };
  const result = await complete(await heldPaymentFromSession(session));
  return { handled: true, outcome: result.kind };
}
