import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { count, fakeHook, insertBuyers, insertListing, separateDb, startWorld, stockOf, waitFor, type World } from "./world";

// Jobs are only a nudge after commit (the outbox row is the record); no pg-boss here.
vi.mock("@/lib/jobs/boss", () => ({ sendJob: async () => {} }));

// The last units under real concurrency: 20 buyers on 20 separate connections ask for the same
// 3 units at once. The conditional update (stock >= q) is re-evaluated by PostgreSQL on the locked
// row (READ COMMITTED, PostgreSQL manual §13.2.1), so exactly 3 can win and stock never goes below 0
// (the listings_stock_non_negative check would refuse it anyway).
let world: World;

beforeAll(async () => {
  world = await startWorld("checkout_concurrency");
});

afterAll(async () => {
  await world?.close();
});

describe("reserving the last units", () => {
  it("20 parallel checkouts for 3 units: exactly 3 reserve, stock ends at 0, the rest are told which item ran out", async () => {
    const { addToCart } = await import("@/db/queries/cart");
    const { createCheckout, CheckoutRefusal } = await import("@/db/queries/checkout");
    const kit = await insertListing(world, { sellerId: "demo-seller-kits", title: "Last-units inverter kit", priceMinor: 24_900, stock: 3 });
    const buyers = await insertBuyers(world, 20);
    for (const b of buyers) expect(await addToCart({ userId: b.id }, { listingId: kit, quantity: 1 })).toMatchObject({ ok: true, quantity: 1 });

    const connections = buyers.map(() => separateDb(world.url));
    try {
      const results = await Promise.allSettled(
        buyers.map((b, i) => createCheckout({ buyer: b, acknowledgements: {} }, connections[i]!.db)),
      );
      const won = results.filter((r) => r.status === "fulfilled");
      const lost = results.filter((r): r is PromiseRejectedResult => r.status === "rejected");
      expect(won).toHaveLength(3);
      expect(lost).toHaveLength(17);
      for (const r of lost) {
        expect(r.reason).toBeInstanceOf(CheckoutRefusal);
        expect((r.reason as InstanceType<typeof CheckoutRefusal>).code).toBe("stock");
        expect((r.reason as Error).message).toContain("“Last-units inverter kit”");
      }
    } finally {
      await Promise.all(connections.map((c) => c.close()));
    }

    expect(await stockOf(world, kit)).toBe(0);
    expect(await count(world, "select 1 from stock_reservations where listing_id = $1 and status = 'held'", [kit])).toBe(3);
    // A refused checkout rolled back whole: no checkout, order or line was left behind.
    expect(await count(world, "select 1 from checkouts")).toBe(3);
    expect(await count(world, "select 1 from orders")).toBe(3);
    expect(await count(world, "select 1 from order_lines where listing_id = $1", [kit])).toBe(3);
  });

  it("the three winners pay through the fake; its signed webhooks make exactly three paid orders", async () => {
    const { rows } = await world.pool.query("select id, email, currency, total_minor, expires_at from checkouts where status = 'open' order by created_at");
    expect(rows).toHaveLength(3);
    const { openPaymentSession } = await import("@/lib/payments/checkout");
    const { recordProviderSession } = await import("@/db/queries/checkout");
    const sessions: string[] = [];
    for (const c of rows) {
      const { rows: lines } = await world.pool.query(
        "select l.listing_id, l.title, l.unit_price_minor, l.quantity, o.seller_id from order_lines l join orders o on o.id = l.order_id where o.checkout_id = $1",
        [c.id],
      );
      const session = await openPaymentSession({
        checkoutId: c.id,
        email: c.email,
        currency: c.currency,
        totalMinor: c.total_minor,
        expiresAt: c.expires_at,
        lines: lines.map((l) => ({ listingId: l.listing_id, title: l.title, unitPriceMinor: l.unit_price_minor, quantity: l.quantity, sellerId: l.seller_id, shopName: "Kits" })),
      });
      await recordProviderSession(c.id, session.id);
      sessions.push(session.id);
    }
    // All three pay at once; the fake signs and delivers checkout.session.completed to our route.
    const paid = await Promise.all(sessions.map((id) => fakeHook(world.fake, "/pay", { sessionId: id, card: "4242424242424242" })));
    expect(paid.map((p) => p.status)).toEqual([200, 200, 200]);

    await waitFor("three paid orders", async () => (await count(world, "select 1 from orders where state = 'paid'")) === 3);
    expect(await count(world, "select 1 from checkouts where status = 'paid' and paid_at is not null")).toBe(3);
    expect(await count(world, "select 1 from stock_reservations where status = 'committed'")).toBe(3);
    expect(await count(world, "select 1 from stock_reservations where status = 'held'")).toBe(0);
    // Stock was taken once, at reservation; paying does not take it again.
    const { rows: stock } = await world.pool.query("select min(stock)::int as s from listings where title = 'Last-units inverter kit'");
    expect(stock[0].s).toBe(0);
    // Each paid order's share went to the seller once, with its transfer id stored.
    await waitFor("three transfers", async () => (await count(world, "select 1 from orders where transfer_id is not null")) === 3);
    const transfers = await world.stripe.transfers.list({ destination: world.sellers[0]!.account, limit: 100 });
    expect(transfers.data).toHaveLength(3);
  });
});
