// Orders of the Larkspur Yard demo, one in each state a buyer or seller meets: awaiting payment, paid
// (to ship), shipped, delivered, delivered and partly refunded, refunded in full, refunded after an
// accepted return, a return declined and one waiting, cancelled by the seller, and checkouts that
// expired or failed. Amounts follow the product's own rules (lib/checkout/fees.ts, lib/orders/*).
//
// Provider ids here (pi_seed_…, tr_seed_…, re_seed_…) are placeholders: `npm start` replaces them with
// real objects in the payments stand-in (fakes/demo-payments.ts), so a seller can refund or ship.
import { createHash } from "node:crypto";
import { splitFee } from "@/lib/checkout/fees";
import { acknowledgementHazards, needsAcknowledgement } from "@/lib/checkout/hazards";
import { orderNumber } from "@/lib/checkout/order-number";
import { RESERVATION_HOLD_MS } from "@/lib/checkout/reservation";
import { lineTotalMinor } from "@/lib/orders/refund-limits";
import { splitRefund } from "@/lib/orders/refund-split";
import { stateAfterRefund } from "@/lib/orders/transitions";
import { CURRENT_POLICY_REVISION, type PolicyRevision, type SafetyDeclaration } from "@/lib/policy";
import * as schema from "./schema";
import { DEMO_ACCOUNTS } from "./seed-data";
import { DEMO_LISTINGS } from "./seed-listings";
import { DEMO_STORY_LISTINGS, RETIRED_ID } from "./seed-listing-states";
import { demoRevisions } from "./seed-policy";
import { demoUuid, seedAudit, type DemoClock, type SeedAudit, type SeedTx } from "./seed-support";

export const DEMO_FEE_BPS = 800;

const KIT = "0b7d1c3e-5a21-4c6e-9f10-000000000001";
const GATE_BOARD = "0b7d1c3e-5a21-4c6e-9f10-000000000002";
const CHOKE = "0b7d1c3e-5a21-4c6e-9f10-000000000003";
const TRANSFORMER = "0b7d1c3e-5a21-4c6e-9f10-000000000004";

const NOOR = "demo-builder";
const JORY = "demo-builder-2";
const TAMSIN = "demo-reviewer";
const BRAM = "demo-seller-kits";
const IDUNN = "demo-seller-magnetics";

type Sold = { id: string; title: string; priceMinor: number; declaration: SafetyDeclaration; kind: string; magneticSubtype: string | null };

function sold(id: string): Sold {
  const base = DEMO_LISTINGS.find((l) => l.id === id);
  if (base) return { id, title: base.title, priceMinor: base.priceMinor, declaration: base.declaration, kind: base.kind, magneticSubtype: base.magneticSubtype ?? null };
  const story = DEMO_STORY_LISTINGS.find((l) => l.id === id);
  if (story) return { id, title: story.title, priceMinor: story.priceMinor, declaration: story.declaration, kind: story.kind, magneticSubtype: null };
  throw new Error(`no demo listing ${id}`);
}

type RefundSpec = { line: number; amountMinor: number | "rest"; reason: string; at: Date; kind: "line" | "cancel" | "return" };
type ReturnSpec = { reason: string; at: Date; status: "requested" | "accepted" | "declined"; decidedAt?: Date; decisionReason?: string };

type OrderSpec = {
  n: number;
  sellerId: string;
  lines: { listingId: string; quantity: number }[];
  /** the state it must end in; checked against what its events add up to */
  state: schema.OrderState;
  shipped?: { at: Date; carrier: string; trackingRef: string };
  delivered?: { at: Date; by: "buyer" | "seller" };
  cancelledAt?: Date;
  refunds?: RefundSpec[];
  returns?: ReturnSpec[];
};

type CheckoutSpec = {
  n: number;
  buyerId: string;
  createdAt: Date;
  status: (typeof schema.CHECKOUT_STATUSES)[number];
  paidAt?: Date;
  expiresAt: Date;
  hasSession: boolean;
  orders: OrderSpec[];
};

/** The checkouts, newest story last; every time is relative to the first seeding. */
export function demoCheckouts({ ago, ahead }: DemoClock): CheckoutSpec[] {
  const paid = (n: number, buyerId: string, at: Date, orders: OrderSpec[]): CheckoutSpec => ({
    n,
    buyerId,
    createdAt: at,
    status: "paid",
    paidAt: new Date(at.getTime() + 4 * 60_000),
    expiresAt: new Date(at.getTime() + RESERVATION_HOLD_MS),
    hasSession: true,
    orders,
  });
  return [
    paid(1, NOOR, ago(40, 2), [
      { n: 1, sellerId: BRAM, lines: [{ listingId: KIT, quantity: 1 }], state: "delivered", shipped: { at: ago(38), carrier: "Larkspur Courier", trackingRef: "LC-2026-104417" }, delivered: { at: ago(33), by: "buyer" } },
      {
        n: 2,
        sellerId: IDUNN,
        lines: [
          { listingId: CHOKE, quantity: 1 },
          { listingId: TRANSFORMER, quantity: 1 },
        ],
        state: "delivered",
        shipped: { at: ago(37), carrier: "Yardline Parcel", trackingRef: "YP 5521 0093" },
        delivered: { at: ago(34), by: "seller" },
      },
    ]),
    paid(2, JORY, ago(4), [{ n: 3, sellerId: BRAM, lines: [{ listingId: GATE_BOARD, quantity: 2 }], state: "shipped", shipped: { at: ago(2), carrier: "Larkspur Courier", trackingRef: "LC-2026-118902" } }]),
    paid(3, NOOR, ago(0, 6), [{ n: 4, sellerId: BRAM, lines: [{ listingId: GATE_BOARD, quantity: 1 }], state: "paid" }]),
    paid(4, JORY, ago(16), [
      {
        n: 5,
        sellerId: IDUNN,
        lines: [{ listingId: CHOKE, quantity: 2 }],
        state: "delivered",
        shipped: { at: ago(14), carrier: "Yardline Parcel", trackingRef: "YP 5521 1170" },
        delivered: { at: ago(10), by: "buyer" },
        refunds: [{ line: 0, amountMinor: 3200, kind: "line", at: ago(9), reason: "One of the two chokes arrived with a cracked lead-out; half its price back, and the buyer keeps it for its core." }],
      },
    ]),
    paid(5, TAMSIN, ago(30), [
      {
        n: 6,
        sellerId: BRAM,
        lines: [{ listingId: KIT, quantity: 1 }],
        state: "refunded",
        shipped: { at: ago(28), carrier: "Larkspur Courier", trackingRef: "LC-2026-109230" },
        delivered: { at: ago(25), by: "buyer" },
        refunds: [{ line: 0, amountMinor: "rest", kind: "line", at: ago(24), reason: "The main board had a lifted via under the bridge rectifier; refunded in full, no need to send it back." }],
      },
    ]),
    paid(6, JORY, ago(9), [
      {
        n: 7,
        sellerId: BRAM,
        lines: [{ listingId: GATE_BOARD, quantity: 1 }],
        state: "refunded",
        shipped: { at: ago(8), carrier: "Larkspur Courier", trackingRef: "LC-2026-117761" },
        delivered: { at: ago(7), by: "buyer" },
        returns: [{ reason: "I ordered the wrong board: my build needs the half-bridge driver, not the forward one.", at: ago(6), status: "accepted", decidedAt: ago(5) }],
        refunds: [{ line: 0, amountMinor: "rest", kind: "return", at: ago(5), reason: "Return accepted by the seller." }],
      },
    ]),
    paid(7, NOOR, ago(16), [
      {
        n: 8,
        sellerId: IDUNN,
        lines: [{ listingId: TRANSFORMER, quantity: 1 }],
        state: "delivered",
        shipped: { at: ago(14), carrier: "Yardline Parcel", trackingRef: "YP 5521 1203" },
        delivered: { at: ago(12), by: "buyer" },
        returns: [
          {
            reason: "I ordered the 36:7 ratio, but my build needs 32:7.",
            at: ago(11),
            status: "declined",
            decidedAt: ago(10),
            decisionReason: "It was wound to order for a 325 V bus, and wound parts cannot be returned (see my returns policy). I can rewind it to 32:7 at cost.",
          },
        ],
      },
    ]),
    paid(8, TAMSIN, ago(6), [
      {
        n: 9,
        sellerId: IDUNN,
        lines: [{ listingId: CHOKE, quantity: 1 }],
        state: "delivered",
        shipped: { at: ago(5), carrier: "Yardline Parcel", trackingRef: "YP 5521 1388" },
        delivered: { at: ago(3), by: "buyer" },
        returns: [{ reason: "It fits, but I measure 17 µH at 100 A where the listing says 20 µH; I would like to send it back.", at: ago(1), status: "requested" }],
      },
    ]),
    paid(9, JORY, ago(21), [
      {
        n: 10,
        sellerId: BRAM,
        lines: [{ listingId: KIT, quantity: 1 }],
        state: "cancelled",
        cancelledAt: ago(20),
        refunds: [{ line: 0, amountMinor: "rest", kind: "cancel", at: ago(20), reason: "Order cancelled by the seller before shipping." }],
      },
    ]),
    {
      // Still being paid for: the hold on the stock runs for a day so the demo shows it (the product's own checkouts hold for 31 minutes).
      n: 10,
      buyerId: NOOR,
      createdAt: ago(0, 1),
      status: "open",
      expiresAt: ahead(0, 23),
      hasSession: false,
      orders: [{ n: 11, sellerId: IDUNN, lines: [{ listingId: CHOKE, quantity: 1 }], state: "awaiting_payment" }],
    },
    {
      n: 11,
      buyerId: JORY,
      createdAt: ago(9, 3),
      status: "expired",
      expiresAt: new Date(ago(9, 3).getTime() + RESERVATION_HOLD_MS),
      hasSession: true,
      orders: [{ n: 12, sellerId: BRAM, lines: [{ listingId: GATE_BOARD, quantity: 1 }], state: "cancelled", cancelledAt: new Date(ago(9, 3).getTime() + RESERVATION_HOLD_MS) }],
    },
    {
      // The provider did not answer when the session was to be opened: nothing charged, the hold released at once.
      n: 12,
      buyerId: TAMSIN,
      createdAt: ago(7, 5),
      status: "failed",
      expiresAt: new Date(ago(7, 5).getTime() + RESERVATION_HOLD_MS),
      hasSession: false,
      orders: [{ n: 13, sellerId: IDUNN, lines: [{ listingId: TRANSFORMER, quantity: 1 }], state: "cancelled", cancelledAt: new Date(ago(7, 5).getTime() + 5_000) }],
    },
    paid(13, NOOR, ago(65), [
      {
        n: 14,
        sellerId: BRAM,
        lines: [{ listingId: RETIRED_ID, quantity: 1 }],
        state: "delivered",
        shipped: { at: ago(63), carrier: "Larkspur Courier", trackingRef: "LC-2026-099154" },
        delivered: { at: ago(60), by: "seller" },
      },
    ]),
  ];
}

export const checkoutId = (n: number) => demoUuid("checkout", n);
export const orderId = (n: number) => demoUuid("order", n);
const lineId = (order: number, i: number) => demoUuid("order-line", order * 10 + i);
const refundId = (order: number, i: number) => demoUuid("refund", order * 10 + i);
const returnId = (order: number, i: number) => demoUuid("return", order * 10 + i);

/** The placeholder provider ids the seed writes; fakes/demo-payments.ts recognises them by these prefixes. */
export const PLACEHOLDER = {
  paymentIntent: (checkout: number) => `pi_seed_${checkout}`,
  session: (checkout: number) => `cs_seed_${checkout}`,
  transfer: (order: number) => `tr_seed_${order}`,
  refund: (order: number, i: number) => `re_seed_${order}_${i}`,
  reversal: (order: number, i: number) => `trr_seed_${order}_${i}`,
};

function policyInForce(clock: DemoClock, at: Date): PolicyRevision {
  const [two, three] = demoRevisions(clock);
  if (at >= three.publishedAt) return three.rules;
  if (at >= two.publishedAt) return two.rules;
  return CURRENT_POLICY_REVISION;
}

function numberFor(at: Date, n: number): string {
  const bytes = createHash("sha1").update(`fluxyard-demo:order-number:${n}`).digest();
  return orderNumber(at, (count) => bytes.subarray(0, count));
}

function emailOf(userId: string): string {
  const account = DEMO_ACCOUNTS.find((a) => a.id === userId);
  if (!account) throw new Error(`no demo account ${userId}`);
  return account.email;
}

/** Inserts the demo checkouts that are missing, each with its orders and their history; returns how many. */
export async function seedOrders(tx: SeedTx, clock: DemoClock): Promise<number> {
  let inserted = 0;
  const numbers = new Set<string>();
  for (const c of demoCheckouts(clock)) {
    const orders = c.orders.map((o) => {
      const lines = o.lines.map((l, i) => ({ ...l, id: lineId(o.n, i), listing: sold(l.listingId) }));
      const subtotalMinor = lines.reduce((sum, l) => sum + lineTotalMinor({ unitPriceMinor: l.listing.priceMinor, quantity: l.quantity }), 0);
      const number = numberFor(c.createdAt, o.n);
      if (numbers.has(number)) throw new Error(`two demo orders would share the number ${number}`);
      numbers.add(number);
      return { spec: o, lines, subtotalMinor, number, ...splitFee(subtotalMinor, DEMO_FEE_BPS) };
    });
    const totalMinor = orders.reduce((sum, o) => sum + o.subtotalMinor, 0);
    const rows = await tx
      .insert(schema.checkouts)
      .values({
        id: checkoutId(c.n),
        buyerId: c.buyerId,
        email: emailOf(c.buyerId),
        currency: "EUR",
        totalMinor,
        feeBps: DEMO_FEE_BPS,
        status: c.status,
        sessionId: c.hasSession ? PLACEHOLDER.session(c.n) : null,
        paymentIntentId: c.status === "paid" ? PLACEHOLDER.paymentIntent(c.n) : null,
        expiresAt: c.expiresAt,
        paidAt: c.paidAt ?? null,
        createdAt: c.createdAt,
      })
      .onConflictDoNothing()
      .returning({ id: schema.checkouts.id });
    if (rows.length === 0) continue;
    inserted += 1;

    const policy = policyInForce(clock, c.createdAt);
    const acknowledged = orders.flatMap((o) => o.lines).filter((l) => needsAcknowledgement(l.listing.declaration));
    if (acknowledged.length > 0) {
      await tx.insert(schema.orderAcknowledgements).values(
        acknowledged.map((l, i) => ({
          id: demoUuid("order-ack", c.n * 10 + i),
          checkoutId: checkoutId(c.n),
          listingId: l.listingId,
          sheetRevision: 1,
          policyRevision: policy.revision,
          hazards: acknowledgementHazards(l.listing.declaration, policy),
          acknowledgedAt: new Date(c.createdAt.getTime() - 60_000),
        })),
      );
    }
    const reservation = c.status === "open" ? "held" : c.status === "paid" ? "committed" : "released";
    await tx.insert(schema.stockReservations).values(
      orders.flatMap((o) => o.lines).map((l, i) => ({ id: demoUuid("reservation", c.n * 10 + i), checkoutId: checkoutId(c.n), listingId: l.listingId, quantity: l.quantity, status: reservation as (typeof schema.RESERVATION_STATUSES)[number], expiresAt: c.expiresAt, createdAt: c.createdAt })),
    );
    for (const o of orders) await seedOrder(tx, c, o);
  }
  return inserted;
}

type BuiltOrder = {
  spec: OrderSpec;
  lines: { id: string; listingId: string; quantity: number; listing: Sold }[];
  subtotalMinor: number;
  feeMinor: number;
  sellerShareMinor: number;
  number: string;
};

async function seedOrder(tx: SeedTx, c: CheckoutSpec, o: BuiltOrder) {
  const spec = o.spec;
  const id = orderId(spec.n);
  const audit: SeedAudit[] = [];
  const entry = (at: Date, actorId: string | null, action: string, details: Record<string, unknown>, reason?: string | null, subject?: { type: string; id: string }) =>
    audit.push({ at, actorId, action, subjectType: subject?.type ?? "order", subjectId: subject?.id ?? id, reason: reason ?? null, details });

  // The order's life, event by event, with the state each leaves it in.
  let state: schema.OrderState = c.status === "paid" ? "paid" : c.status === "open" ? "awaiting_payment" : "cancelled";
  let updatedAt = c.paidAt ?? c.createdAt;
  if (spec.shipped) {
    entry(spec.shipped.at, spec.sellerId, "order.shipped", { from: state, to: "shipped", carrier: spec.shipped.carrier, trackingRef: spec.shipped.trackingRef });
    state = "shipped";
    updatedAt = spec.shipped.at;
  }
  if (spec.delivered) {
    entry(spec.delivered.at, spec.delivered.by === "buyer" ? c.buyerId : spec.sellerId, "order.delivered", { from: state, to: "delivered", by: spec.delivered.by });
    state = "delivered";
    updatedAt = spec.delivered.at;
  }
  const transferId = c.status === "paid" ? PLACEHOLDER.transfer(spec.n) : null;

  const lineRefunded = new Map<number, number>();
  let refundedMinor = 0;
  const refundRows: (typeof schema.refunds.$inferInsert)[] = [];
  const returnRows: (typeof schema.returnRequests.$inferInsert)[] = [];
  for (const [i, r] of (spec.returns ?? []).entries()) {
    returnRows.push({ id: returnId(spec.n, i), orderId: id, reason: r.reason, status: r.status, decisionReason: r.decisionReason ?? null, decidedAt: r.decidedAt ?? null, createdAt: r.at });
    entry(r.at, c.buyerId, "order.return_requested", { returnId: returnId(spec.n, i) }, r.reason);
    if (r.status === "declined") entry(r.decidedAt!, spec.sellerId, "order.return_declined", { returnId: returnId(spec.n, i) }, r.decisionReason);
  }
  if (spec.cancelledAt && c.status === "paid") {
    const refundIds = (spec.refunds ?? []).map((_, i) => refundId(spec.n, i));
    const refundTotal = o.lines.reduce((sum, l) => sum + lineTotalMinor({ unitPriceMinor: l.listing.priceMinor, quantity: l.quantity }), 0);
    entry(spec.cancelledAt, spec.sellerId, "order.cancelled", { from: state, to: "cancelled", restocked: o.lines.map((l) => ({ listingId: l.listingId, quantity: l.quantity })), refundIds, refundMinor: refundTotal });
    state = "cancelled";
    updatedAt = spec.cancelledAt;
  } else if (spec.cancelledAt) {
    updatedAt = spec.cancelledAt;
  }
  for (const [i, r] of (spec.refunds ?? []).entries()) {
    const line = o.lines[r.line]!;
    const lineTotal = lineTotalMinor({ unitPriceMinor: line.listing.priceMinor, quantity: line.quantity });
    const amountMinor = r.amountMinor === "rest" ? lineTotal - (lineRefunded.get(r.line) ?? 0) : r.amountMinor;
    const rid = refundId(spec.n, i);
    const split = splitRefund({ subtotalMinor: o.subtotalMinor, feeMinor: o.feeMinor, refundedBeforeMinor: refundedMinor, amountMinor });
    refundRows.push({ id: rid, orderId: id, orderLineId: line.id, amountMinor, providerRefundId: PLACEHOLDER.refund(spec.n, i), reason: r.reason, actorId: spec.sellerId, createdAt: r.at });
    if (r.kind === "line") entry(r.at, spec.sellerId, "order.refund_requested", { refundId: rid, lineId: line.id, amountMinor }, r.reason);
    if (r.kind === "return") {
      const accepted = (spec.returns ?? []).findIndex((x) => x.status === "accepted");
      entry(r.at, spec.sellerId, "order.return_accepted", { returnId: returnId(spec.n, accepted), refundIds: [rid], refundMinor: amountMinor });
    }
    const from = state;
    lineRefunded.set(r.line, (lineRefunded.get(r.line) ?? 0) + amountMinor);
    refundedMinor += amountMinor;
    state = stateAfterRefund(state, o.subtotalMinor, refundedMinor);
    updatedAt = r.at;
    entry(r.at, spec.sellerId, "order.refund_settled", { refundId: rid, providerRefundId: PLACEHOLDER.refund(spec.n, i), lineId: line.id, amountMinor, feeRefundMinor: split.feeMinor, sellerRefundMinor: split.sellerMinor, from, to: state }, r.reason);
    if (transferId && split.sellerMinor > 0) {
      entry(r.at, null, "refund.transfer_reversed", { orderId: id, transferId, reversalId: PLACEHOLDER.reversal(spec.n, i), amountMinor: split.sellerMinor }, null, { type: "refund", id: rid });
    }
  }
  if (state !== spec.state) throw new Error(`demo order ${spec.n} would end ${state}, not ${spec.state}`);

  await tx.insert(schema.orders).values({
    id,
    number: o.number,
    checkoutId: checkoutId(c.n),
    buyerId: c.buyerId,
    sellerId: spec.sellerId,
    state,
    currency: "EUR",
    subtotalMinor: o.subtotalMinor,
    feeMinor: o.feeMinor,
    sellerShareMinor: o.sellerShareMinor,
    refundedMinor,
    transferId,
    carrier: spec.shipped?.carrier ?? null,
    trackingRef: spec.shipped?.trackingRef ?? null,
    paidAt: c.paidAt ?? null,
    shippedAt: spec.shipped?.at ?? null,
    deliveredAt: spec.delivered?.at ?? null,
    cancelledAt: spec.cancelledAt ?? null,
    createdAt: c.createdAt,
    updatedAt,
  });
  await tx.insert(schema.orderLines).values(
    o.lines.map((l, i) => ({
      id: l.id,
      orderId: id,
      listingId: l.listingId,
      title: l.listing.title,
      unitPriceMinor: l.listing.priceMinor,
      quantity: l.quantity,
      refundedMinor: lineRefunded.get(i) ?? 0,
      sheetRevision: 1,
    })),
  );
  if (refundRows.length > 0) await tx.insert(schema.refunds).values(refundRows);
  if (returnRows.length > 0) await tx.insert(schema.returnRequests).values(returnRows);
  await seedAudit(tx, audit);
}
