import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { CURRENT_POLICY_REVISION } from "@/lib/policy";
import { count, fakeHook, insertBuyers, insertListing, LOW_VOLTAGE, MAINS_KIT, startWorld, stockOf, waitFor, type World } from "./world";

vi.mock("@/lib/jobs/boss", () => ({ sendJob: async () => {} }));

// The whole path against the payments fake, whose signed webhooks reach our route through the
// forwarder: fees and shares across three sellers, acknowledgements, the provider being down,
// expiry, cancelling, and the sweep's retries.
let world: World;
let buyers: { id: string; email: string }[];

beforeAll(async () => {
  world = await startWorld("checkout_flow", { sellers: 3 });
  buyers = await insertBuyers(world, 12, "flowbuyer");
});

afterAll(async () => {
  await world?.close();
});

async function fill(buyer: { id: string }, items: { listingId: string; quantity: number }[]) {
  const { addToCart } = await import("@/db/queries/cart");
  for (const item of items) expect(await addToCart({ userId: buyer.id }, item)).toMatchObject({ ok: true });
}

async function cartOf(buyerId: string): Promise<Record<string, number>> {
  const { rows } = await world.pool.query("select ci.listing_id, ci.quantity from cart_items ci join carts c on c.id = ci.cart_id where c.user_id = $1", [buyerId]);
  return Object.fromEntries(rows.map((r) => [r.listing_id, r.quantity]));
}

async function sessionOf(checkoutId: string): Promise<string> {
  const { rows } = await world.pool.query("select session_id from checkouts where id = $1", [checkoutId]);
  return rows[0].session_id;
}

function deliveriesOf(type: string): number {
  return world.forwarder.deliveries.filter((d) => d.type === type && d.status === 200).length;
}

describe("fee and split across sellers", () => {
  it("keeps round-half-up(subtotal × fee) per seller's order, sends each share to its account, and fee + share = subtotal", async () => {
    const { startCheckout } = await import("@/lib/payments/checkout");
    await world.pool.query("update platform_settings set fee_bps = 850 where id = 1");
    const [a, b, c] = world.sellers;
    const kit = await insertListing(world, { sellerId: a!.id, title: "Split kit", priceMinor: 12_345, stock: 5 });
    const board = await insertListing(world, { sellerId: b!.id, title: "Split board", priceMinor: 1_000, stock: 5, kind: "board" });
    const shim = await insertListing(world, { sellerId: c!.id, title: "Split shim", priceMinor: 50, stock: 5, kind: "board" });
    const buyer = buyers[0]!;
    await fill(buyer, [
      { listingId: kit, quantity: 2 },
      { listingId: board, quantity: 1 },
      { listingId: shim, quantity: 2 },
    ]);
    const started = await startCheckout(buyer, { acknowledgements: {} });
    expect(started.ok).toBe(true);
    if (!started.ok) return;
    // A fee change after the checkout started does not touch its orders.
    await world.pool.query("update platform_settings set fee_bps = 1000 where id = 1");

    // Hand arithmetic at 8.5 %: 24 690 × 0.085 = 2098.65 → 2099; 1000 × 0.085 = 85; 100 × 0.085 = 8.5 → 9 (half up).
    const { rows } = await world.pool.query(
      "select o.seller_id, o.subtotal_minor, o.fee_minor, o.seller_share_minor, c.fee_bps, c.total_minor from orders o join checkouts c on c.id = o.checkout_id where c.id = $1 order by o.subtotal_minor desc",
      [started.checkoutId],
    );
    expect(rows.map((r) => [r.seller_id, r.subtotal_minor, r.fee_minor, r.seller_share_minor])).toEqual([
      [a!.id, 24_690, 2_099, 22_591],
      [b!.id, 1_000, 85, 915],
      [c!.id, 100, 9, 91],
    ]);
    expect(rows.every((r) => r.fee_bps === 850 && r.total_minor === 25_790)).toBe(true);

    const paid = await fakeHook(world.fake, "/pay", { sessionId: await sessionOf(started.checkoutId), card: "4242424242424242" });
    expect(paid.status).toBe(200);
    const charge = paid.json.payment_intent.latest_charge as string;
    await waitFor("three transfers stored", async () => (await count(world, "select 1 from orders where checkout_id = $1 and transfer_id is not null", [started.checkoutId])) === 3);

    const transfers = (await world.stripe.transfers.list({ transfer_group: started.checkoutId, limit: 10 })).data;
    expect(transfers.map((t) => [t.destination, t.amount, t.currency, t.source_transaction]).sort()).toEqual(
      [
        [a!.account, 22_591, "eur", charge],
        [b!.account, 915, "eur", charge],
        [c!.account, 91, "eur", charge],
      ].sort(),
    );
    // What the platform keeps of the charge: the sum of the fees.
    const chargeObject = await world.stripe.charges.retrieve(charge);
    expect(chargeObject.amount - transfers.reduce((s, t) => s + t.amount, 0)).toBe(2_099 + 85 + 9);
    const { rows: stored } = await world.pool.query("select transfer_id from orders where checkout_id = $1", [started.checkoutId]);
    expect(stored.map((r) => r.transfer_id).sort()).toEqual(transfers.map((t) => t.id).sort());
    await world.pool.query("update platform_settings set fee_bps = 800 where id = 1");
  });
});

describe("acknowledgements", () => {
  it("refuses until every mains-connected item is ticked at its current sheet revision, then records each one", async () => {
    const { startCheckout } = await import("@/lib/payments/checkout");
    const kit = await insertListing(world, { sellerId: world.sellers[0]!.id, title: "Welder kit with sheet", priceMinor: 18_000, stock: 2, declaration: MAINS_KIT, sheetRevision: 3 });
    const board = await insertListing(world, { sellerId: world.sellers[1]!.id, title: "Gate driver board", priceMinor: 2_500, stock: 2, kind: "board", declaration: LOW_VOLTAGE });
    const buyer = buyers[1]!;
    await fill(buyer, [
      { listingId: kit, quantity: 1 },
      { listingId: board, quantity: 1 },
    ]);
    const checkoutsBefore = await count(world, "select 1 from checkouts");

    const none = await startCheckout(buyer, { acknowledgements: {} });
    expect(none).toMatchObject({ ok: false, code: "acknowledgement" });
    if (none.ok) return;
    expect(Object.keys(none.fieldErrors)).toEqual([`ack.${kit}`]);

    const stale = await startCheckout(buyer, { acknowledgements: { [kit]: 2 } });
    expect(stale).toMatchObject({ ok: false, code: "acknowledgement" });
    if (stale.ok) return;
    expect(stale.fieldErrors[`ack.${kit}`]?.[0]).toMatch(/revision 3/);
    // Refused checkouts wrote nothing and held nothing.
    expect(await count(world, "select 1 from checkouts")).toBe(checkoutsBefore);
    expect(await stockOf(world, kit)).toBe(2);

    const ok = await startCheckout(buyer, { acknowledgements: { [kit]: 3 } });
    expect(ok.ok).toBe(true);
    if (!ok.ok) return;
    const { rows } = await world.pool.query("select listing_id, sheet_revision, policy_revision, hazards from order_acknowledgements where checkout_id = $1", [ok.checkoutId]);
    // Only the mains-connected kit; the hazards as the hazards unit test works them out by hand.
    expect(rows).toEqual([
      {
        listing_id: kit,
        sheet_revision: 3,
        policy_revision: CURRENT_POLICY_REVISION.revision,
        hazards: [
          "connects to 230 V mains",
          "its bus reaches 358 V and stores 64 J",
          "the bus needs 84 s to fall below 60 V after unplugging",
          "heatsinks are live",
          "it is a welding source with 62 V open-circuit output",
        ],
      },
    ]);
    const { rows: lines } = await world.pool.query("select l.listing_id, l.sheet_revision, l.unit_price_minor from order_lines l join orders o on o.id = l.order_id where o.checkout_id = $1 order by l.unit_price_minor", [ok.checkoutId]);
    expect(lines).toEqual([
      { listing_id: board, sheet_revision: 1, unit_price_minor: 2_500 },
      { listing_id: kit, sheet_revision: 3, unit_price_minor: 18_000 },
    ]);
  });
});

describe("refusals before anything is held", () => {
  it("a cart in two currencies is refused with a clear message", async () => {
    const { startCheckout } = await import("@/lib/payments/checkout");
    const eur = await insertListing(world, { sellerId: world.sellers[0]!.id, title: "Euro kit", priceMinor: 1_000, stock: 3 });
    const gbp = await insertListing(world, { sellerId: world.sellers[1]!.id, title: "Pound choke", priceMinor: 1_000, stock: 3, currency: "GBP" });
    await fill(buyers[2]!, [
      { listingId: eur, quantity: 1 },
      { listingId: gbp, quantity: 1 },
    ]);
    const result = await startCheckout(buyers[2]!, { acknowledgements: {} });
    expect(result).toMatchObject({ ok: false, code: "mixed-currency" });
    if (result.ok) return;
    expect(result.message).toMatch(/EUR and GBP/);
    expect(await stockOf(world, eur)).toBe(3);
  });

  it("a price that changed since the page was shown is caught and nothing is held", async () => {
    const { startCheckout } = await import("@/lib/payments/checkout");
    const kit = await insertListing(world, { sellerId: world.sellers[0]!.id, title: "Repriced kit", priceMinor: 10_000, stock: 3 });
    await fill(buyers[3]!, [{ listingId: kit, quantity: 1 }]);
    await world.pool.query("update listings set price_minor = 11000 where id = $1", [kit]);
    const result = await startCheckout(buyers[3]!, { acknowledgements: {}, shownTotalMinor: 10_000, shownCurrency: "EUR" });
    expect(result).toMatchObject({ ok: false, code: "price-changed" });
    expect(await stockOf(world, kit)).toBe(3);
    const ok = await startCheckout(buyers[3]!, { acknowledgements: {}, shownTotalMinor: 11_000, shownCurrency: "EUR" });
    expect(ok.ok).toBe(true);
  });
});

describe("the provider is down at session creation", () => {
  it("releases the hold, marks the checkout failed, leaves the cart as it was and says so", async () => {
    const { startCheckout, PROVIDER_DOWN_MESSAGE } = await import("@/lib/payments/checkout");
    const kit = await insertListing(world, { sellerId: world.sellers[0]!.id, title: "Outage kit", priceMinor: 8_000, stock: 4 });
    const buyer = buyers[4]!;
    await fill(buyer, [{ listingId: kit, quantity: 3 }]);
    const cartBefore = await cartOf(buyer.id);
    const quiet = vi.spyOn(console, "error").mockImplementation(() => {});
    await fakeHook(world.fake, "/fail-mode", { down: true });
    try {
      const result = await startCheckout(buyer, { acknowledgements: {} });
      expect(result).toEqual({ ok: false, code: "provider", message: PROVIDER_DOWN_MESSAGE, fieldErrors: {} });
    } finally {
      await fakeHook(world.fake, "/fail-mode", { down: false });
      quiet.mockRestore();
    }
    expect(await stockOf(world, kit)).toBe(4);
    expect(await cartOf(buyer.id)).toEqual(cartBefore);
    const { rows } = await world.pool.query("select c.status, c.session_id, r.status as reservation, o.state from checkouts c join stock_reservations r on r.checkout_id = c.id join orders o on o.checkout_id = c.id where c.buyer_id = $1", [buyer.id]);
    expect(rows).toEqual([{ status: "failed", session_id: null, reservation: "released", state: "cancelled" }]);
  });
});

describe("expiry and cancelling", () => {
  it("the sweep releases an overdue hold and closes the session; the provider's expiry event then changes nothing", async () => {
    const { startCheckout, sweepCheckouts } = await import("@/lib/payments/checkout");
    const kit = await insertListing(world, { sellerId: world.sellers[0]!.id, title: "Expiring kit", priceMinor: 5_500, stock: 5 });
    await fill(buyers[5]!, [{ listingId: kit, quantity: 2 }]);
    const started = await startCheckout(buyers[5]!, { acknowledgements: {} });
    if (!started.ok) throw new Error(started.message);
    expect(await stockOf(world, kit)).toBe(3);
    const expiredBefore = deliveriesOf("checkout.session.expired");

    const status = async () => (await world.pool.query("select status from checkouts where id = $1", [started.checkoutId])).rows[0].status;

    // Not due yet: nothing happens.
    await sweepCheckouts(new Date());
    expect(await status()).toBe("open");
    expect(await stockOf(world, kit)).toBe(3);

    // 40 minutes on, past the hold and the sweep's grace (other tests' open checkouts go too).
    const later = new Date(Date.now() + 40 * 60 * 1000);
    expect((await sweepCheckouts(later)).expired).toBeGreaterThanOrEqual(1);
    expect(await status()).toBe("expired");
    expect(await stockOf(world, kit)).toBe(5);
    expect((await world.stripe.checkout.sessions.retrieve(await sessionOf(started.checkoutId))).status).toBe("expired");
    await waitFor("the provider's expiry event", async () => deliveriesOf("checkout.session.expired") > expiredBefore);
    expect((await sweepCheckouts(later)).expired).toBe(0);
    expect(await stockOf(world, kit)).toBe(5);
    const { rows } = await world.pool.query("select outcome from payment_events where type = 'checkout.session.expired' order by received_at desc limit 1");
    expect(rows[0].outcome).toBe("unchanged-expired");
    expect(await count(world, "select 1 from stock_reservations where checkout_id = $1 and status = 'released'", [started.checkoutId])).toBe(1);
  });

  it("cancel and go back: the session is closed, the stock given back at once, the cart untouched", async () => {
    const { startCheckout, cancelCheckout } = await import("@/lib/payments/checkout");
    const kit = await insertListing(world, { sellerId: world.sellers[0]!.id, title: "Cancelled kit", priceMinor: 4_200, stock: 2 });
    const buyer = buyers[6]!;
    await fill(buyer, [{ listingId: kit, quantity: 2 }]);
    const started = await startCheckout(buyer, { acknowledgements: {} });
    if (!started.ok) throw new Error(started.message);
    expect(await stockOf(world, kit)).toBe(0);

    // Someone else's cancel link does nothing.
    expect(await cancelCheckout(started.checkoutId, buyers[7]!.id)).toEqual({ redirectTo: "/cart" });
    expect(await stockOf(world, kit)).toBe(0);

    expect(await cancelCheckout(started.checkoutId, buyer.id)).toEqual({ redirectTo: "/cart?cancelled=1" });
    expect(await stockOf(world, kit)).toBe(2);
    expect(await cartOf(buyer.id)).toEqual({ [kit]: 2 });
    expect((await world.stripe.checkout.sessions.retrieve(await sessionOf(started.checkoutId))).status).toBe("expired");
    // The expired session cannot be paid any more.
    expect((await fakeHook(world.fake, "/pay", { sessionId: await sessionOf(started.checkoutId), card: "4242424242424242" })).status).toBe(409);
  });
});

describe("transfers that fail", () => {
  it("never undo the paid state and are sent by the sweep once the provider answers again", async () => {
    const { startCheckout, sweepCheckouts } = await import("@/lib/payments/checkout");
    const kit = await insertListing(world, { sellerId: world.sellers[0]!.id, title: "Transfer retry kit", priceMinor: 20_000, stock: 2 });
    await fill(buyers[8]!, [{ listingId: kit, quantity: 1 }]);
    const started = await startCheckout(buyers[8]!, { acknowledgements: {} });
    if (!started.ok) throw new Error(started.message);
    const before = deliveriesOf("checkout.session.completed");
    const quiet = vi.spyOn(console, "error").mockImplementation(() => {});
    try {
      const paid = await fakeHook(world.fake, "/pay", { sessionId: await sessionOf(started.checkoutId), card: "4242424242424242" });
      expect(paid.status).toBe(200);
      // The provider's API goes down just as its event reaches us.
      await fakeHook(world.fake, "/fail-mode", { down: true });
      await waitFor("the completion event handled", async () => deliveriesOf("checkout.session.completed") > before);
    } finally {
      await fakeHook(world.fake, "/fail-mode", { down: false });
      quiet.mockRestore();
    }
    const { rows } = await world.pool.query("select state, transfer_id, paid_at from orders where checkout_id = $1", [started.checkoutId]);
    expect(rows[0]).toMatchObject({ state: "paid", transfer_id: null });
    expect(rows[0].paid_at).toBeInstanceOf(Date);

    expect((await sweepCheckouts()).transfers).toBe(1);
    const transfers = (await world.stripe.transfers.list({ transfer_group: started.checkoutId })).data;
    expect(transfers.map((t) => t.amount)).toEqual([20_000 - 1_600]); // 8 % of 200.00 = 16.00
    expect((await sweepCheckouts()).transfers).toBe(0);
  });
});

describe("cart merge at sign-in", () => {
  it("adds the visitor's lines to the member's, capped by stock, drops what is not for sale, and removes the visitor cart", async () => {
    const { addToCart, mergeVisitorCart, listCartLines } = await import("@/db/queries/cart");
    const a = await insertListing(world, { sellerId: world.sellers[0]!.id, title: "Merge kit", priceMinor: 1_000, stock: 3 });
    const b = await insertListing(world, { sellerId: world.sellers[1]!.id, title: "Merge choke", priceMinor: 2_000, stock: 5 });
    const gone = await insertListing(world, { sellerId: world.sellers[1]!.id, title: "Merge retired", priceMinor: 2_000, stock: 5 });
    const token = "v".repeat(43);
    await addToCart({ token }, { listingId: a, quantity: 2 });
    await addToCart({ token }, { listingId: b, quantity: 1 });
    await addToCart({ token }, { listingId: gone, quantity: 1 });
    await world.pool.query("update listings set state = 'retired' where id = $1", [gone]);
    const member = buyers[9]!;
    await addToCart({ userId: member.id }, { listingId: a, quantity: 2 });

    await mergeVisitorCart(token, member.id);
    expect(await cartOf(member.id)).toEqual({ [a]: 3, [b]: 1 });
    expect(await listCartLines({ token })).toEqual([]);
    expect(await count(world, "select 1 from carts where token = $1", [token])).toBe(0);
    // Merging again (a second sign-in in the same browser) has nothing left to add.
    await mergeVisitorCart(token, member.id);
    expect(await cartOf(member.id)).toEqual({ [a]: 3, [b]: 1 });
  });

  it("adding to a cart never goes past the stock", async () => {
    const { addToCart, setCartQuantity } = await import("@/db/queries/cart");
    const kit = await insertListing(world, { sellerId: world.sellers[0]!.id, title: "Capped kit", priceMinor: 1_000, stock: 2 });
    const owner = { userId: buyers[10]!.id };
    expect(await addToCart(owner, { listingId: kit, quantity: 1 })).toEqual({ ok: true, quantity: 1, capped: false });
    expect(await addToCart(owner, { listingId: kit, quantity: 5 })).toEqual({ ok: true, quantity: 2, capped: true });
    expect(await setCartQuantity(owner, { listingId: kit, quantity: 9 })).toEqual({ ok: true, quantity: 2, capped: true });
    await world.pool.query("update listings set stock = 0 where id = $1", [kit]);
    expect(await addToCart(owner, { listingId: kit, quantity: 1 })).toEqual({ ok: false, reason: "out-of-stock" });
  });
});
