// The life of a payment intent: confirm (authorise, and capture unless manual),
// capture, cancel. Shared by the API and the hosted checkout page.
import { ApiError, invalidParam, unexpectedState } from "../api-error";
import type { CardOutcome } from "../card-outcomes";
import { changedFields, emitEvent, type FakeContext, type Origin } from "../context";
import { newId } from "../ids";
import type { Charge, PaymentError, PaymentIntent, PaymentIntentStatus } from "../types";
import { createTransfer } from "./transfers";

export function newPaymentIntent(
  ctx: FakeContext,
  fields: Omit<
    PaymentIntent,
    | "id" | "object" | "created" | "livemode" | "client_secret" | "status" | "amount_capturable" | "amount_received"
    | "canceled_at" | "cancellation_reason" | "confirmation_method" | "last_payment_error" | "latest_charge"
  >,
  origin: Origin,
): PaymentIntent {
  const id = newId("pi");
  const intent: PaymentIntent = {
    id,
    object: "payment_intent",
    created: ctx.clock.now(),
    livemode: false,
    client_secret: `${id}_secret_${newId("s").slice(2)}`,
    status: fields.payment_method ? "requires_confirmation" : "requires_payment_method",
    amount_capturable: 0,
    amount_received: 0,
    canceled_at: null,
    cancellation_reason: null,
    confirmation_method: "automatic",
    last_payment_error: null,
    latest_charge: null,
    ...fields,
  };
  ctx.store.state.paymentIntents[id] = intent;
  ctx.store.changed();
  emitEvent(ctx, origin, "payment_intent.created", intent);
  return intent;
}

const CONFIRMABLE: PaymentIntentStatus[] = ["requires_payment_method", "requires_confirmation"];

export function assertConfirmable(intent: PaymentIntent): void {
  if (!CONFIRMABLE.includes(intent.status)) {
    throw unexpectedState(
      "payment_intent",
      `This PaymentIntent's status is ${intent.status}; only a PaymentIntent in requires_payment_method or requires_confirmation can be confirmed.`,
    );
  }
}

export interface Billing {
  email: string | null;
  name: string | null;
}

/**
 * Runs the card through its test outcome. On a decline the intent goes back to
 * `requires_payment_method` with `last_payment_error`, and the error is returned.
 */
export function confirmPaymentIntent(
  ctx: FakeContext,
  intent: PaymentIntent,
  paymentMethod: string,
  outcome: CardOutcome,
  origin: Origin,
  billing: Billing = { email: null, name: null },
): PaymentError | null {
  assertConfirmable(intent);
  const now = ctx.clock.now();
  const approved = outcome.kind === "approved";
  const manual = intent.capture_method === "manual";
  const charge: Charge = {
    id: newId("ch"),
    object: "charge",
    amount: intent.amount,
    amount_captured: approved && !manual ? intent.amount : 0,
    amount_refunded: 0,
    application_fee_amount: intent.application_fee_amount,
    balance_transaction: approved && !manual ? newId("txn") : null,
    billing_details: billing,
    captured: approved && !manual,
    created: now,
    currency: intent.currency,
    description: intent.description,
    failure_code: approved ? null : "card_declined",
    failure_message: approved ? null : outcome.message,
    livemode: false,
    metadata: { ...intent.metadata },
    outcome: approved
      ? { network_status: "approved_by_network", reason: null, seller_message: "Payment complete.", type: "authorized" }
      : {
          network_status: "declined_by_network",
          reason: outcome.declineCode,
          seller_message: "The bank did not return any further details with this decline.",
          type: "issuer_declined",
        },
    paid: approved,
    payment_intent: intent.id,
    payment_method: paymentMethod,
    payment_method_details: { type: "card", card: { last4: outcome.last4, exp_month: 12, exp_year: 2034 } },
    refunded: false,
    status: approved ? "succeeded" : "failed",
    transfer: null,
    transfer_data: intent.transfer_data,
    transfer_group: intent.transfer_group,
  };
  ctx.store.state.charges[charge.id] = charge;
  const before = structuredClone(intent);
  intent.latest_charge = charge.id;

  if (outcome.kind === "declined") {
    const error: PaymentError = {
      type: "card_error",
      code: "card_declined",
      decline_code: outcome.declineCode,
      message: outcome.message,
      charge: charge.id,
      payment_method: { id: paymentMethod, object: "payment_method", type: "card" },
    };
    intent.status = "requires_payment_method";
    intent.payment_method = null;
    intent.last_payment_error = error;
    ctx.store.changed();
    emitEvent(ctx, origin, "charge.failed", charge);
    emitEvent(ctx, origin, "payment_intent.payment_failed", intent, changedFields(before, intent));
    return error;
  }

  intent.payment_method = paymentMethod;
  intent.last_payment_error = null;
  if (manual) {
    intent.status = "requires_capture";
    intent.amount_capturable = intent.amount;
    ctx.store.changed();
    emitEvent(ctx, origin, "charge.succeeded", charge);
    emitEvent(ctx, origin, "payment_intent.amount_capturable_updated", intent, changedFields(before, intent));
    return null;
  }
  intent.status = "succeeded";
  intent.amount_received = intent.amount;
  ctx.store.changed();
  emitEvent(ctx, origin, "charge.succeeded", charge);
  emitEvent(ctx, origin, "payment_intent.succeeded", intent, changedFields(before, intent));
  payDestination(ctx, intent, charge, origin);
  return null;
}

/** Thrown from the API when a confirmation is declined: HTTP 402 with the intent attached. */
export function cardError(error: PaymentError, intent: PaymentIntent): ApiError {
  return new ApiError(402, "card_error", error.message, error.code, undefined, {
    decline_code: error.decline_code,
    charge: error.charge,
    payment_intent: structuredClone(intent),
    payment_method: error.payment_method,
  });
}

export function capturePaymentIntent(
  ctx: FakeContext,
  intent: PaymentIntent,
  input: { amountToCapture?: number; applicationFeeAmount?: number; metadata?: Record<string, string> },
  origin: Origin,
): PaymentIntent {
  if (intent.status !== "requires_capture") {
    throw unexpectedState(
      "payment_intent",
      `This PaymentIntent could not be captured because it has a status of ${intent.status}. Only a PaymentIntent with one of the following statuses may be captured: requires_capture.`,
    );
  }
  const amount = input.amountToCapture ?? intent.amount_capturable;
  if (amount < 1 || amount > intent.amount_capturable) {
    throw invalidParam(
      "amount_to_capture",
      `The amount to capture (${amount}) must be between 1 and the capturable amount (${intent.amount_capturable}).`,
      "amount_too_large",
    );
  }
  const charge = intent.latest_charge ? ctx.store.state.charges[intent.latest_charge] : undefined;
  if (!charge) throw new ApiError(500, "api_error", "The authorised charge of this PaymentIntent is missing.");
  const before = structuredClone(intent);
  charge.captured = true;
  charge.amount_captured = amount;
  charge.balance_transaction = newId("txn");
  if (input.applicationFeeAmount !== undefined) {
    intent.application_fee_amount = input.applicationFeeAmount;
    charge.application_fee_amount = input.applicationFeeAmount;
  }
  if (input.metadata) intent.metadata = input.metadata;
  intent.status = "succeeded";
  intent.amount_capturable = 0;
  intent.amount_received = amount;
  ctx.store.changed();
  emitEvent(ctx, origin, "charge.captured", charge);
  emitEvent(ctx, origin, "payment_intent.succeeded", intent, changedFields(before, intent));
  payDestination(ctx, intent, charge, origin);
  return intent;
}

const CANCELABLE: PaymentIntentStatus[] = ["requires_payment_method", "requires_confirmation", "requires_capture"];

export function cancelPaymentIntent(
  ctx: FakeContext,
  intent: PaymentIntent,
  reason: string | null,
  origin: Origin,
): PaymentIntent {
  if (!CANCELABLE.includes(intent.status)) {
    throw unexpectedState(
      "payment_intent",
      `You cannot cancel this PaymentIntent because it has a status of ${intent.status}. Only a PaymentIntent with one of the following statuses may be canceled: ${CANCELABLE.join(", ")}.`,
    );
  }
  const before = structuredClone(intent);
  intent.status = "canceled";
  intent.canceled_at = ctx.clock.now();
  intent.cancellation_reason = reason;
  // Cancelling releases the hold: nothing is left to capture.
  intent.amount_capturable = 0;
  ctx.store.changed();
  emitEvent(ctx, origin, "payment_intent.canceled", intent, changedFields(before, intent));
  return intent;
}

// A destination charge moves the seller's part to the connected account once captured.
function payDestination(ctx: FakeContext, intent: PaymentIntent, charge: Charge, origin: Origin): void {
  if (!intent.transfer_data) return;
  const amount = intent.transfer_data.amount ?? charge.amount_captured - (intent.application_fee_amount ?? 0);
  if (amount <= 0) return;
  try {
    const transfer = createTransfer(
      ctx,
      {
        amount,
        currency: charge.currency,
        destination: intent.transfer_data.destination,
        transferGroup: intent.transfer_group,
        sourceTransaction: charge.id,
        metadata: {},
        description: null,
      },
      origin,
    );
    charge.transfer = transfer.id;
    ctx.store.changed();
  } catch (error) {
    // The destination was checked when the intent was made; if it has since been
    // disabled the payment still stands, as it would with the provider.
    ctx.log(`destination transfer for ${intent.id} failed: ${(error as Error).message}`);
  }
}
