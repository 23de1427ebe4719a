import { invalidParam, unexpectedState } from "../api-error";
import { changedFields, emitEvent, type FakeContext, type Origin } from "../context";
import { newId } from "../ids";
import { formatMinor } from "../money";
import type { Charge, Refund } from "../types";

/** Refunds part or all of a captured charge; the total never exceeds what was captured. */
export function refundCharge(
  ctx: FakeContext,
  charge: Charge,
  input: { amount?: number; reason: Refund["reason"]; metadata: Record<string, string> },
  origin: Origin,
): Refund {
  if (charge.status !== "succeeded") {
    throw invalidParam("charge", `Charge ${charge.id} did not succeed and cannot be refunded.`, "charge_not_refundable");
  }
  if (!charge.captured) {
    throw unexpectedState(
      "payment_intent",
      `Charge ${charge.id} has not been captured. Cancel its PaymentIntent to release the authorisation instead.`,
    );
  }
  const remaining = charge.amount_captured - charge.amount_refunded;
  if (remaining === 0) {
    throw invalidParam("charge", `Charge ${charge.id} has already been refunded.`, "charge_already_refunded");
  }
  const amount = input.amount ?? remaining;
  if (amount > remaining) {
    throw invalidParam(
      "amount",
      `Refund amount (${formatMinor(amount, charge.currency)}) is greater than unrefunded amount on charge (${formatMinor(remaining, charge.currency)})`,
      "amount_too_large",
    );
  }
  const before = structuredClone(charge);
  const refund: Refund = {
    id: newId("re"),
    object: "refund",
    amount,
    balance_transaction: newId("txn"),
    charge: charge.id,
    created: ctx.clock.now(),
    currency: charge.currency,
    metadata: input.metadata,
    payment_intent: charge.payment_intent,
    reason: input.reason,
    status: "succeeded",
  };
  ctx.store.state.refunds[refund.id] = refund;
  charge.amount_refunded += amount;
  charge.refunded = charge.amount_refunded === charge.amount_captured;
  ctx.store.changed();
  emitEvent(ctx, origin, "refund.created", refund);
  emitEvent(ctx, origin, "charge.refunded", charge, changedFields(before, charge));
  return refund;
}
