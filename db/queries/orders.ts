import "server-only";
import { and, asc, desc, eq, inArray, isNotNull, isNull, lt, ne, sql, type SQL } from "drizzle-orm";
import { alias } from "drizzle-orm/pg-core";
import { db, type Executor, type Tx } from "@/db/client";
import {
  auditLog,
  checkouts,
  listings,
  orderAcknowledgements,
  orderLines,
  orders,
  platformSettings,
  refunds,
  returnRequests,
  sellerProfiles,
  users,
  type Order,
  type OrderState,
} from "@/db/schema";
import { env } from "@/lib/env";
import { formatMoney } from "@/lib/format/money";
import { dispatchMail, enqueueMail } from "@/lib/mail/outbox";
import type { MailTemplate } from "@/emails/registry";
import { OrderError } from "@/lib/orders/errors";
import { checkLineRefund, lineTotalMinor, remainingRefundableMinor } from "@/lib/orders/refund-limits";
import { splitRefund } from "@/lib/orders/refund-split";
import { isReturnsWindowOpen, returnsWindowClosesAt } from "@/lib/orders/returns-window";
import { planOrderAction, stateAfterRefund, type OrderAction, type OrderParty } from "@/lib/orders/transitions";
import { createProviderRefund, findProviderRefund, reverseSellerShare } from "@/lib/payments/refunds";
import type { SellerOrdersQuery } from "@/lib/validations/orders";
import { orderCancelledMail } from "@/emails/orders/order-cancelled";
import { orderRefundedMail } from "@/emails/orders/order-refunded";
import { orderShippedMail } from "@/emails/orders/order-shipped";
import { returnAcceptedMail } from "@/emails/orders/return-accepted";
import { returnDeclinedMail } from "@/emails/orders/return-declined";
import { returnRequestedMail } from "@/emails/orders/return-requested";

// Orders after the sale: reads for the buyer's and the seller's pages, and every change of state.
//
// Each change runs in one transaction with a conditional update on the state (or a row lock), writes
// its audit entry and queues its e-mail in the outbox; mail is dispatched after commit.
//
// Refunds, in this order, so that a provider failure never shows money as refunded that was not and a
// retry never refunds twice:
//   1. In a transaction (the order row locked): check the amount against what is left of the line,
//      counting every refund row already recorded (settled or not), and insert the refund row. A row
//      without a provider refund id is a *pending* refund: it holds its amount against the line, but
//      nothing is counted as refunded yet.
//   2. After commit: ask the provider, with the refund row's id as the idempotency key.
//   3. On success, in a second transaction: set the provider's refund id on the row (only if still
//      unset, so a second settlement does nothing), add the amount to the line's and the order's
//      refunded totals, move the order to `refunded` once the subtotal is reached, write the split
//      (fee / seller's part) to the audit log and queue the buyer's e-mail. Then reverse the seller's
//      part of their transfer (idempotency key from the same id).
//   4. If the provider refuses (a 400/402/404: nothing moved), delete the pending row and audit the
//      failure. If it does not answer, keep the row pending: `settlePendingRefunds` (run by the worker)
//      retries with the same key, after first looking the refund up by its metadata in case the key
//      has expired; it also retries transfer reversals that did not go through.

export { OrderError };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
/** What a seller's returns window is when their profile is missing: the schema's default. */
const DEFAULT_RETURNS_WINDOW_DAYS = 30;

const money = (minor: number, currency: string) => formatMoney(minor, currency.toUpperCase());
const buyerUrl = (orderId: string) => `${env().APP_URL}/orders/${orderId}`;
const sellerUrl = (orderId: string) => `${env().APP_URL}/sell/orders/${orderId}`;

// ───────────────────────────── reads ─────────────────────────────

export type BuyerOrderRow = {
  id: string;
  number: string;
  createdAt: Date;
  state: OrderState;
  currency: string;
  subtotalMinor: number;
  refundedMinor: number;
  sellerName: string;
};

const sellerUser = alias(users, "seller_user");
const buyerUser = alias(users, "buyer_user");
const sellerDisplayName = sql<string>`coalesce(${sellerProfiles.shopName}, ${sellerUser.name}, ${sellerUser.email}, 'a seller')`;
const buyerDisplayName = sql<string>`coalesce(${buyerUser.name}, ${buyerUser.email}, 'a buyer')`;

export const ORDERS_PAGE_SIZE = 25;

export async function listBuyerOrders(buyerId: string, { page = 1 }: { page?: number } = {}): Promise<{ items: BuyerOrderRow[]; total: number; page: number; pageSize: number }> {
  const where = eq(orders.buyerId, buyerId);
  const [items, [counted]] = await Promise.all([
    db
      .select({
        id: orders.id,
        number: orders.number,
        createdAt: orders.createdAt,
        state: orders.state,
        currency: orders.currency,
        subtotalMinor: orders.subtotalMinor,
        refundedMinor: orders.refundedMinor,
        sellerName: sellerDisplayName,
      })
      .from(orders)
      .leftJoin(sellerProfiles, eq(sellerProfiles.userId, orders.sellerId))
      .leftJoin(sellerUser, eq(sellerUser.id, orders.sellerId))
      .where(where)
      .orderBy(desc(orders.createdAt), desc(orders.id))
      .limit(ORDERS_PAGE_SIZE)
      .offset((page - 1) * ORDERS_PAGE_SIZE),
    db.select({ n: sql<number>`count(*)::int` }).from(orders).where(where),
  ]);
  return { items, total: counted?.n ?? 0, page, pageSize: ORDERS_PAGE_SIZE };
}

export type SellerOrderRow = {
  id: string;
  number: string;
  createdAt: Date;
  paidAt: Date | null;
  state: OrderState;
  currency: string;
  subtotalMinor: number;
  sellerShareMinor: number;
  refundedMinor: number;
  buyerName: string;
  itemCount: number;
  openReturn: boolean;
  pendingRefunds: number;
};

const SELLER_SORTS: Record<SellerOrdersQuery["sort"], SQL> = {
  date: sql`coalesce(${orders.paidAt}, ${orders.createdAt})`,
  number: sql`${orders.number}`,
  state: sql`${orders.state}`,
  total: sql`${orders.subtotalMinor}`,
};

/** A seller's incoming orders; unpaid checkouts are not theirs to act on yet and are left out. */
export async function listSellerOrders(sellerId: string, query: SellerOrdersQuery): Promise<{ items: SellerOrderRow[]; total: number; page: number; pageSize: number }> {
  const where = and(eq(orders.sellerId, sellerId), ne(orders.state, "awaiting_payment"), query.state ? eq(orders.state, query.state) : undefined);
  const sortKey = SELLER_SORTS[query.sort];
  const [items, [counted]] = await Promise.all([
    db
      .select({
        id: orders.id,
        number: orders.number,
        createdAt: orders.createdAt,
        paidAt: orders.paidAt,
        state: orders.state,
        currency: orders.currency,
        subtotalMinor: orders.subtotalMinor,
        sellerShareMinor: orders.sellerShareMinor,
        refundedMinor: orders.refundedMinor,
        buyerName: buyerDisplayName,
        itemCount: sql<number>`(select coalesce(sum(${orderLines.quantity}), 0)::int from ${orderLines} where ${orderLines.orderId} = ${orders.id})`,
        openReturn: sql<boolean>`exists (select 1 from ${returnRequests} where ${returnRequests.orderId} = ${orders.id} and ${returnRequests.status} = 'requested')`,
        pendingRefunds: sql<number>`(select count(*)::int from ${refunds} where ${refunds.orderId} = ${orders.id} and ${refunds.providerRefundId} is null)`,
      })
      .from(orders)
      .leftJoin(buyerUser, eq(buyerUser.id, orders.buyerId))
      .where(where)
      .orderBy(query.dir === "asc" ? asc(sortKey) : desc(sortKey), desc(orders.createdAt), asc(orders.id))
      .limit(ORDERS_PAGE_SIZE)
      .offset((query.page - 1) * ORDERS_PAGE_SIZE),
    db.select({ n: sql<number>`count(*)::int` }).from(orders).where(where),
  ]);
  return { items, total: counted?.n ?? 0, page: query.page, pageSize: ORDERS_PAGE_SIZE };
}

export type OrderDetail = {
  order: Order;
  party: OrderParty;
  /** the fee rate the checkout recorded when it started */
  feeBps: number;
  sellerName: string;
  buyerName: string;
  buyerEmail: string;
  returnsPolicyMd: string | null;
  returnsWindowDays: number;
  returnsWindowClosesAt: Date | null;
  returnsWindowOpen: boolean;
  lines: {
    id: string;
    listingId: string;
    title: string;
    unitPriceMinor: number;
    quantity: number;
    totalMinor: number;
    refundedMinor: number;
    /** what can still be refunded: the total less every refund recorded, settled or pending */
    refundableMinor: number;
    sheetRevision: number;
  }[];
  refunds: { id: string; orderLineId: string | null; amountMinor: number; reason: string; settled: boolean; createdAt: Date }[];
  returns: { id: string; reason: string; status: "requested" | "accepted" | "declined"; decisionReason: string | null; decidedAt: Date | null; createdAt: Date }[];
  acknowledgements: { listingId: string; title: string; sheetRevision: number; policyRevision: number; hazards: string[]; acknowledgedAt: Date }[];
};

/**
 * One order as its buyer or its seller sees it; null when the viewer is not that side of it, so a
 * page answers 404 and never says that someone else's order exists.
 */
export async function getOrderDetail(orderId: string, viewerId: string, as: OrderParty, now = new Date()): Promise<OrderDetail | null> {
  if (!UUID.test(orderId)) return null;
  const [head] = await db
    .select({
      order: orders,
      feeBps: checkouts.feeBps,
      sellerName: sellerDisplayName,
      buyerName: buyerDisplayName,
      buyerEmail: sql<string>`coalesce(${buyerUser.email}, ${checkouts.email})`,
      returnsPolicyMd: sellerProfiles.returnsPolicyMd,
      returnsWindowDays: sellerProfiles.returnsWindowDays,
    })
    .from(orders)
    .innerJoin(checkouts, eq(checkouts.id, orders.checkoutId))
    .leftJoin(sellerProfiles, eq(sellerProfiles.userId, orders.sellerId))
    .leftJoin(sellerUser, eq(sellerUser.id, orders.sellerId))
    .leftJoin(buyerUser, eq(buyerUser.id, orders.buyerId))
    .where(and(eq(orders.id, orderId), as === "buyer" ? eq(orders.buyerId, viewerId) : eq(orders.sellerId, viewerId)));
  if (!head) return null;
  const { order } = head;
  const [lineRows, refundRows, returnRows] = await Promise.all([
    db.select().from(orderLines).where(eq(orderLines.orderId, order.id)).orderBy(asc(orderLines.title), asc(orderLines.id)),
    db.select().from(refunds).where(eq(refunds.orderId, order.id)).orderBy(asc(refunds.createdAt)),
    db.select().from(returnRequests).where(eq(returnRequests.orderId, order.id)).orderBy(asc(returnRequests.createdAt)),
  ]);
  const listingIds = lineRows.map((l) => l.listingId);
  const ackRows = listingIds.length
    ? await db
        .select()
        .from(orderAcknowledgements)
        .where(and(eq(orderAcknowledgements.checkoutId, order.checkoutId), inArray(orderAcknowledgements.listingId, listingIds)))
    : [];
  const reservedByLine = new Map<string, number>();
  for (const r of refundRows) if (r.orderLineId) reservedByLine.set(r.orderLineId, (reservedByLine.get(r.orderLineId) ?? 0) + r.amountMinor);
  const windowDays = head.returnsWindowDays ?? DEFAULT_RETURNS_WINDOW_DAYS;
  const windowInput = { deliveredAt: order.deliveredAt, shippedAt: order.shippedAt, windowDays };
  return {
    order,
    party: as,
    feeBps: head.feeBps,
    sellerName: head.sellerName,
    buyerName: head.buyerName,
    buyerEmail: head.buyerEmail,
    returnsPolicyMd: head.returnsPolicyMd,
    returnsWindowDays: windowDays,
    returnsWindowClosesAt: returnsWindowClosesAt(windowInput),
    returnsWindowOpen: isReturnsWindowOpen(windowInput, now),
    lines: lineRows.map((l) => ({
      id: l.id,
      listingId: l.listingId,
      title: l.title,
      unitPriceMinor: l.unitPriceMinor,
      quantity: l.quantity,
      totalMinor: lineTotalMinor(l),
      refundedMinor: l.refundedMinor,
      refundableMinor: remainingRefundableMinor(l, reservedByLine.get(l.id) ?? 0),
      sheetRevision: l.sheetRevision,
    })),
    refunds: refundRows.map((r) => ({ id: r.id, orderLineId: r.orderLineId, amountMinor: r.amountMinor, reason: r.reason, settled: r.providerRefundId !== null, createdAt: r.createdAt })),
    returns: returnRows.map((r) => ({ id: r.id, reason: r.reason, status: r.status, decisionReason: r.decisionReason, decidedAt: r.decidedAt, createdAt: r.createdAt })),
    acknowledgements: ackRows.map((a) => ({
      listingId: a.listingId,
      title: lineRows.find((l) => l.listingId === a.listingId)?.title ?? "",
      sheetRevision: a.sheetRevision,
      policyRevision: a.policyRevision,
      hazards: a.hazards,
      acknowledgedAt: a.acknowledgedAt,
    })),
  };
}

/**
 * The currency of an order the actor may refund, to read an amount typed in its major units; throws
 * the same 404/403 as the refund itself would for someone else's order.
 */
export async function refundCurrencyFor(orderId: string, actorId: string): Promise<string> {
  if (!UUID.test(orderId)) throw new OrderError(404, "No such order.");
  const [order] = await db.select({ state: orders.state, buyerId: orders.buyerId, sellerId: orders.sellerId, currency: orders.currency }).from(orders).where(eq(orders.id, orderId));
  if (!order) throw new OrderError(404, "No such order.");
  const plan = planOrderAction({ order, action: "refund", actorId });
  if (!plan.ok && plan.status !== 409) throw new OrderError(plan.status, plan.message);
  return order.currency;
}

// ───────────────────────────── shared pieces of the writes ─────────────────────────────

type People = { buyerEmail: string | null; buyerName: string; sellerEmail: string | null; sellerName: string };

async function peopleOf(tx: Executor, order: Pick<Order, "buyerId" | "sellerId" | "checkoutId">): Promise<People> {
  const [row] = await tx
    .select({
      buyerEmail: sql<string | null>`coalesce(${buyerUser.email}, ${checkouts.email})`,
      buyerName: buyerDisplayName,
      sellerEmail: sellerUser.email,
      sellerName: sellerDisplayName,
    })
    .from(checkouts)
    .leftJoin(buyerUser, eq(buyerUser.id, order.buyerId))
    .leftJoin(sellerUser, eq(sellerUser.id, order.sellerId))
    .leftJoin(sellerProfiles, eq(sellerProfiles.userId, order.sellerId))
    .where(eq(checkouts.id, order.checkoutId));
  return row ?? { buyerEmail: null, buyerName: "a buyer", sellerEmail: null, sellerName: "a seller" };
}

/** Reads (and locks) the order, and checks that the actor may do `action` to it now. */
async function orderForAction(tx: Tx, orderId: string, actorId: string, action: OrderAction): Promise<Order> {
  if (!UUID.test(orderId)) throw new OrderError(404, "No such order.");
  const [order] = await tx.select().from(orders).where(eq(orders.id, orderId)).for("update");
  if (!order) throw new OrderError(404, "No such order.");
  const plan = planOrderAction({ order, action, actorId });
  if (!plan.ok) throw new OrderError(plan.status, plan.message);
  return order;
}

async function audit(tx: Executor, entry: { actorId: string | null; action: string; subjectType?: string; subjectId: string; reason?: string | null; details: Record<string, unknown> }): Promise<void> {
  await tx.insert(auditLog).values({
    actorId: entry.actorId,
    action: entry.action,
    subjectType: entry.subjectType ?? "order",
    subjectId: entry.subjectId,
    reason: entry.reason ?? null,
    details: entry.details,
  });
}

async function paymentIntentOf(tx: Executor, checkoutId: string): Promise<string> {
  const [row] = await tx.select({ id: checkouts.paymentIntentId }).from(checkouts).where(eq(checkouts.id, checkoutId));
  if (!row?.id) throw new OrderError(409, "There is no payment on record for this order, so nothing can be refunded through the payment service.");
  return row.id;
}

/** Everything already recorded against each line of an order: settled and pending refunds alike. */
async function reservedByLine(tx: Executor, orderId: string): Promise<Map<string, number>> {
  const rows = await tx
    .select({ lineId: refunds.orderLineId, reserved: sql<number>`sum(${refunds.amountMinor})::int` })
    .from(refunds)
    .where(and(eq(refunds.orderId, orderId), isNotNull(refunds.orderLineId)))
    .groupBy(refunds.orderLineId);
  return new Map(rows.map((r) => [r.lineId!, r.reserved]));
}

/** Records a pending refund of everything still refundable on each line (cancellation, accepted return). */
async function reserveRemaining(tx: Tx, order: Order, reason: string, actorId: string): Promise<{ ids: string[]; totalMinor: number }> {
  const [lines, reserved] = await Promise.all([tx.select().from(orderLines).where(eq(orderLines.orderId, order.id)), reservedByLine(tx, order.id)]);
  const wanted = lines.map((line) => ({ line, amountMinor: remainingRefundableMinor(line, reserved.get(line.id) ?? 0) })).filter((w) => w.amountMinor > 0);
  if (wanted.length === 0) return { ids: [], totalMinor: 0 };
  await paymentIntentOf(tx, order.checkoutId);
  const rows = await tx
    .insert(refunds)
    .values(wanted.map((w) => ({ orderId: order.id, orderLineId: w.line.id, amountMinor: w.amountMinor, reason, actorId })))
    .returning({ id: refunds.id });
  return { ids: rows.map((r) => r.id), totalMinor: wanted.reduce((sum, w) => sum + w.amountMinor, 0) };
}

// ───────────────────────────── shipping and delivery ─────────────────────────────

export async function shipOrder(input: { orderId: string; actorId: string; carrier: string; trackingRef: string }): Promise<{ from: OrderState; to: OrderState }> {
  const { mailIds, from } = await db.transaction(async (tx) => {
    const order = await orderForAction(tx, input.orderId, input.actorId, "ship");
    const now = new Date();
    const [updated] = await tx
      .update(orders)
      .set({ state: "shipped", carrier: input.carrier, trackingRef: input.trackingRef, shippedAt: now, updatedAt: now })
      .where(and(eq(orders.id, order.id), eq(orders.state, "paid")))
      .returning({ id: orders.id });
    if (!updated) throw new OrderError(409, "This order has just changed; reload to see its state.");
    await audit(tx, { actorId: input.actorId, action: "order.shipped", subjectId: order.id, details: { from: order.state, to: "shipped", carrier: input.carrier, trackingRef: input.trackingRef } });
    const people = await peopleOf(tx, order);
    const ids = await mailIfAddressed(tx, people.buyerEmail, orderShippedMail, { buyerName: people.buyerName, orderNumber: order.number, sellerName: people.sellerName, carrier: input.carrier, trackingRef: input.trackingRef, orderUrl: buyerUrl(order.id) });
    return { mailIds: ids, from: order.state };
  });
  await dispatchMail(mailIds);
  return { from, to: "shipped" };
}

/** The buyer confirms that it arrived, or the seller marks it delivered. */
export async function markDelivered(input: { orderId: string; actorId: string }): Promise<{ from: OrderState; to: OrderState }> {
  return db.transaction(async (tx) => {
    if (!UUID.test(input.orderId)) throw new OrderError(404, "No such order.");
    const [peek] = await tx.select({ sellerId: orders.sellerId }).from(orders).where(eq(orders.id, input.orderId));
    const action: OrderAction = peek?.sellerId === input.actorId ? "mark_delivered" : "confirm_delivery";
    const order = await orderForAction(tx, input.orderId, input.actorId, action);
    const now = new Date();
    const [updated] = await tx
      .update(orders)
      .set({ state: "delivered", deliveredAt: now, updatedAt: now })
      .where(and(eq(orders.id, order.id), eq(orders.state, "shipped")))
      .returning({ id: orders.id });
    if (!updated) throw new OrderError(409, "This order has just changed; reload to see its state.");
    await audit(tx, { actorId: input.actorId, action: "order.delivered", subjectId: order.id, details: { from: order.state, to: "delivered", by: action === "mark_delivered" ? "seller" : "buyer" } });
    return { from: order.state, to: "delivered" as const };
  });
}

// ───────────────────────────── cancellation and refunds ─────────────────────────────

export type RefundOutcome = { refundId: string; amountMinor: number; status: "refunded" | "pending" | "failed"; message?: string };

/**
 * The seller cancels before shipping: the state changes only if it is still `paid` (so two clicks
 * cancel once and restock once), the stock of every line goes back, and a pending refund of what is
 * left of each line is recorded in the same transaction; the refunds go to the provider after commit.
 */
export async function cancelOrder(input: { orderId: string; actorId: string }): Promise<{ from: OrderState; to: OrderState; refunds: RefundOutcome[] }> {
  const { mailIds, refundIds } = await db.transaction(async (tx) => {
    const order = await orderForAction(tx, input.orderId, input.actorId, "cancel");
    const now = new Date();
    const [updated] = await tx
      .update(orders)
      .set({ state: "cancelled", cancelledAt: now, updatedAt: now })
      .where(and(eq(orders.id, order.id), eq(orders.state, "paid")))
      .returning({ id: orders.id });
    if (!updated) throw new OrderError(409, "This order has just changed; reload to see its state.");
    const lines = await tx.select({ listingId: orderLines.listingId, quantity: orderLines.quantity }).from(orderLines).where(eq(orderLines.orderId, order.id));
    for (const line of lines) {
      await tx.update(listings).set({ stock: sql`${listings.stock} + ${line.quantity}`, updatedAt: now }).where(eq(listings.id, line.listingId));
    }
    const reserved = await reserveRemaining(tx, order, "Order cancelled by the seller before shipping.", input.actorId);
    await audit(tx, {
      actorId: input.actorId,
      action: "order.cancelled",
      subjectId: order.id,
      details: { from: order.state, to: "cancelled", restocked: lines, refundIds: reserved.ids, refundMinor: reserved.totalMinor },
    });
    const people = await peopleOf(tx, order);
    const ids = await mailIfAddressed(tx, people.buyerEmail, orderCancelledMail, { buyerName: people.buyerName, orderNumber: order.number, sellerName: people.sellerName, refundAmount: money(reserved.totalMinor, order.currency), orderUrl: buyerUrl(order.id) });
    return { mailIds: ids, refundIds: reserved.ids };
  });
  const outcomes = await afterRefundCommit(mailIds, refundIds);
  return { from: "paid", to: "cancelled", refunds: outcomes };
}

/** A refund of part (or all) of one line, by the seller. */
export async function refundLine(input: { orderId: string; lineId: string; actorId: string; amountMinor: number; reason: string }): Promise<RefundOutcome> {
  const refundId = await db.transaction(async (tx) => {
    const order = await orderForAction(tx, input.orderId, input.actorId, "refund");
    if (!UUID.test(input.lineId)) throw new OrderError(404, "No such line on this order.", "lineId");
    const [line] = await tx.select().from(orderLines).where(and(eq(orderLines.id, input.lineId), eq(orderLines.orderId, order.id)));
    if (!line) throw new OrderError(404, "No such line on this order.", "lineId");
    const reserved = (await reservedByLine(tx, order.id)).get(line.id) ?? 0;
    const check = checkLineRefund({ line, reservedMinor: reserved, amountMinor: input.amountMinor });
    if (!check.ok) {
      const message =
        check.reason === "nothing_left"
          ? "Everything on this line has already been refunded."
          : check.reason === "too_large"
            ? `At most ${money(check.remainingMinor, order.currency)} of this line can still be refunded.`
            : "The amount must be more than zero.";
      throw new OrderError(check.reason === "not_positive" ? 422 : 409, message, "amount");
    }
    await paymentIntentOf(tx, order.checkoutId);
    const [row] = await tx.insert(refunds).values({ orderId: order.id, orderLineId: line.id, amountMinor: input.amountMinor, reason: input.reason, actorId: input.actorId }).returning({ id: refunds.id });
    await audit(tx, { actorId: input.actorId, action: "order.refund_requested", subjectId: order.id, reason: input.reason, details: { refundId: row!.id, lineId: line.id, amountMinor: input.amountMinor } });
    return row!.id;
  });
  return processRefund(refundId);
}

/** Steps 2–4 of a refund (see the top of this file); safe to call again for the same refund. */
export async function processRefund(refundId: string, { lookUpFirst = false }: { lookUpFirst?: boolean } = {}): Promise<RefundOutcome> {
  const [row] = await db
    .select({ id: refunds.id, orderId: refunds.orderId, amountMinor: refunds.amountMinor, providerRefundId: refunds.providerRefundId, paymentIntentId: checkouts.paymentIntentId })
    .from(refunds)
    .innerJoin(orders, eq(orders.id, refunds.orderId))
    .innerJoin(checkouts, eq(checkouts.id, orders.checkoutId))
    .where(eq(refunds.id, refundId));
  if (!row) return { refundId, amountMinor: 0, status: "failed", message: "The payment service refused this refund earlier." };
  if (row.providerRefundId) return { refundId, amountMinor: row.amountMinor, status: "refunded" };
  if (!row.paymentIntentId) return releaseRefund(refundId, "There is no payment on record for this order.");
  const request = { paymentIntentId: row.paymentIntentId, amountMinor: row.amountMinor, orderId: row.orderId, refundId };
  let providerId: string | null = null;
  if (lookUpFirst) {
    const found = await findProviderRefund(row.paymentIntentId, refundId);
    if (found.kind !== "done") return { refundId, amountMinor: row.amountMinor, status: "pending", message: found.message };
    providerId = found.value?.id ?? null;
  }
  if (!providerId) {
    const created = await createProviderRefund(request);
    if (created.kind === "refused") return releaseRefund(refundId, created.message);
    if (created.kind === "unknown") {
      console.error(`[orders] refund ${refundId} is pending: ${created.message}`);
      return { refundId, amountMinor: row.amountMinor, status: "pending", message: "The payment service did not answer; the refund is recorded and will be retried." };
    }
    providerId = created.value.id;
  }
  await settleRefund(refundId, providerId);
  return { refundId, amountMinor: row.amountMinor, status: "refunded" };
}

async function releaseRefund(refundId: string, message: string): Promise<RefundOutcome> {
  const released = await db.transaction(async (tx) => {
    const [gone] = await tx.delete(refunds).where(and(eq(refunds.id, refundId), isNull(refunds.providerRefundId))).returning();
    if (gone) await audit(tx, { actorId: null, action: "order.refund_failed", subjectId: gone.orderId, reason: message, details: { refundId, lineId: gone.orderLineId, amountMinor: gone.amountMinor } });
    return gone;
  });
  return { refundId, amountMinor: released?.amountMinor ?? 0, status: "failed", message: `The payment service refused the refund: ${message}` };
}

async function settleRefund(refundId: string, providerRefundId: string): Promise<void> {
  const settled = await db.transaction(async (tx) => {
    const [orderRow] = await tx
      .select()
      .from(orders)
      .where(eq(orders.id, sql`(select ${refunds.orderId} from ${refunds} where ${refunds.id} = ${refundId})`))
      .for("update");
    if (!orderRow) return null;
    const [refund] = await tx
      .update(refunds)
      .set({ providerRefundId })
      .where(and(eq(refunds.id, refundId), isNull(refunds.providerRefundId)))
      .returning();
    // Already settled by an earlier call: nothing more to count.
    if (!refund) return null;
    const split = splitRefund({ subtotalMinor: orderRow.subtotalMinor, feeMinor: orderRow.feeMinor, refundedBeforeMinor: orderRow.refundedMinor, amountMinor: refund.amountMinor });
    let lineTitle: string | null = null;
    if (refund.orderLineId) {
      const [line] = await tx
        .update(orderLines)
        .set({ refundedMinor: sql`${orderLines.refundedMinor} + ${refund.amountMinor}` })
        .where(eq(orderLines.id, refund.orderLineId))
        .returning({ title: orderLines.title });
      lineTitle = line?.title ?? null;
    }
    const refundedMinor = orderRow.refundedMinor + refund.amountMinor;
    const to = stateAfterRefund(orderRow.state, orderRow.subtotalMinor, refundedMinor);
    await tx.update(orders).set({ refundedMinor, state: to, updatedAt: new Date() }).where(eq(orders.id, orderRow.id));
    await audit(tx, {
      actorId: refund.actorId,
      action: "order.refund_settled",
      subjectId: orderRow.id,
      reason: refund.reason,
      details: { refundId, providerRefundId, lineId: refund.orderLineId, amountMinor: refund.amountMinor, feeRefundMinor: split.feeMinor, sellerRefundMinor: split.sellerMinor, from: orderRow.state, to },
    });
    const people = await peopleOf(tx, orderRow);
    const mailIds: string[] = [];
    if (people.buyerEmail) {
      mailIds.push(
        await enqueueMail(tx, {
          template: orderRefundedMail,
          to: people.buyerEmail,
          props: { buyerName: people.buyerName, orderNumber: orderRow.number, amount: money(refund.amountMinor, orderRow.currency), lineTitle, reason: refund.reason, orderUrl: buyerUrl(orderRow.id) },
        }),
      );
    }
    return { mailIds, orderId: orderRow.id, transferId: orderRow.transferId, sellerMinor: split.sellerMinor };
  });
  if (!settled) return;
  await dispatchMail(settled.mailIds);
  await reverseSellerPart({ refundId, orderId: settled.orderId, transferId: settled.transferId, amountMinor: settled.sellerMinor });
}

/** Takes the seller's part of a settled refund back from their transfer; the sweep retries it when it fails. */
async function reverseSellerPart(input: { refundId: string; orderId: string; transferId: string | null; amountMinor: number }): Promise<boolean> {
  if (!input.transferId || input.amountMinor <= 0) return false;
  const outcome = await reverseSellerShare({ transferId: input.transferId, amountMinor: input.amountMinor, orderId: input.orderId, refundId: input.refundId });
  if (outcome.kind !== "done") {
    console.error(`[orders] transfer reversal for refund ${input.refundId} not done: ${outcome.message}`);
    return false;
  }
  await audit(db, {
    actorId: null,
    action: "refund.transfer_reversed",
    subjectType: "refund",
    subjectId: input.refundId,
    details: { orderId: input.orderId, transferId: input.transferId, reversalId: outcome.value.id, amountMinor: input.amountMinor },
  });
  return true;
}

/**
 * The worker's sweep: pending refunds older than `olderThanMs` are looked up and retried, and settled
 * refunds whose seller's part was never reversed (the provider did not answer, or the transfer was
 * made later) are reversed now.
 */
export async function settlePendingRefunds({ olderThanMs = 60_000 }: { olderThanMs?: number } = {}): Promise<{ refunded: number; pending: number; failed: number; reversed: number }> {
  const due = await db
    .select({ id: refunds.id })
    .from(refunds)
    .where(and(isNull(refunds.providerRefundId), lt(refunds.createdAt, new Date(Date.now() - olderThanMs))))
    .orderBy(asc(refunds.createdAt))
    .limit(100);
  const counts = { refunded: 0, pending: 0, failed: 0, reversed: 0 };
  for (const { id } of due) counts[(await processRefund(id, { lookUpFirst: true })).status] += 1;

  const settledEntry = alias(auditLog, "settled_entry");
  const unreversed = await db
    .select({
      refundId: sql<string>`${settledEntry.details}->>'refundId'`,
      orderId: orders.id,
      transferId: orders.transferId,
      amountMinor: sql<number>`(${settledEntry.details}->>'sellerRefundMinor')::int`,
    })
    .from(settledEntry)
    .innerJoin(orders, sql`${orders.id}::text = ${settledEntry.subjectId}`)
    .where(
      and(
        eq(settledEntry.action, "order.refund_settled"),
        eq(settledEntry.subjectType, "order"),
        isNotNull(orders.transferId),
        sql`(${settledEntry.details}->>'sellerRefundMinor')::int > 0`,
        sql`not exists (select 1 from ${auditLog} where ${auditLog.action} = 'refund.transfer_reversed' and ${auditLog.subjectType} = 'refund' and ${auditLog.subjectId} = ${settledEntry.details}->>'refundId')`,
      ),
    )
    .limit(100);
  for (const r of unreversed) if (await reverseSellerPart(r)) counts.reversed += 1;
  return counts;
}

// ───────────────────────────── returns ─────────────────────────────

export async function requestReturn(input: { orderId: string; actorId: string; reason: string; now?: Date }): Promise<{ returnId: string }> {
  const { returnId, mailIds } = await db.transaction(async (tx) => {
    const order = await orderForAction(tx, input.orderId, input.actorId, "request_return");
    const [profile] = await tx.select({ days: sellerProfiles.returnsWindowDays }).from(sellerProfiles).where(eq(sellerProfiles.userId, order.sellerId));
    const window = { deliveredAt: order.deliveredAt, shippedAt: order.shippedAt, windowDays: profile?.days ?? DEFAULT_RETURNS_WINDOW_DAYS };
    if (!isReturnsWindowOpen(window, input.now ?? new Date())) {
      const closed = returnsWindowClosesAt(window);
      throw new OrderError(409, closed && window.windowDays > 0 ? `The seller's returns window closed on ${closed.toISOString().slice(0, 16).replace("T", " ")} UTC.` : "This seller does not take returns.");
    }
    const open = await tx
      .select({ status: returnRequests.status })
      .from(returnRequests)
      .where(and(eq(returnRequests.orderId, order.id), inArray(returnRequests.status, ["requested", "accepted"])));
    if (open.length > 0) throw new OrderError(409, open[0]!.status === "requested" ? "A return request for this order is already waiting for the seller." : "The seller has already accepted a return of this order.");
    const [row] = await tx.insert(returnRequests).values({ orderId: order.id, reason: input.reason }).returning({ id: returnRequests.id });
    await audit(tx, { actorId: input.actorId, action: "order.return_requested", subjectId: order.id, reason: input.reason, details: { returnId: row!.id } });
    const people = await peopleOf(tx, order);
    const ids = await mailIfAddressed(tx, people.sellerEmail, returnRequestedMail, { sellerName: people.sellerName, buyerName: people.buyerName, orderNumber: order.number, reason: input.reason, orderUrl: sellerUrl(order.id) });
    return { returnId: row!.id, mailIds: ids };
  });
  await dispatchMail(mailIds);
  return { returnId };
}

async function decideReturn(tx: Tx, input: { orderId: string; returnId: string; actorId: string }, action: "accept_return" | "decline_return", decisionReason: string | null): Promise<Order> {
  const order = await orderForAction(tx, input.orderId, input.actorId, action);
  if (!UUID.test(input.returnId)) throw new OrderError(404, "No such return request on this order.");
  const [decided] = await tx
    .update(returnRequests)
    .set({ status: action === "accept_return" ? "accepted" : "declined", decisionReason, decidedAt: new Date() })
    .where(and(eq(returnRequests.id, input.returnId), eq(returnRequests.orderId, order.id), eq(returnRequests.status, "requested")))
    .returning({ id: returnRequests.id });
  if (!decided) {
    const [exists] = await tx.select({ status: returnRequests.status }).from(returnRequests).where(and(eq(returnRequests.id, input.returnId), eq(returnRequests.orderId, order.id)));
    if (!exists) throw new OrderError(404, "No such return request on this order.");
    throw new OrderError(409, `This return request is already ${exists.status}.`);
  }
  return order;
}

/** The seller accepts a return: what is left of every line is refunded. */
export async function acceptReturn(input: { orderId: string; returnId: string; actorId: string }): Promise<{ refunds: RefundOutcome[] }> {
  const { mailIds, refundIds } = await db.transaction(async (tx) => {
    const order = await decideReturn(tx, input, "accept_return", null);
    const reserved = await reserveRemaining(tx, order, "Return accepted by the seller.", input.actorId);
    await audit(tx, { actorId: input.actorId, action: "order.return_accepted", subjectId: order.id, details: { returnId: input.returnId, refundIds: reserved.ids, refundMinor: reserved.totalMinor } });
    const people = await peopleOf(tx, order);
    const ids = await mailIfAddressed(tx, people.buyerEmail, returnAcceptedMail, { buyerName: people.buyerName, orderNumber: order.number, sellerName: people.sellerName, refundAmount: money(reserved.totalMinor, order.currency), orderUrl: buyerUrl(order.id) });
    return { mailIds: ids, refundIds: reserved.ids };
  });
  const outcomes = await afterRefundCommit(mailIds, refundIds);
  return { refunds: outcomes };
}

export async function declineReturn(input: { orderId: string; returnId: string; actorId: string; reason: string }): Promise<void> {
  const mailIds = await db.transaction(async (tx) => {
    const order = await decideReturn(tx, input, "decline_return", input.reason);
    await audit(tx, { actorId: input.actorId, action: "order.return_declined", subjectId: order.id, reason: input.reason, details: { returnId: input.returnId } });
    const people = await peopleOf(tx, order);
    return mailIfAddressed(tx, people.buyerEmail, returnDeclinedMail, { buyerName: people.buyerName, orderNumber: order.number, sellerName: people.sellerName, reason: input.reason, orderUrl: buyerUrl(order.id) });
  });
  await dispatchMail(mailIds);
}

/** Queues one e-mail when the person has an address; returns the ids to dispatch after commit. */
async function mailIfAddressed<P>(tx: Tx, to: string | null, template: { name: string; template: MailTemplate<P> }, props: P): Promise<string[]> {
  return to ? [await enqueueMail(tx, { template, to, props })] : [];
}

/** After the change has committed: deliver its mail, then ask the provider for each reserved refund. */
async function afterRefundCommit(mailIds: string[], refundIds: string[]) {
  await dispatchMail(mailIds);
  const outcomes = [];
  for (const id of refundIds) outcomes.push(await processRefund(id));
  return outcomes;
}

// ───────────────────────────── the platform fee ─────────────────────────────

/** The schema's default, used only if the settings row were missing (migration 0004 inserts it). */
const DEFAULT_FEE_BPS = 800;

export async function getPlatformFee(executor: Executor = db): Promise<{ feeBps: number; updatedAt: Date | null; updatedByName: string | null }> {
  const [row] = await executor
    .select({ feeBps: platformSettings.feeBps, updatedAt: platformSettings.updatedAt, updatedByName: sql<string | null>`coalesce(${users.name}, ${users.email})` })
    .from(platformSettings)
    .leftJoin(users, eq(users.id, platformSettings.updatedBy))
    .where(eq(platformSettings.id, 1));
  return row ?? { feeBps: DEFAULT_FEE_BPS, updatedAt: null, updatedByName: null };
}

/** Sets the fee for checkouts started from now on; existing checkouts and orders keep the fee they recorded. */
export async function setPlatformFee(input: { actorId: string; feeBps: number }): Promise<{ fromBps: number; toBps: number; changed: boolean }> {
  if (!Number.isInteger(input.feeBps) || input.feeBps < 0 || input.feeBps > 5000) throw new OrderError(422, "The fee must be between 0 and 50 %.", "percent");
  return db.transaction(async (tx) => {
    const [current] = await tx.select({ feeBps: platformSettings.feeBps }).from(platformSettings).where(eq(platformSettings.id, 1)).for("update");
    const fromBps = current?.feeBps ?? DEFAULT_FEE_BPS;
    if (current && fromBps === input.feeBps) return { fromBps, toBps: input.feeBps, changed: false };
    const now = new Date();
    await tx
      .insert(platformSettings)
      .values({ id: 1, feeBps: input.feeBps, updatedBy: input.actorId, updatedAt: now })
      .onConflictDoUpdate({ target: platformSettings.id, set: { feeBps: input.feeBps, updatedBy: input.actorId, updatedAt: now } });
    await audit(tx, { actorId: input.actorId, action: "platform.fee_changed", subjectType: "platform_settings", subjectId: "1", details: { fromBps, toBps: input.feeBps } });
    return { fromBps, toBps: input.feeBps, changed: true };
  });
}
