import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import type Stripe from "stripe";
import { count, deliver, eventOf, fakeHook, insertBuyers, insertListing, providerEvent, startWorld, stockOf, type World } from "./world";

vi.mock("@/lib/jobs/boss", () => ({ sendJob: async () => {} }));

// The fake has no webhook endpoint here: each test takes the provider's own event (read back with
// the SDK) and delivers it itself, signed with the SDK's `webhooks.generateTestHeaderString` — the
// reference implementation of the provider's signing scheme — so it can withhold, replay or reorder.
let world: World;
let buyers: { id: string; email: string }[];

beforeAll(async () => {
  world = await startWorld("checkout_webhooks", { forwardWebhooks: false });
  buyers = await insertBuyers(world, 8, "hookbuyer");
});

afterAll(async () => {
  await world?.close();
});

async function openCheckout(buyer: { id: string; email: string }, items: { listingId: string; quantity: number }[]) {
  const { addToCart } = await import("@/db/queries/cart");
  const { startCheckout } = await import("@/lib/payments/checkout");
  for (const item of items) await addToCart({ userId: buyer.id }, item);
  const result = await startCheckout(buyer, { acknowledgements: {} });
  if (!result.ok) throw new Error(result.message);
  const { rows } = await world.pool.query("select session_id from checkouts where id = $1", [result.checkoutId]);
  return { checkoutId: result.checkoutId, sessionId: rows[0].session_id as string };
}

async function payAtFake(sessionId: string, card = "4242424242424242") {
  return fakeHook(world.fake, "/pay", { sessionId, card });
}

async function checkoutRow(id: string) {
  const { rows } = await world.pool.query("select status, paid_at, payment_intent_id from checkouts where id = $1", [id]);
  return rows[0];
}

async function orderStates(checkoutId: string): Promise<string[]> {
  const { rows } = await world.pool.query("select state from orders where checkout_id = $1 order by number", [checkoutId]);
  return rows.map((r) => r.state);
}

describe("signature", () => {
  it("refuses a missing signature, a tampered body and the wrong secret with 400, and writes nothing", async () => {
    const kit = await insertListing(world, { sellerId: "demo-seller-kits", title: "Signature test kit", priceMinor: 5_000, stock: 2 });
    const { checkoutId, sessionId } = await openCheckout(buyers[0]!, [{ listingId: kit, quantity: 1 }]);
    await payAtFake(sessionId);
    const event = await providerEvent(world, "checkout.session.completed", sessionId);

    const missing = await deliver(event, { signature: null });
    expect(missing.status).toBe(400);
    const tampered = await deliver(event, { tamper: (body) => body.replace('"payment_status":"paid"', '"payment_status":"paid" ') });
    expect(tampered.status).toBe(400);
    const wrongSecret = await deliver(event, { secret: "whsec_not_ours" });
    expect(wrongSecret.status).toBe(400);
    const garbage = await deliver(event, { signature: "t=1,v1=deadbeef" });
    expect(garbage.status).toBe(400);

    expect(await count(world, "select 1 from payment_events")).toBe(0);
    expect((await checkoutRow(checkoutId)).status).toBe("open");
    expect(await orderStates(checkoutId)).toEqual(["awaiting_payment"]);
    expect(await count(world, "select 1 from mail_outbox")).toBe(0);

    // The same event, properly signed, is then applied.
    const ok = await deliver(event);
    expect(ok.status).toBe(200);
    expect((await checkoutRow(checkoutId)).status).toBe("paid");
  });
});

describe("exactly once", () => {
  it("a replayed event answers 200 duplicate and changes nothing: one set of e-mails, one transfer per order", async () => {
    const kit = await insertListing(world, { sellerId: "demo-seller-kits", title: "Replay kit", priceMinor: 12_000, stock: 5 });
    const choke = await insertListing(world, { sellerId: "demo-seller-magnetics", title: "Replay choke", priceMinor: 3_000, stock: 5 });
    const { checkoutId, sessionId } = await openCheckout(buyers[1]!, [
      { listingId: kit, quantity: 1 },
      { listingId: choke, quantity: 2 },
    ]);
    await payAtFake(sessionId);
    const event = await providerEvent(world, "checkout.session.completed", sessionId);
    const mailsBefore = await count(world, "select 1 from mail_outbox");

    const first = await deliver(event);
    expect(first.status).toBe(200);
    expect(await first.json()).toEqual({ received: true, outcome: "paid" });
    const mailsAfterFirst = await count(world, "select 1 from mail_outbox");
    expect(mailsAfterFirst - mailsBefore).toBe(3); // the buyer, and each of the two sellers
    const { rows: sent } = await world.pool.query("select template, \"to\" from mail_outbox order by created_at desc, template limit 3");
    expect(sent.map((m) => `${m.template} ${m.to}`).sort()).toEqual(
      [`order-paid-buyer ${buyers[1]!.email}`, "order-paid-seller bram.kits@larkspur.test", "order-paid-seller idunn.winds@larkspur.test"].sort(),
    );

    // Replayed once, then twice at the same moment (the provider retries; two app instances may get it).
    const again = await deliver(event);
    expect(await again.json()).toEqual({ received: true, duplicate: true });
    const racing = await Promise.all([deliver(event), deliver(event)]);
    for (const r of racing) {
      expect(r.status).toBe(200);
      expect(await r.json()).toEqual({ received: true, duplicate: true });
    }

    expect(await count(world, "select 1 from payment_events where id = $1", [event.id])).toBe(1);
    expect(await count(world, "select 1 from mail_outbox")).toBe(mailsAfterFirst);
    expect(await orderStates(checkoutId)).toEqual(["paid", "paid"]);
    expect(await stockOf(world, kit)).toBe(4);
    expect(await stockOf(world, choke)).toBe(3);
    const transfers = await world.stripe.transfers.list({ transfer_group: checkoutId, limit: 100 });
    expect(transfers.data).toHaveLength(2);
    // The items bought left the buyer's cart.
    expect(await count(world, "select 1 from cart_items ci join carts c on c.id = ci.cart_id where c.user_id = $1", [buyers[1]!.id])).toBe(0);
  });

  it("an unknown event type is answered 200 and recorded, and changes nothing else", async () => {
    const res = await deliver(eventOf("customer.created", { id: "cus_test_unknown", object: "customer" }, "evt_test_unknown_type"));
    expect(res.status).toBe(200);
    const { rows } = await world.pool.query("select type, outcome, object_id from payment_events where id = 'evt_test_unknown_type'");
    expect(rows).toEqual([{ type: "customer.created", outcome: "ignored", object_id: "cus_test_unknown" }]);
  });

  it("an error on our side answers 500, keeps nothing half-done, and the provider's retry then applies it", async () => {
    const kit = await insertListing(world, { sellerId: "demo-seller-kits", title: "Retry kit", priceMinor: 4_000, stock: 1 });
    const { checkoutId, sessionId } = await openCheckout(buyers[2]!, [{ listingId: kit, quantity: 1 }]);
    await payAtFake(sessionId);
    const event = await providerEvent(world, "checkout.session.completed", sessionId);
    const quiet = vi.spyOn(console, "error").mockImplementation(() => {});
    await world.pool.query("alter table mail_outbox rename to mail_outbox_away");
    try {
      const failed = await deliver(event);
      expect(failed.status).toBe(500);
    } finally {
      await world.pool.query("alter table mail_outbox_away rename to mail_outbox");
      quiet.mockRestore();
    }
    expect(await count(world, "select 1 from payment_events where id = $1", [event.id])).toBe(0);
    expect((await checkoutRow(checkoutId)).status).toBe("open");
    const retried = await deliver(event);
    expect(retried.status).toBe(200);
    expect((await checkoutRow(checkoutId)).status).toBe("paid");
  });
});

describe("out of order", () => {
  it("an expiry arriving after the payment changes nothing", async () => {
    const kit = await insertListing(world, { sellerId: "demo-seller-kits", title: "Late expiry kit", priceMinor: 6_000, stock: 3 });
    const { checkoutId, sessionId } = await openCheckout(buyers[3]!, [{ listingId: kit, quantity: 2 }]);
    await payAtFake(sessionId);
    await deliver(await providerEvent(world, "checkout.session.completed", sessionId));
    const session = await world.stripe.checkout.sessions.retrieve(sessionId);
    const late = await deliver(eventOf("checkout.session.expired", { ...session, status: "expired" }));
    expect(await late.json()).toEqual({ received: true, outcome: "unchanged-paid" });
    expect(await stockOf(world, kit)).toBe(1);
    expect((await checkoutRow(checkoutId)).status).toBe("paid");
    expect(await count(world, "select 1 from stock_reservations where checkout_id = $1 and status = 'committed'", [checkoutId])).toBe(1);
  });

  it("a payment arriving after the expiry takes the stock again when it is still there", async () => {
    const kit = await insertListing(world, { sellerId: "demo-seller-kits", title: "Re-reserve kit", priceMinor: 7_000, stock: 2 });
    const { checkoutId, sessionId } = await openCheckout(buyers[4]!, [{ listingId: kit, quantity: 1 }]);
    expect(await stockOf(world, kit)).toBe(1);
    await payAtFake(sessionId);
    const session = await world.stripe.checkout.sessions.retrieve(sessionId);
    // The expiry overtakes the payment: the hold is released and the order cancelled…
    await deliver(eventOf("checkout.session.expired", { ...session, status: "expired", payment_status: "unpaid" }));
    expect(await stockOf(world, kit)).toBe(2);
    expect(await orderStates(checkoutId)).toEqual(["cancelled"]);
    // …then the payment arrives: the stock is there, so it is taken again and the order paid.
    const res = await deliver(await providerEvent(world, "checkout.session.completed", sessionId));
    expect(await res.json()).toEqual({ received: true, outcome: "paid-after-release" });
    expect(await stockOf(world, kit)).toBe(1);
    expect(await orderStates(checkoutId)).toEqual(["paid"]);
    expect((await checkoutRow(checkoutId)).status).toBe("paid");
  });

  it("a payment arriving after the expiry, when the stock went to someone else, is refunded in full and the buyer told", async () => {
    const kit = await insertListing(world, { sellerId: "demo-seller-kits", title: "Sold-out kit", priceMinor: 9_900, stock: 1 });
    const late = await openCheckout(buyers[5]!, [{ listingId: kit, quantity: 1 }]);
    await payAtFake(late.sessionId);
    const session = await world.stripe.checkout.sessions.retrieve(late.sessionId);
    await deliver(eventOf("checkout.session.expired", { ...session, status: "expired", payment_status: "unpaid" }));
    expect(await stockOf(world, kit)).toBe(1);
    // Someone else takes the last unit meanwhile.
    const other = await openCheckout(buyers[6]!, [{ listingId: kit, quantity: 1 }]);
    expect(await stockOf(world, kit)).toBe(0);

    const completed = await providerEvent(world, "checkout.session.completed", late.sessionId);
    const res = await deliver(completed);
    expect(await res.json()).toEqual({ received: true, outcome: "paid-too-late-refunding" });
    const row = await checkoutRow(late.checkoutId);
    expect(row.status).toBe("failed");
    const intent = (completed.data.object as Stripe.Checkout.Session).payment_intent as string;
    expect(row.payment_intent_id).toBe(intent);
    // The refund at the provider: the whole amount, on this payment.
    const refunds = await world.stripe.refunds.list({ payment_intent: intent, limit: 10 });
    expect(refunds.data.reduce((sum, r) => sum + r.amount, 0)).toBe(9_900);
    expect(await orderStates(late.checkoutId)).toEqual(["refunded"]);
    const { rows: ours } = await world.pool.query("select amount_minor, provider_refund_id from refunds r join orders o on o.id = r.order_id where o.checkout_id = $1", [late.checkoutId]);
    expect(ours).toEqual([{ amount_minor: 9_900, provider_refund_id: refunds.data[0]!.id }]);
    const { rows: mail } = await world.pool.query("select template, \"to\" from mail_outbox where \"to\" = $1", [buyers[5]!.email]);
    expect(mail).toEqual([{ template: "order-paid-refunded", to: buyers[5]!.email }]);
    // The other buyer's hold is untouched, and no seller was paid for the refunded order.
    expect(await stockOf(world, kit)).toBe(0);
    expect((await checkoutRow(other.checkoutId)).status).toBe("open");
    expect((await world.stripe.transfers.list({ transfer_group: late.checkoutId })).data).toHaveLength(0);
    // A replay of the same completion, or a second one, does not pay for it after all.
    expect(await (await deliver(completed)).json()).toEqual({ received: true, duplicate: true });
    expect(await (await deliver({ ...completed, id: `${completed.id}_again` })).json()).toEqual({ received: true, outcome: "already-refunded" });
  });

  it("a declined card (payment_intent.payment_failed) releases the hold once and marks the checkout failed", async () => {
    const kit = await insertListing(world, { sellerId: "demo-seller-kits", title: "Declined kit", priceMinor: 3_300, stock: 4 });
    const { checkoutId, sessionId } = await openCheckout(buyers[7]!, [{ listingId: kit, quantity: 3 }]);
    expect(await stockOf(world, kit)).toBe(1);
    const declined = await payAtFake(sessionId, "4000000000000002");
    expect(declined.status).toBe(402);
    const intent = declined.json.payment_intent.id as string;
    const failed = await providerEvent(world, "payment_intent.payment_failed", intent);
    expect(await (await deliver(failed)).json()).toEqual({ received: true, outcome: "failed" });
    expect(await stockOf(world, kit)).toBe(4);
    expect((await checkoutRow(checkoutId)).status).toBe("failed");
    // Again under another event id (an expiry, say): the stock is not given back twice.
    const session = await world.stripe.checkout.sessions.retrieve(sessionId);
    expect(await (await deliver(eventOf("checkout.session.expired", { ...session, status: "expired" }))).json()).toEqual({ received: true, outcome: "unchanged-failed" });
    expect(await stockOf(world, kit)).toBe(4);
  });
});
