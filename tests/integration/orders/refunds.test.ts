import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { auditActions, BUYER, createPaidOrder, orderRow, outbox, startWorld, type World } from "./world";

// Jobs are only a nudge after commit (the outbox row is the record); no pg-boss in these tests.
vi.mock("@/lib/jobs/boss", () => ({ sendJob: async () => {} }));

// Refund amounts are checked against the payments fake's own charge and transfer objects, read back
// through the real SDK: `amount_refunded` on the charge, `amount_reversed` on the transfer.
let world: World;

beforeAll(async () => {
  world = await startWorld("orders_refunds");
});

afterAll(async () => {
  await world?.close();
});

async function charge(id: string) {
  return world.stripe.charges.retrieve(id);
}

async function providerRefunds(intentId: string) {
  return (await world.stripe.refunds.list({ payment_intent: intentId, limit: 100 })).data;
}

async function stock(listingId: string): Promise<number> {
  const { rows } = await world.pool.query("select stock from listings where id = $1", [listingId]);
  return rows[0].stock;
}

describe("shipping", () => {
  it("marks a paid order shipped with carrier and tracking, once, with an audit entry and the buyer's e-mail", async () => {
    const { shipOrder, OrderError } = await import("@/db/queries/orders");
    const o = await createPaidOrder(world, { lines: [{ title: "Half-bridge driver board", unitPriceMinor: 8_900, quantity: 1, stockLeft: 3 }], feeMinor: 712 });
    expect(await shipOrder({ orderId: o.orderId, actorId: "demo-seller-kits", carrier: "Yard Post", trackingRef: "YP-2026-0042" })).toEqual({ from: "paid", to: "shipped" });
    const row = await orderRow(world, o.orderId);
    expect(row).toMatchObject({ state: "shipped", carrier: "Yard Post", tracking_ref: "YP-2026-0042" });
    expect(row.shipped_at).toBeInstanceOf(Date);
    // A second click finds it shipped already and changes nothing.
    await expect(shipOrder({ orderId: o.orderId, actorId: "demo-seller-kits", carrier: "Other", trackingRef: "XX-1111" })).rejects.toMatchObject({ status: 409 });
    await expect(shipOrder({ orderId: o.orderId, actorId: "demo-seller-kits", carrier: "Other", trackingRef: "XX-1111" })).rejects.toBeInstanceOf(OrderError);
    expect((await orderRow(world, o.orderId)).tracking_ref).toBe("YP-2026-0042");
    expect(await auditActions(world, o.orderId)).toEqual(["order.shipped"]);
    const mails = (await outbox(world, "order-shipped")).filter((m) => m.props.orderNumber === o.number);
    expect(mails).toHaveLength(1);
    expect(mails[0]).toMatchObject({ to: "noor.builds@larkspur.test", props: { carrier: "Yard Post", trackingRef: "YP-2026-0042" } });
  });
});

describe("cancellation", () => {
  it("refunds every line in full in the fake, restores the stock exactly once and reverses the seller's transfer, even with two cancels at once", async () => {
    const { cancelOrder } = await import("@/db/queries/orders");
    const o = await createPaidOrder(world, {
      lines: [
        { title: "Gate-drive kit", unitPriceMinor: 4_850, quantity: 2, stockLeft: 1 },
        { title: "Snubber board", unitPriceMinor: 1_200, quantity: 3, stockLeft: 0 },
      ],
      // 8 % of 13 300, rounded half up: 1 064.
      feeMinor: 1_064,
    });
    const results = await Promise.allSettled([
      cancelOrder({ orderId: o.orderId, actorId: "demo-seller-kits" }),
      cancelOrder({ orderId: o.orderId, actorId: "demo-seller-kits" }),
    ]);
    const done = results.filter((r) => r.status === "fulfilled");
    const refused = results.filter((r) => r.status === "rejected");
    expect(done).toHaveLength(1);
    expect(refused).toHaveLength(1);
    expect((refused[0] as PromiseRejectedResult).reason).toMatchObject({ status: 409 });
    const outcome = (done[0] as PromiseFulfilledResult<Awaited<ReturnType<typeof cancelOrder>>>).value;
    expect(outcome.refunds.map((r) => r.status)).toEqual(["refunded", "refunded"]);

    expect((await charge(o.chargeId)).amount_refunded).toBe(13_300);
    expect((await providerRefunds(o.intentId)).map((r) => r.amount).sort((a, b) => a - b)).toEqual([3_600, 9_700]);
    expect(await stock(o.listingIds[0]!)).toBe(1 + 2);
    expect(await stock(o.listingIds[1]!)).toBe(0 + 3);
    expect(await orderRow(world, o.orderId)).toMatchObject({ state: "cancelled", refunded_minor: 13_300 });
    // The whole share went back from the seller: the fee and the share split exactly.
    expect((await world.stripe.transfers.retrieve(o.transferId!)).amount_reversed).toBe(13_300 - 1_064);
    expect((await outbox(world, "order-cancelled")).filter((m) => m.props.orderNumber === o.number)).toHaveLength(1);
    expect((await outbox(world, "order-refunded")).filter((m) => m.props.orderNumber === o.number)).toHaveLength(2);
  });

  it("cannot cancel once shipped", async () => {
    const { cancelOrder, shipOrder } = await import("@/db/queries/orders");
    const o = await createPaidOrder(world, { lines: [{ title: "Control board", unitPriceMinor: 3_000, quantity: 1, stockLeft: 0 }], feeMinor: 240 });
    await shipOrder({ orderId: o.orderId, actorId: "demo-seller-kits", carrier: "Yard Post", trackingRef: "YP-1234" });
    await expect(cancelOrder({ orderId: o.orderId, actorId: "demo-seller-kits" })).rejects.toMatchObject({ status: 409 });
    expect(await stock(o.listingIds[0]!)).toBe(0);
    expect((await charge(o.chargeId)).amount_refunded).toBe(0);
  });
});

describe("partial refunds", () => {
  it("refunds part of a line, splits it pro rata, and refuses more than is left of the line", async () => {
    const { refundLine } = await import("@/db/queries/orders");
    // One line of 2 × €25.00; fee 8 % = €4.00, seller's share €46.00.
    const o = await createPaidOrder(world, { lines: [{ title: "Output choke 40 µH", unitPriceMinor: 2_500, quantity: 2, stockLeft: 4 }], feeMinor: 400 });
    const first = await refundLine({ orderId: o.orderId, lineId: o.lineIds[0]!, actorId: "demo-seller-kits", amountMinor: 1_000, reason: "One choke arrived with a cracked bobbin." });
    expect(first.status).toBe("refunded");
    expect((await charge(o.chargeId)).amount_refunded).toBe(1_000);
    expect(await orderRow(world, o.orderId)).toMatchObject({ state: "paid", refunded_minor: 1_000 });
    // Fee back: 1000 × 400 / 5000 = 80 exactly; the seller's part 920 comes off their transfer.
    const { rows } = await world.pool.query("select details from audit_log where action = 'order.refund_settled' and subject_id = $1", [o.orderId]);
    expect(rows[0].details).toMatchObject({ amountMinor: 1_000, feeRefundMinor: 80, sellerRefundMinor: 920 });
    expect((await world.stripe.transfers.retrieve(o.transferId!)).amount_reversed).toBe(920);

    await expect(refundLine({ orderId: o.orderId, lineId: o.lineIds[0]!, actorId: "demo-seller-kits", amountMinor: 4_001, reason: "Too much" })).rejects.toMatchObject({
      status: 409,
      field: "amount",
      message: "At most €40.00 of this line can still be refunded.",
    });
    expect((await charge(o.chargeId)).amount_refunded).toBe(1_000);

    // The rest goes through and, reaching the subtotal, the order is refunded.
    await refundLine({ orderId: o.orderId, lineId: o.lineIds[0]!, actorId: "demo-seller-kits", amountMinor: 4_000, reason: "Second choke also damaged." });
    expect(await orderRow(world, o.orderId)).toMatchObject({ state: "refunded", refunded_minor: 5_000 });
    expect((await charge(o.chargeId)).amount_refunded).toBe(5_000);
    expect((await world.stripe.transfers.retrieve(o.transferId!)).amount_reversed).toBe(4_600);
    await expect(refundLine({ orderId: o.orderId, lineId: o.lineIds[0]!, actorId: "demo-seller-kits", amountMinor: 1, reason: "More" })).rejects.toMatchObject({ status: 409 });
    expect((await outbox(world, "order-refunded")).filter((m) => m.props.orderNumber === o.number).map((m) => m.props.amount)).toEqual(["€10.00", "€40.00"]);
  });

  it("two refunds racing for the same money: only what the line holds goes through", async () => {
    const { refundLine } = await import("@/db/queries/orders");
    const o = await createPaidOrder(world, { lines: [{ title: "Current-sense board", unitPriceMinor: 3_000, quantity: 1, stockLeft: 0 }], feeMinor: 240 });
    const results = await Promise.allSettled([
      refundLine({ orderId: o.orderId, lineId: o.lineIds[0]!, actorId: "demo-seller-kits", amountMinor: 2_000, reason: "First" }),
      refundLine({ orderId: o.orderId, lineId: o.lineIds[0]!, actorId: "demo-seller-kits", amountMinor: 2_000, reason: "Second" }),
    ]);
    expect(results.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    expect((await charge(o.chargeId)).amount_refunded).toBe(2_000);
    expect((await orderRow(world, o.orderId)).refunded_minor).toBe(2_000);
  });

  it("during a payment outage nothing is marked refunded; the sweep later refunds it exactly once", async () => {
    const { refundLine, settlePendingRefunds, processRefund } = await import("@/db/queries/orders");
    const o = await createPaidOrder(world, { lines: [{ title: "Bus capacitor bank", unitPriceMinor: 6_000, quantity: 1, stockLeft: 2 }], feeMinor: 480 });
    await world.paymentsDown(true);
    let pending;
    try {
      pending = await refundLine({ orderId: o.orderId, lineId: o.lineIds[0]!, actorId: "demo-seller-kits", amountMinor: 1_500, reason: "Late delivery" });
    } finally {
      await world.paymentsDown(false);
    }
    expect(pending.status).toBe("pending");
    expect(await orderRow(world, o.orderId)).toMatchObject({ state: "paid", refunded_minor: 0 });
    expect((await charge(o.chargeId)).amount_refunded).toBe(0);
    // The pending refund still holds its amount against the line.
    await expect(refundLine({ orderId: o.orderId, lineId: o.lineIds[0]!, actorId: "demo-seller-kits", amountMinor: 4_501, reason: "Too much" })).rejects.toMatchObject({ status: 409 });

    const swept = await settlePendingRefunds({ olderThanMs: 0 });
    expect(swept.refunded).toBeGreaterThanOrEqual(1);
    expect((await charge(o.chargeId)).amount_refunded).toBe(1_500);
    expect(await orderRow(world, o.orderId)).toMatchObject({ refunded_minor: 1_500 });
    // Running it again, or the same refund again, moves nothing more.
    await settlePendingRefunds({ olderThanMs: 0 });
    expect((await processRefund(pending.refundId)).status).toBe("refunded");
    expect((await providerRefunds(o.intentId)).map((r) => r.amount)).toEqual([1_500]);
    expect((await orderRow(world, o.orderId)).refunded_minor).toBe(1_500);
  });

  it("a refund that reached the provider but was never recorded is found again, not made twice", async () => {
    const { refundLine, processRefund } = await import("@/db/queries/orders");
    const { createProviderRefund } = await import("@/lib/payments/refunds");
    const o = await createPaidOrder(world, { lines: [{ title: "Auxiliary supply board", unitPriceMinor: 2_200, quantity: 1, stockLeft: 0 }], feeMinor: 176 });
    // Record a pending refund while the provider is down, then let its call "succeed" without us hearing of it.
    await world.paymentsDown(true);
    const pending = await refundLine({ orderId: o.orderId, lineId: o.lineIds[0]!, actorId: "demo-seller-kits", amountMinor: 700, reason: "Missing screws" }).finally(() => world.paymentsDown(false));
    const lost = await createProviderRefund({ paymentIntentId: o.intentId, amountMinor: 700, orderId: o.orderId, refundId: pending.refundId });
    expect(lost.kind).toBe("done");
    expect((await processRefund(pending.refundId)).status).toBe("refunded");
    expect((await processRefund(pending.refundId, { lookUpFirst: true })).status).toBe("refunded");
    expect((await providerRefunds(o.intentId)).map((r) => r.amount)).toEqual([700]);
    expect((await charge(o.chargeId)).amount_refunded).toBe(700);
    expect((await orderRow(world, o.orderId)).refunded_minor).toBe(700);
  });

  it("when the provider refuses, the refund is released and audited, and nothing counts as refunded", async () => {
    const { refundLine } = await import("@/db/queries/orders");
    const o = await createPaidOrder(world, { lines: [{ title: "Heatsink kit", unitPriceMinor: 1_800, quantity: 1, stockLeft: 0 }], feeMinor: 144 });
    // The whole charge is refunded outside Fluxyard (e.g. from the provider's dashboard).
    await world.stripe.refunds.create({ payment_intent: o.intentId });
    const outcome = await refundLine({ orderId: o.orderId, lineId: o.lineIds[0]!, actorId: "demo-seller-kits", amountMinor: 500, reason: "Dented fins" });
    expect(outcome.status).toBe("failed");
    expect(outcome.message).toMatch(/refused/);
    expect((await orderRow(world, o.orderId)).refunded_minor).toBe(0);
    const { rows } = await world.pool.query("select count(*)::int as n from refunds where order_id = $1", [o.orderId]);
    expect(rows[0].n).toBe(0);
    expect(await auditActions(world, o.orderId)).toEqual(["order.refund_requested", "order.refund_failed"]);
  });

  it("only the seller of the order refunds it: a buyer gets 403, another seller 404", async () => {
    const { refundLine } = await import("@/db/queries/orders");
    const o = await createPaidOrder(world, { lines: [{ title: "Fan board", unitPriceMinor: 900, quantity: 1, stockLeft: 0 }], feeMinor: 72 });
    await expect(refundLine({ orderId: o.orderId, lineId: o.lineIds[0]!, actorId: BUYER, amountMinor: 100, reason: "Mine" })).rejects.toMatchObject({ status: 403 });
    await expect(refundLine({ orderId: o.orderId, lineId: o.lineIds[0]!, actorId: "demo-seller-magnetics", amountMinor: 100, reason: "Mine" })).rejects.toMatchObject({ status: 404 });
    expect((await charge(o.chargeId)).amount_refunded).toBe(0);
  });
});
