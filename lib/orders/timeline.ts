import type { OrderState } from "@/db/schema/orders";

// What happened to an order, oldest first, for the status timeline on the order pages.

export type TimelineInput = {
  createdAt: Date;
  paidAt: Date | null;
  shippedAt: Date | null;
  deliveredAt: Date | null;
  cancelledAt: Date | null;
  carrier: string | null;
  trackingRef: string | null;
  refunds: { createdAt: Date; amountMinor: number; settled: boolean }[];
  returns: { createdAt: Date; status: "requested" | "accepted" | "declined"; decidedAt: Date | null }[];
};

export type TimelineEvent = {
  at: Date;
  kind: "placed" | "paid" | "shipped" | "delivered" | "cancelled" | "refund" | "refund_pending" | "return_requested" | "return_accepted" | "return_declined";
  /** the order state this event stands for, when it is one; shown with the state badge */
  state?: OrderState;
  amountMinor?: number;
  detail?: string;
};

export function orderTimeline(input: TimelineInput): TimelineEvent[] {
  const events: TimelineEvent[] = [{ at: input.createdAt, kind: "placed", state: "awaiting_payment" }];
  if (input.paidAt) events.push({ at: input.paidAt, kind: "paid", state: "paid" });
  if (input.shippedAt) {
    const detail = [input.carrier, input.trackingRef].filter(Boolean).join(" · ");
    events.push({ at: input.shippedAt, kind: "shipped", state: "shipped", ...(detail ? { detail } : {}) });
  }
  if (input.deliveredAt) events.push({ at: input.deliveredAt, kind: "delivered", state: "delivered" });
  if (input.cancelledAt) events.push({ at: input.cancelledAt, kind: "cancelled", state: "cancelled" });
  for (const r of input.refunds) events.push({ at: r.createdAt, kind: r.settled ? "refund" : "refund_pending", amountMinor: r.amountMinor });
  for (const r of input.returns) {
    events.push({ at: r.createdAt, kind: "return_requested" });
    if (r.decidedAt && r.status !== "requested") events.push({ at: r.decidedAt, kind: r.status === "accepted" ? "return_accepted" : "return_declined" });
  }
  // Placing the order comes first by definition, even when a clock put the payment a moment earlier;
  // the rest is sorted stably, so events at the same instant keep the order they were listed in.
  const [placed, ...rest] = events;
  return [placed!, ...rest.map((e, i) => ({ e, i })).sort((a, b) => a.e.at.getTime() - b.e.at.getTime() || a.i - b.i).map(({ e }) => e)];
}
