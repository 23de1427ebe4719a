import "server-only";
import { randomBytes } from "node:crypto";
import { and, asc, eq, gte, inArray, isNull, lt, sql } from "drizzle-orm";
import { db, type Db, type Executor, type Tx } from "@/db/client";
import {
  checkouts,
  listings,
  orderAcknowledgements,
  orderLines,
  orders,
  platformSettings,
  refunds,
  sellerProfiles,
  stockReservations,
  users,
} from "@/db/schema";
import { listCartLines, removePurchasedItems } from "@/db/queries/cart";
import { currentPolicyRevision } from "@/db/queries/policy";
import { lineProblem, mixedCurrencyMessage } from "@/lib/checkout/cart-summary";
import { formatFeeRate, splitFee } from "@/lib/checkout/fees";
import { acknowledgementHazards, needsAcknowledgement } from "@/lib/checkout/hazards";
import { orderNumber } from "@/lib/checkout/order-number";
import { reservationExpiry } from "@/lib/checkout/reservation";
import { env } from "@/lib/env";
import { enqueueMail } from "@/lib/mail/outbox";
import { orderPaidBuyerMail } from "@/emails/orders/order-paid-buyer";
import { orderPaidRefundedMail } from "@/emails/orders/order-paid-refunded";
import { orderPaidSellerMail } from "@/emails/orders/order-paid-seller";

// A checkout is one payment across sellers: one order per seller, stock held while the buyer pays.
// Every change of its state happens here, in a transaction, conditional on the state it expects.

export type CheckoutLine = { listingId: string; title: string; unitPriceMinor: number; quantity: number; sellerId: string; shopName: string };

export type CreatedCheckout = {
  checkoutId: string;
  email: string;
  currency: string;
  totalMinor: number;
  expiresAt: Date;
  lines: CheckoutLine[];
};

export type RefusalCode = "empty" | "mixed-currency" | "unavailable" | "seller-unpayable" | "acknowledgement" | "price-changed" | "stock";

/** Why a checkout was not created; nothing was written. `fieldErrors` are keyed `ack.<listingId>`. */
export class CheckoutRefusal extends Error {
  constructor(
    readonly code: RefusalCode,
    message: string,
    readonly items: { listingId: string; title: string }[] = [],
    readonly fieldErrors: Record<string, string[]> = {},
  ) {
    super(message);
    this.name = "CheckoutRefusal";
  }
}

function listTitles(items: { title: string }[]): string {
  return items.map((i) => `“${i.title}”`).join(", ");
}

async function readFeeBps(executor: Executor): Promise<number> {
  const [row] = await executor.select({ feeBps: platformSettings.feeBps }).from(platformSettings).where(eq(platformSettings.id, 1));
  if (!row) throw new Error("platform_settings has no row 1: the migrations seed it");
  return row.feeBps;
}

/**
 * Turns the member's cart into an open checkout, in one transaction: re-reads prices and stock,
 * checks every mains-connected item was acknowledged at its current sheet revision, reserves the
 * stock with conditional updates (never read-modify-write), and writes the checkout, one order per
 * seller with its fee, the lines, the acknowledgements and the reservations. Throws
 * CheckoutRefusal (rolled back) when it cannot.
 */
export async function createCheckout(
  input: {
    buyer: { id: string; email: string };
    acknowledgements: Record<string, number>;
    shownTotalMinor?: number;
    shownCurrency?: string;
    now?: Date;
  },
  database: Db = db,
): Promise<CreatedCheckout> {
  const now = input.now ?? new Date();
  return database.transaction(async (tx) => {
    const cart = await listCartLines({ userId: input.buyer.id }, tx);
    if (cart.length === 0) throw new CheckoutRefusal("empty", "Your cart is empty.");
    const currencies = [...new Set(cart.map((l) => l.currency))].sort();
    if (currencies.length > 1) throw new CheckoutRefusal("mixed-currency", mixedCurrencyMessage(currencies));
    const currency = currencies[0]!;

    const unavailable = cart.filter((l) => lineProblem(l) !== null);
    if (unavailable.length > 0) {
      throw new CheckoutRefusal(
        "unavailable",
        `Not enough stock, or no longer for sale: ${listTitles(unavailable)}. Your cart shows what is left.`,
        unavailable,
      );
    }

    const sellerIds = [...new Set(cart.map((l) => l.sellerId))];
    const payable = await tx
      .select({ userId: sellerProfiles.userId })
      .from(sellerProfiles)
      .where(and(inArray(sellerProfiles.userId, sellerIds), eq(sellerProfiles.payoutsEnabled, true), sql`${sellerProfiles.payoutAccountId} is not null`));
    const payableIds = new Set(payable.map((p) => p.userId));
    const unpayable = cart.filter((l) => !payableIds.has(l.sellerId));
    if (unpayable.length > 0) {
      throw new CheckoutRefusal(
        "seller-unpayable",
        `The seller of ${listTitles(unpayable)} cannot take payments at the moment. Remove it to buy the rest, or try again later.`,
        unpayable,
      );
    }

    // The sheet as it stands now; the buyer must have ticked the revision they were shown.
    const policy = await currentPolicyRevision(tx);
    const sheets = await tx
      .select({ id: listings.id, declaration: listings.declaration, sheetRevision: listings.sheetRevision })
      .from(listings)
      .where(inArray(listings.id, cart.map((l) => l.listingId)));
    const sheetById = new Map(sheets.map((s) => [s.id, s]));
    const fieldErrors: Record<string, string[]> = {};
    for (const line of cart) {
      const sheet = sheetById.get(line.listingId)!;
      if (!needsAcknowledgement(sheet.declaration)) continue;
      const ticked = input.acknowledgements[line.listingId];
      if (ticked === undefined) {
        fieldErrors[`ack.${line.listingId}`] = ["Tick this box to confirm you have read the safety sheet."];
      } else if (ticked !== sheet.sheetRevision) {
        fieldErrors[`ack.${line.listingId}`] = [`The safety sheet changed to revision ${sheet.sheetRevision} since you opened this page. Read it again, then tick the box.`];
      }
    }
    if (Object.keys(fieldErrors).length > 0) {
      throw new CheckoutRefusal("acknowledgement", "Confirm the safety sheet of every mains-connected item before paying.", [], fieldErrors);
    }

    // Reserve in a fixed order (by id), so two checkouts of the same items never wait on each other in a cycle.
    const wanted = [...cart].sort((a, b) => (a.listingId < b.listingId ? -1 : 1));
    const reserved = new Map<string, { priceMinor: number; title: string; sheetRevision: number }>();
    const short: { listingId: string; title: string }[] = [];
    for (const line of wanted) {
      const [row] = await tx
        .update(listings)
        .set({ stock: sql`${listings.stock} - ${line.quantity}` })
        .where(and(eq(listings.id, line.listingId), eq(listings.state, "live"), gte(listings.stock, line.quantity)))
        .returning({ priceMinor: listings.priceMinor, title: listings.title, sheetRevision: listings.sheetRevision, currency: listings.currency });
      if (!row || row.currency !== currency) short.push({ listingId: line.listingId, title: line.title });
      else reserved.set(line.listingId, row);
    }
    if (short.length > 0) {
      throw new CheckoutRefusal(
        "stock",
        `${listTitles(short)} no longer ${short.length === 1 ? "has" : "have"} enough stock for your quantity; someone else bought ${short.length === 1 ? "it" : "them"} first. Nothing was reserved or charged.`,
        short,
      );
    }

    const lines: CheckoutLine[] = cart.map((l) => {
      const r = reserved.get(l.listingId)!;
      return { listingId: l.listingId, title: r.title, unitPriceMinor: r.priceMinor, quantity: l.quantity, sellerId: l.sellerId, shopName: l.shopName };
    });
    const totalMinor = lines.reduce((sum, l) => sum + l.unitPriceMinor * l.quantity, 0);
    if ((input.shownTotalMinor !== undefined && input.shownTotalMinor !== totalMinor) || (input.shownCurrency !== undefined && input.shownCurrency !== currency)) {
      throw new CheckoutRefusal("price-changed", "A price changed since you opened this page. Check the new total below and confirm again.");
    }

    const feeBps = await readFeeBps(tx);
    const expiresAt = reservationExpiry(now);
    const [checkout] = await tx
      .insert(checkouts)
      .values({ buyerId: input.buyer.id, email: input.buyer.email, currency, totalMinor, feeBps, status: "open", expiresAt, createdAt: now })
      .returning({ id: checkouts.id });
    const checkoutId = checkout!.id;

    for (const sellerId of sellerIds) {
      const own = lines.filter((l) => l.sellerId === sellerId);
      const subtotalMinor = own.reduce((sum, l) => sum + l.unitPriceMinor * l.quantity, 0);
      const { feeMinor, sellerShareMinor } = splitFee(subtotalMinor, feeBps);
      const [order] = await tx
        .insert(orders)
        .values({
          number: orderNumber(now, (n) => randomBytes(n)),
          checkoutId,
          buyerId: input.buyer.id,
          sellerId,
          state: "awaiting_payment",
          currency,
          subtotalMinor,
          feeMinor,
          sellerShareMinor,
          createdAt: now,
          updatedAt: now,
        })
        .returning({ id: orders.id });
      await tx.insert(orderLines).values(
        own.map((l) => ({
          orderId: order!.id,
          listingId: l.listingId,
          title: l.title,
          unitPriceMinor: l.unitPriceMinor,
          quantity: l.quantity,
          sheetRevision: reserved.get(l.listingId)!.sheetRevision,
        })),
      );
    }

    const acknowledged = cart.filter((l) => needsAcknowledgement(sheetById.get(l.listingId)!.declaration));
    if (acknowledged.length > 0) {
      await tx.insert(orderAcknowledgements).values(
        acknowledged.map((l) => {
          const sheet = sheetById.get(l.listingId)!;
          return {
            checkoutId,
            listingId: l.listingId,
            sheetRevision: sheet.sheetRevision,
            policyRevision: policy.revision,
            hazards: acknowledgementHazards(sheet.declaration, policy),
            acknowledgedAt: now,
          };
        }),
      );
    }
    await tx.insert(stockReservations).values(lines.map((l) => ({ checkoutId, listingId: l.listingId, quantity: l.quantity, status: "held" as const, expiresAt, createdAt: now })));

    return { checkoutId, email: input.buyer.email, currency, totalMinor, expiresAt, lines };
  });
}

export async function recordProviderSession(checkoutId: string, sessionId: string): Promise<void> {
  await db.update(checkouts).set({ sessionId }).where(and(eq(checkouts.id, checkoutId), isNull(checkouts.sessionId)));
}

async function lockCheckout(tx: Tx, checkoutId: string) {
  const [row] = await tx.select().from(checkouts).where(eq(checkouts.id, checkoutId)).for("update");
  return row;
}

/**
 * Gives the held stock back, once: only reservations still `held` flip to `released`, and the stock
 * goes up by exactly what flipped, in the same statement. Returns what was restored.
 */
async function releaseHeldStock(tx: Tx, checkoutId: string): Promise<{ listingId: string; quantity: number }[]> {
  const { rows } = await tx.execute<{ listing_id: string; quantity: number }>(sql`
    with released as (
      update stock_reservations set status = 'released'
      where checkout_id = ${checkoutId} and status = 'held'
      returning listing_id, quantity
    ), restored as (
      update listings l set stock = l.stock + r.quantity
      from (select listing_id, sum(quantity)::int as quantity from released group by listing_id) r
      where l.id = r.listing_id
      returning l.id
    )
    select listing_id, sum(quantity)::int as quantity from released group by listing_id`);
  return rows.map((r) => ({ listingId: r.listing_id, quantity: r.quantity }));
}

export type ReleaseOutcome = { released: boolean; status: string; restored: { listingId: string; quantity: number }[] };

/** An open checkout that will not be paid: stock back, checkout expired or failed, its orders cancelled. Paid ones are left alone. */
export async function releaseCheckout(tx: Tx, checkoutId: string, to: "expired" | "failed", now = new Date()): Promise<ReleaseOutcome> {
  const checkout = await lockCheckout(tx, checkoutId);
  if (!checkout) return { released: false, status: "missing", restored: [] };
  if (checkout.status !== "open") return { released: false, status: checkout.status, restored: [] };
  const restored = await releaseHeldStock(tx, checkoutId);
  await tx.update(checkouts).set({ status: to }).where(eq(checkouts.id, checkoutId));
  await tx
    .update(orders)
    .set({ state: "cancelled", cancelledAt: now, updatedAt: now })
    .where(and(eq(orders.checkoutId, checkoutId), eq(orders.state, "awaiting_payment")));
  return { released: true, status: to, restored };
}

/** The provider did not answer at session creation: nothing was charged, so the hold ends now. */
export async function abandonCheckout(checkoutId: string): Promise<ReleaseOutcome> {
  return db.transaction((tx) => releaseCheckout(tx, checkoutId, "failed"));
}

export type PaidOutcome =
  | { kind: "missing" }
  | { kind: "already-paid" }
  | { kind: "already-refunded" }
  | { kind: "paid"; reReserved: boolean; mailIds: string[] }
  | { kind: "refund-needed"; mailIds: string[] };

class StockGone extends Error {}

/** After a release, a late payment takes the stock again if it is still there (all lines or none). */
async function reReserve(tx: Tx, checkoutId: string): Promise<boolean> {
  try {
    await tx.transaction(async (savepoint) => {
      const wanted = await savepoint
        .select({ listingId: stockReservations.listingId, quantity: sql<number>`sum(${stockReservations.quantity})::int` })
        .from(stockReservations)
        .where(and(eq(stockReservations.checkoutId, checkoutId), eq(stockReservations.status, "released")))
        .groupBy(stockReservations.listingId)
        .orderBy(asc(stockReservations.listingId));
      for (const line of wanted) {
        const [row] = await savepoint
          .update(listings)
          .set({ stock: sql`${listings.stock} - ${line.quantity}` })
          .where(and(eq(listings.id, line.listingId), eq(listings.state, "live"), gte(listings.stock, line.quantity)))
          .returning({ id: listings.id });
        if (!row) throw new StockGone();
      }
      await savepoint
        .update(stockReservations)
        .set({ status: "committed" })
        .where(and(eq(stockReservations.checkoutId, checkoutId), eq(stockReservations.status, "released")));
    });
    return true;
  } catch (error) {
    if (error instanceof StockGone) return false;
    throw error;
  }
}

/**
 * The provider says the checkout is paid (a verified `checkout.session.completed`). Runs inside the
 * webhook's transaction. Open → paid, reservations committed. Already paid → nothing. Released
 * (expired or failed) before the money arrived → take the stock again if every line still has it,
 * else the checkout stays failed and the caller refunds in full after commit.
 */
export async function completeCheckoutPayment(
  tx: Tx,
  input: { checkoutId: string; sessionId: string; paymentIntentId: string | null; paidAt: Date },
): Promise<PaidOutcome> {
  const checkout = await lockCheckout(tx, input.checkoutId);
  if (!checkout) return { kind: "missing" };
  if (checkout.status === "paid") return { kind: "already-paid" };
  // A late payment we already decided to refund stays refunded, whatever arrives after.
  if (checkout.status === "failed" && checkout.paymentIntentId !== null) return { kind: "already-refunded" };

  let reReserved = false;
  if (checkout.status === "open") {
    await tx
      .update(stockReservations)
      .set({ status: "committed" })
      .where(and(eq(stockReservations.checkoutId, checkout.id), eq(stockReservations.status, "held")));
  } else {
    reReserved = await reReserve(tx, checkout.id);
    if (!reReserved) {
      await tx.update(checkouts).set({ status: "failed", paymentIntentId: input.paymentIntentId, sessionId: checkout.sessionId ?? input.sessionId }).where(eq(checkouts.id, checkout.id));
      const mailId = await enqueueRefundNotice(tx, checkout);
      return { kind: "refund-needed", mailIds: [mailId] };
    }
  }

  await tx
    .update(checkouts)
    .set({ status: "paid", paidAt: input.paidAt, paymentIntentId: input.paymentIntentId, sessionId: checkout.sessionId ?? input.sessionId })
    .where(eq(checkouts.id, checkout.id));
  await tx
    .update(orders)
    .set({ state: "paid", paidAt: input.paidAt, cancelledAt: null, updatedAt: input.paidAt })
    .where(and(eq(orders.checkoutId, checkout.id), inArray(orders.state, ["awaiting_payment", "cancelled"])));
  const bought = await tx.selectDistinct({ listingId: stockReservations.listingId }).from(stockReservations).where(eq(stockReservations.checkoutId, checkout.id));
  await removePurchasedItems(tx, checkout.buyerId, bought.map((b) => b.listingId));
  const mailIds = await enqueuePaidMail(tx, checkout);
  return { kind: "paid", reReserved, mailIds };
}

async function ordersWithLines(executor: Executor, checkoutId: string) {
  const rows = await executor
    .select({
      orderId: orders.id,
      number: orders.number,
      sellerId: orders.sellerId,
      sellerName: users.name,
      sellerEmail: users.email,
      shopName: sql<string>`coalesce(${sellerProfiles.shopName}, ${users.name}, 'A Fluxyard seller')`,
      subtotalMinor: orders.subtotalMinor,
      feeMinor: orders.feeMinor,
      sellerShareMinor: orders.sellerShareMinor,
      title: orderLines.title,
      quantity: orderLines.quantity,
      unitPriceMinor: orderLines.unitPriceMinor,
    })
    .from(orders)
    .innerJoin(orderLines, eq(orderLines.orderId, orders.id))
    .innerJoin(users, eq(users.id, orders.sellerId))
    .leftJoin(sellerProfiles, eq(sellerProfiles.userId, orders.sellerId))
    .where(eq(orders.checkoutId, checkoutId))
    .orderBy(asc(orders.number), asc(orderLines.title));
  const byOrder = new Map<string, (typeof rows)[number] & { lines: { title: string; quantity: number; unitPriceMinor: number }[] }>();
  for (const row of rows) {
    const entry = byOrder.get(row.orderId) ?? { ...row, lines: [] };
    entry.lines.push({ title: row.title, quantity: row.quantity, unitPriceMinor: row.unitPriceMinor });
    byOrder.set(row.orderId, entry);
  }
  return [...byOrder.values()];
}

async function buyerName(executor: Executor, buyerId: string): Promise<string> {
  const [row] = await executor.select({ name: users.name }).from(users).where(eq(users.id, buyerId));
  return row?.name ?? "there";
}

async function enqueuePaidMail(tx: Tx, checkout: typeof checkouts.$inferSelect): Promise<string[]> {
  const appUrl = env().APP_URL;
  const grouped = await ordersWithLines(tx, checkout.id);
  const ids = [
    await enqueueMail(tx, {
      template: orderPaidBuyerMail,
      to: checkout.email,
      props: {
        buyerName: await buyerName(tx, checkout.buyerId),
        currency: checkout.currency,
        totalMinor: checkout.totalMinor,
        orders: grouped.map((o) => ({ number: o.number, shopName: o.shopName, subtotalMinor: o.subtotalMinor, lines: o.lines })),
        ordersUrl: `${appUrl}/orders`,
      },
    }),
  ];
  for (const order of grouped) {
    if (!order.sellerEmail) continue;
    ids.push(
      await enqueueMail(tx, {
        template: orderPaidSellerMail,
        to: order.sellerEmail,
        props: {
          sellerName: order.sellerName ?? order.shopName,
          orderNumber: order.number,
          currency: checkout.currency,
          subtotalMinor: order.subtotalMinor,
          feeMinor: order.feeMinor,
          sellerShareMinor: order.sellerShareMinor,
          feeRate: formatFeeRate(checkout.feeBps),
          lines: order.lines,
          ordersUrl: `${appUrl}/sell/orders`,
        },
      }),
    );
  }
  return ids;
}

async function enqueueRefundNotice(tx: Tx, checkout: typeof checkouts.$inferSelect): Promise<string> {
  const titles = await tx
    .selectDistinct({ title: orderLines.title })
    .from(orderLines)
    .innerJoin(orders, eq(orders.id, orderLines.orderId))
    .where(eq(orders.checkoutId, checkout.id));
  return enqueueMail(tx, {
    template: orderPaidRefundedMail,
    to: checkout.email,
    props: {
      buyerName: await buyerName(tx, checkout.buyerId),
      currency: checkout.currency,
      totalMinor: checkout.totalMinor,
      titles: titles.map((t) => t.title),
      cartUrl: `${env().APP_URL}/cart`,
    },
  });
}

export async function checkoutBySession(executor: Executor, sessionId: string) {
  const [row] = await executor.select({ id: checkouts.id }).from(checkouts).where(eq(checkouts.sessionId, sessionId));
  return row?.id ?? null;
}

// ---- after commit: money to sellers, and refunds of late payments ----

export type TransferDue = {
  orderId: string;
  number: string;
  checkoutId: string;
  currency: string;
  sellerShareMinor: number;
  destination: string;
  paymentIntentId: string;
};

/** Paid orders whose seller share has not been sent yet (never for refunded or cancelled ones). */
export async function transfersDue(filter: { checkoutId?: string } = {}, limit = 50): Promise<TransferDue[]> {
  const rows = await db
    .select({
      orderId: orders.id,
      number: orders.number,
      checkoutId: orders.checkoutId,
      currency: orders.currency,
      sellerShareMinor: orders.sellerShareMinor,
      destination: sellerProfiles.payoutAccountId,
      paymentIntentId: checkouts.paymentIntentId,
    })
    .from(orders)
    .innerJoin(checkouts, eq(checkouts.id, orders.checkoutId))
    .innerJoin(sellerProfiles, eq(sellerProfiles.userId, orders.sellerId))
    .where(
      and(
        filter.checkoutId ? eq(orders.checkoutId, filter.checkoutId) : undefined,
        eq(checkouts.status, "paid"),
        inArray(orders.state, ["paid", "shipped", "delivered"]),
        isNull(orders.transferId),
        eq(orders.refundedMinor, 0),
        sql`${orders.sellerShareMinor} > 0`,
        sql`${checkouts.paymentIntentId} is not null`,
        sql`${sellerProfiles.payoutAccountId} is not null`,
      ),
    )
    .orderBy(asc(orders.createdAt))
    .limit(limit);
  return rows.map((r) => ({ ...r, destination: r.destination!, paymentIntentId: r.paymentIntentId! }));
}

export async function recordTransfer(orderId: string, transferId: string): Promise<void> {
  await db.update(orders).set({ transferId, updatedAt: new Date() }).where(and(eq(orders.id, orderId), isNull(orders.transferId)));
}

export type RefundDue = { orderId: string; checkoutId: string; subtotalMinor: number; paymentIntentId: string };

/** Orders of a checkout paid after its stock was gone: refunded in full, one refund per order. */
export async function lateRefundsDue(filter: { checkoutId?: string } = {}, limit = 50): Promise<RefundDue[]> {
  const rows = await db
    .select({ orderId: orders.id, checkoutId: orders.checkoutId, subtotalMinor: orders.subtotalMinor, paymentIntentId: checkouts.paymentIntentId })
    .from(orders)
    .innerJoin(checkouts, eq(checkouts.id, orders.checkoutId))
    .where(
      and(
        filter.checkoutId ? eq(orders.checkoutId, filter.checkoutId) : undefined,
        eq(checkouts.status, "failed"),
        sql`${checkouts.paymentIntentId} is not null`,
        eq(orders.state, "cancelled"),
        eq(orders.refundedMinor, 0),
      ),
    )
    .limit(limit);
  return rows.map((r) => ({ ...r, paymentIntentId: r.paymentIntentId! }));
}

export const LATE_PAYMENT_REFUND_REASON = "Paid after the hold on the stock ran out, and the stock was sold meanwhile";

export async function recordLateRefund(orderId: string, amountMinor: number, providerRefundId: string): Promise<void> {
  await db.transaction(async (tx) => {
    const inserted = await tx
      .insert(refunds)
      .values({ orderId, amountMinor, providerRefundId, reason: LATE_PAYMENT_REFUND_REASON })
      .onConflictDoNothing()
      .returning({ id: refunds.id });
    if (inserted.length === 0) return;
    await tx.update(orders).set({ refundedMinor: amountMinor, state: "refunded", updatedAt: new Date() }).where(and(eq(orders.id, orderId), eq(orders.refundedMinor, 0)));
  });
}

/** Open checkouts whose hold ran out more than `graceMs` ago and whose expiry event never came. */
export async function overdueCheckouts(now: Date, graceMs: number, limit = 100): Promise<{ id: string; sessionId: string | null }[]> {
  return db
    .select({ id: checkouts.id, sessionId: checkouts.sessionId })
    .from(checkouts)
    .where(and(eq(checkouts.status, "open"), lt(checkouts.expiresAt, new Date(now.getTime() - graceMs))))
    .orderBy(asc(checkouts.expiresAt))
    .limit(limit);
}

export async function expireOverdueCheckout(checkoutId: string): Promise<ReleaseOutcome> {
  return db.transaction((tx) => releaseCheckout(tx, checkoutId, "expired"));
}

// ---- reads for the buyer ----

export type BuyerCheckoutStatus = {
  id: string;
  status: "open" | "paid" | "expired" | "failed";
  currency: string;
  totalMinor: number;
  orders: { id: string; number: string; state: string; shopName: string; subtotalMinor: number }[];
};

export async function buyerCheckoutBySession(sessionId: string, buyerId: string): Promise<BuyerCheckoutStatus | null> {
  const [checkout] = await db
    .select({ id: checkouts.id, status: checkouts.status, currency: checkouts.currency, totalMinor: checkouts.totalMinor })
    .from(checkouts)
    .where(and(eq(checkouts.sessionId, sessionId), eq(checkouts.buyerId, buyerId)));
  if (!checkout) return null;
  const rows = await db
    .select({
      id: orders.id,
      number: orders.number,
      state: orders.state,
      shopName: sql<string>`coalesce(${sellerProfiles.shopName}, ${users.name}, 'A Fluxyard seller')`,
      subtotalMinor: orders.subtotalMinor,
    })
    .from(orders)
    .innerJoin(users, eq(users.id, orders.sellerId))
    .leftJoin(sellerProfiles, eq(sellerProfiles.userId, orders.sellerId))
    .where(eq(orders.checkoutId, checkout.id))
    .orderBy(asc(orders.number));
  return { ...checkout, orders: rows };
}

export async function buyerCheckout(checkoutId: string, buyerId: string) {
  const [row] = await db
    .select({ id: checkouts.id, status: checkouts.status, sessionId: checkouts.sessionId })
    .from(checkouts)
    .where(and(eq(checkouts.id, checkoutId), eq(checkouts.buyerId, buyerId)));
  return row ?? null;
}

/** The buyer came back through the provider's cancel link: release now rather than at expiry. */
export async function cancelOpenCheckout(checkoutId: string): Promise<ReleaseOutcome> {
  return db.transaction((tx) => releaseCheckout(tx, checkoutId, "expired"));
}

/** The sheets the checkout page asks the buyer to acknowledge, as they stand now. */
export async function sheetsForAcknowledgement(listingIds: string[]) {
  if (listingIds.length === 0) return [];
  return db
    .select({
      listingId: listings.id,
      slug: listings.slug,
      title: listings.title,
      kind: listings.kind,
      magneticSubtype: listings.magneticSubtype,
      declaration: listings.declaration,
      sheetRevision: listings.sheetRevision,
    })
    .from(listings)
    .where(inArray(listings.id, listingIds))
    .orderBy(asc(listings.title));
}
