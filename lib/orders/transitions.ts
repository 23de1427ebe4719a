import type { OrderState } from "@/db/schema/orders";

// The life of one seller's order as pure rules; db/queries/orders.ts applies them in a transaction
// with a conditional update on the state, so two clicks never do a thing twice.
//
//   awaiting payment ──(verified payment, checkout)──▶ paid ──ship (seller)──▶ shipped ──confirm (buyer) / mark (seller)──▶ delivered
//                                                     │                          │                                           │
//                                                     └─cancel (seller)─▶ cancelled   (full refund of the lines, stock back)  │
//   paid / shipped / delivered ──refunds reach the subtotal──▶ refunded                                                    │
//   shipped / delivered: the buyer asks for a return within the seller's window; the seller accepts (refund) or declines ──┘

export const ORDER_ACTIONS = [
  "ship",
  "confirm_delivery",
  "mark_delivered",
  "cancel",
  "refund",
  "request_return",
  "accept_return",
  "decline_return",
] as const;
export type OrderAction = (typeof ORDER_ACTIONS)[number];

export type OrderParty = "buyer" | "seller";

type Rule = { from: readonly OrderState[]; by: OrderParty; to?: OrderState };

export const ORDER_RULES: Record<OrderAction, Rule> = {
  ship: { from: ["paid"], by: "seller", to: "shipped" },
  confirm_delivery: { from: ["shipped"], by: "buyer", to: "delivered" },
  mark_delivered: { from: ["shipped"], by: "seller", to: "delivered" },
  cancel: { from: ["paid"], by: "seller", to: "cancelled" },
  // A cancelled order may still take a refund of what its cancellation could not refund.
  refund: { from: ["paid", "shipped", "delivered", "cancelled"], by: "seller" },
  request_return: { from: ["shipped", "delivered"], by: "buyer" },
  // A request still waits for an answer after the seller refunded everything line by line.
  accept_return: { from: ["shipped", "delivered", "refunded"], by: "seller" },
  decline_return: { from: ["shipped", "delivered", "refunded"], by: "seller" },
};

/** States that become `refunded` once the refunded total reaches the order's subtotal. */
export const REFUNDABLE_TO_REFUNDED: readonly OrderState[] = ["paid", "shipped", "delivered"];

export const ORDER_STATE_WORDS: Record<OrderState, string> = {
  awaiting_payment: "awaiting payment",
  paid: "paid",
  shipped: "shipped",
  delivered: "delivered",
  refunded: "refunded",
  cancelled: "cancelled",
};

const ACTION_WORDS: Record<OrderAction, string> = {
  ship: "marked shipped",
  confirm_delivery: "confirmed as delivered",
  mark_delivered: "marked delivered",
  cancel: "cancelled",
  refund: "refunded",
  request_return: "returned",
  accept_return: "given a return decision",
  decline_return: "given a return decision",
};

export type OrderFacts = { state: OrderState; buyerId: string; sellerId: string };

export type OrderPlan =
  | { ok: true; party: OrderParty; from: OrderState; to: OrderState }
  | { ok: false; status: 403 | 404 | 409; message: string };

/** Which side of the order a person is on; null when they are neither (the order is not theirs to see). */
export function partyOf(order: Pick<OrderFacts, "buyerId" | "sellerId">, actorId: string): OrderParty | null {
  if (actorId === order.sellerId) return "seller";
  if (actorId === order.buyerId) return "buyer";
  return null;
}

export function planOrderAction({ order, action, actorId }: { order: OrderFacts; action: OrderAction; actorId: string }): OrderPlan {
  const rule = ORDER_RULES[action];
  const party = partyOf(order, actorId);
  // Someone else's order does not exist as far as they are concerned.
  if (party === null) return { ok: false, status: 404, message: "No such order." };
  if (party !== rule.by) {
    return { ok: false, status: 403, message: rule.by === "seller" ? "Only the seller of this order can do that." : "Only the buyer of this order can do that." };
  }
  if (!rule.from.includes(order.state)) {
    return { ok: false, status: 409, message: `This order is ${ORDER_STATE_WORDS[order.state]}, so it cannot be ${ACTION_WORDS[action]} now.` };
  }
  return { ok: true, party, from: order.state, to: rule.to ?? order.state };
}

/** The state once `refundedMinor` of `subtotalMinor` has gone back to the buyer. */
export function stateAfterRefund(state: OrderState, subtotalMinor: number, refundedMinor: number): OrderState {
  if (refundedMinor > subtotalMinor) throw new RangeError(`refunded ${refundedMinor} exceeds the subtotal ${subtotalMinor}`);
  return refundedMinor === subtotalMinor && REFUNDABLE_TO_REFUNDED.includes(state) ? "refunded" : state;
}
