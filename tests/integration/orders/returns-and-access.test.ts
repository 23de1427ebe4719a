import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { auditActions, BUYER, createPaidOrder, OTHER_BUYER, orderRow, outbox, startWorld, type World } from "./world";

vi.mock("@/lib/jobs/boss", () => ({ sendJob: async () => {} }));
// The session is the only thing replaced: roles still come from the database through the real guard.
const session = vi.hoisted(() => ({ userId: null as string | null }));
vi.mock("@/lib/auth/config", () => ({ auth: async () => (session.userId ? { user: { id: session.userId } } : null) }));

let world: World;

beforeAll(async () => {
  world = await startWorld("orders_returns");
});

afterAll(async () => {
  await world?.close();
});

beforeEach(() => {
  session.userId = null;
});

const DAY = 86_400_000;

function post(path: string, body?: unknown): Request {
  return new Request(`http://localhost${path}`, { method: "POST", headers: { "content-type": "application/json" }, body: body === undefined ? "" : JSON.stringify(body) });
}

describe("returns", () => {
  it("a delivered order: the buyer asks within the window, the seller hears of it, accepts, and the rest is refunded", async () => {
    const { shipOrder, markDelivered, requestReturn, acceptReturn } = await import("@/db/queries/orders");
    const o = await createPaidOrder(world, {
      lines: [
        { title: "Welder control kit", unitPriceMinor: 12_000, quantity: 1, stockLeft: 0 },
        { title: "Thermal pad set", unitPriceMinor: 500, quantity: 2, stockLeft: 9 },
      ],
      feeMinor: 1_040,
    });
    await shipOrder({ orderId: o.orderId, actorId: "demo-seller-kits", carrier: "Yard Post", trackingRef: "YP-5555" });
    await expect(markDelivered({ orderId: o.orderId, actorId: OTHER_BUYER })).rejects.toMatchObject({ status: 404 });
    expect(await markDelivered({ orderId: o.orderId, actorId: BUYER })).toEqual({ from: "shipped", to: "delivered" });
    const { returnId } = await requestReturn({ orderId: o.orderId, actorId: BUYER, reason: "The kit is not the revision the listing showed." });
    const toSeller = (await outbox(world, "return-requested")).filter((m) => m.props.orderNumber === o.number);
    expect(toSeller).toEqual([expect.objectContaining({ to: "bram.kits@larkspur.test" })]);
    // One open request at a time.
    await expect(requestReturn({ orderId: o.orderId, actorId: BUYER, reason: "Asking a second time about it." })).rejects.toMatchObject({ status: 409 });

    const accepted = await acceptReturn({ orderId: o.orderId, returnId, actorId: "demo-seller-kits" });
    expect(accepted.refunds.map((r) => r.status)).toEqual(["refunded", "refunded"]);
    expect((await world.stripe.charges.retrieve(o.chargeId)).amount_refunded).toBe(13_000);
    expect(await orderRow(world, o.orderId)).toMatchObject({ state: "refunded", refunded_minor: 13_000 });
    // Deciding twice does nothing more.
    await expect(acceptReturn({ orderId: o.orderId, returnId, actorId: "demo-seller-kits" })).rejects.toMatchObject({ status: 409 });
    expect((await outbox(world, "return-accepted")).filter((m) => m.props.orderNumber === o.number)).toEqual([
      expect.objectContaining({ to: "noor.builds@larkspur.test", props: expect.objectContaining({ refundAmount: "€130.00" }) }),
    ]);
    expect(await auditActions(world, o.orderId)).toEqual(["order.shipped", "order.delivered", "order.return_requested", "order.return_accepted", "order.refund_settled", "order.refund_settled"]);
  });

  it("a declined return keeps the money where it is and tells the buyer why", async () => {
    const { shipOrder, requestReturn, declineReturn } = await import("@/db/queries/orders");
    const o = await createPaidOrder(world, { lines: [{ title: "Rectifier board", unitPriceMinor: 4_000, quantity: 1, stockLeft: 0 }], feeMinor: 320 });
    await shipOrder({ orderId: o.orderId, actorId: "demo-seller-kits", carrier: "Yard Post", trackingRef: "YP-6666" });
    const { returnId } = await requestReturn({ orderId: o.orderId, actorId: BUYER, reason: "Changed my mind about the build." });
    await expect(declineReturn({ orderId: o.orderId, returnId, actorId: "demo-seller-kits", reason: "Opened and soldered parts cannot be returned." })).resolves.toBeUndefined();
    const { rows } = await world.pool.query("select status, decision_reason from return_requests where id = $1", [returnId]);
    expect(rows[0]).toEqual({ status: "declined", decision_reason: "Opened and soldered parts cannot be returned." });
    expect((await world.stripe.charges.retrieve(o.chargeId)).amount_refunded).toBe(0);
    expect((await outbox(world, "return-declined")).filter((m) => m.props.orderNumber === o.number)).toHaveLength(1);
  });

  it("refuses a return after the window: 14 days, counted from the day after delivery", async () => {
    const { requestReturn } = await import("@/db/queries/orders");
    const o = await createPaidOrder(world, { lines: [{ title: "Driver board", unitPriceMinor: 2_000, quantity: 1, stockLeft: 0 }], feeMinor: 160 });
    const delivered = new Date("2026-03-02T15:00:00Z");
    await world.pool.query("update orders set state = 'delivered', shipped_at = $2, delivered_at = $3 where id = $1", [o.orderId, new Date(delivered.getTime() - 2 * DAY), delivered]);
    await expect(requestReturn({ orderId: o.orderId, actorId: BUYER, reason: "Arrived with a broken connector.", now: new Date("2026-03-17T00:00:00Z") })).rejects.toMatchObject({
      status: 409,
      message: expect.stringContaining("2026-03-17 00:00 UTC"),
    });
    await expect(requestReturn({ orderId: o.orderId, actorId: BUYER, reason: "Arrived with a broken connector.", now: new Date("2026-03-16T23:59:00Z") })).resolves.toHaveProperty("returnId");
  });

  it("refuses a return before shipping", async () => {
    const { requestReturn } = await import("@/db/queries/orders");
    const o = await createPaidOrder(world, { lines: [{ title: "Spare fuse kit", unitPriceMinor: 600, quantity: 1, stockLeft: 0 }], feeMinor: 48 });
    await expect(requestReturn({ orderId: o.orderId, actorId: BUYER, reason: "Not needed any more, sorry." })).rejects.toMatchObject({ status: 409 });
  });
});

describe("who sees and changes an order (route handlers with the real guard)", () => {
  it("a visitor gets 401, another seller 404, the buyer 403 on the seller's action, the seller 200", async () => {
    const { POST } = await import("@/app/api/orders/[id]/ship/route");
    const o = await createPaidOrder(world, { lines: [{ title: "Isolation board", unitPriceMinor: 5_500, quantity: 1, stockLeft: 0 }], feeMinor: 440 });
    const ctx = { params: Promise.resolve({ id: o.orderId }) };
    const body = { carrier: "Yard Post", trackingRef: "YP-7777" };
    expect((await POST(post(`/api/orders/${o.orderId}/ship`, body), ctx)).status).toBe(401);
    session.userId = "demo-seller-magnetics";
    const other = await POST(post(`/api/orders/${o.orderId}/ship`, body), ctx);
    expect(other.status).toBe(404);
    expect(await other.json()).toMatchObject({ error: "not_found" });
    session.userId = BUYER;
    expect((await POST(post(`/api/orders/${o.orderId}/ship`, body), ctx)).status).toBe(403);
    session.userId = "demo-seller-kits";
    const invalid = await POST(post(`/api/orders/${o.orderId}/ship`, { carrier: "Yard Post" }), ctx);
    expect(invalid.status).toBe(422);
    expect((await invalid.json()).fieldErrors).toHaveProperty("trackingRef");
    expect((await orderRow(world, o.orderId)).state).toBe("paid");
    const ok = await POST(post(`/api/orders/${o.orderId}/ship`, body), ctx);
    expect(ok.status).toBe(200);
    expect(await ok.json()).toEqual({ ok: true, from: "paid", to: "shipped" });
  });

  it("the refund route reads the amount in major units exactly and answers 409 beyond the line", async () => {
    const { POST } = await import("@/app/api/orders/[id]/refunds/route");
    const o = await createPaidOrder(world, { lines: [{ title: "Sense resistor kit", unitPriceMinor: 1_115, quantity: 1, stockLeft: 0 }], feeMinor: 89 });
    const ctx = { params: Promise.resolve({ id: o.orderId }) };
    session.userId = "demo-seller-magnetics";
    expect((await POST(post(`/api/orders/${o.orderId}/refunds`, { lineId: o.lineIds[0], amount: "1.15", reason: "Scratched" }), ctx)).status).toBe(404);
    session.userId = "demo-seller-kits";
    const res = await POST(post(`/api/orders/${o.orderId}/refunds`, { lineId: o.lineIds[0], amount: "1.15", reason: "Scratched" }), ctx);
    expect(res.status).toBe(200);
    expect((await world.stripe.charges.retrieve(o.chargeId)).amount_refunded).toBe(115);
    const over = await POST(post(`/api/orders/${o.orderId}/refunds`, { lineId: o.lineIds[0], amount: "10.01", reason: "Scratched" }), ctx);
    expect(over.status).toBe(409);
    expect((await over.json()).fieldErrors).toEqual({ amount: ["At most €10.00 of this line can still be refunded."] });
    const bad = await POST(post(`/api/orders/${o.orderId}/refunds`, { lineId: o.lineIds[0], amount: "1.155", reason: "Scratched" }), ctx);
    expect(bad.status).toBe(422);
  });

  it("a buyer sees only their own orders, in the list and one by one", async () => {
    const { GET: list } = await import("@/app/api/orders/route");
    const { GET: one } = await import("@/app/api/orders/[id]/route");
    const { getOrderDetail } = await import("@/db/queries/orders");
    const o = await createPaidOrder(world, { lines: [{ title: "Display board", unitPriceMinor: 2_700, quantity: 1, stockLeft: 0 }], feeMinor: 216 });
    const ctx = { params: Promise.resolve({ id: o.orderId }) };

    session.userId = OTHER_BUYER;
    expect((await one(new Request(`http://localhost/api/orders/${o.orderId}`), ctx)).status).toBe(404);
    const theirs = (await (await list(new Request("http://localhost/api/orders"), { params: Promise.resolve({}) })).json()) as { items: { id: string }[] };
    expect(theirs.items.map((i) => i.id)).not.toContain(o.orderId);
    expect(await getOrderDetail(o.orderId, OTHER_BUYER, "buyer")).toBeNull();
    // A seller may not read another seller's orders through the buyer's door either.
    expect(await getOrderDetail(o.orderId, "demo-seller-magnetics", "seller")).toBeNull();

    session.userId = BUYER;
    const mine = (await (await list(new Request("http://localhost/api/orders"), { params: Promise.resolve({}) })).json()) as { items: { id: string; sellerName: string }[] };
    const { rows: shop } = await world.pool.query("select shop_name from seller_profiles where user_id = 'demo-seller-kits'");
    expect(mine.items.find((i) => i.id === o.orderId)?.sellerName).toBe(shop[0].shop_name);
    const detail = await one(new Request(`http://localhost/api/orders/${o.orderId}`), ctx);
    expect(detail.status).toBe(200);
    const body = (await detail.json()) as { party: string; acknowledgements: { sheetRevision: number }[]; lines: { refundableMinor: number }[] };
    expect(body.party).toBe("buyer");
    expect(body.acknowledgements).toEqual([expect.objectContaining({ sheetRevision: 2, title: "Display board" })]);
    expect(body.lines[0]!.refundableMinor).toBe(2_700);

    // The seller list is for sellers only.
    const asSeller = await list(new Request("http://localhost/api/orders?as=seller"), { params: Promise.resolve({}) });
    expect(asSeller.status).toBe(403);
  });

  it("the seller's list filters by state and sorts by total", async () => {
    const { listSellerOrders } = await import("@/db/queries/orders");
    const all = await listSellerOrders("demo-seller-kits", { sort: "total", dir: "asc", page: 1 });
    const totals = all.items.map((i) => i.subtotalMinor);
    expect(totals).toEqual([...totals].sort((a, b) => a - b));
    const shipped = await listSellerOrders("demo-seller-kits", { state: "shipped", sort: "date", dir: "desc", page: 1 });
    expect(shipped.items.length).toBeGreaterThan(0);
    expect(shipped.items.every((i) => i.state === "shipped")).toBe(true);
    expect((await listSellerOrders("demo-seller-magnetics", { sort: "date", dir: "desc", page: 1 })).items).toEqual([]);
  });
});

describe("platform fee", () => {
  it("an admin sets the fee in basis points with an audit entry; out of range is refused", async () => {
    const { getPlatformFee, setPlatformFee } = await import("@/db/queries/orders");
    expect((await getPlatformFee()).feeBps).toBe(800);
    expect(await setPlatformFee({ actorId: "demo-admin", feeBps: 825 })).toEqual({ fromBps: 800, toBps: 825, changed: true });
    expect(await setPlatformFee({ actorId: "demo-admin", feeBps: 825 })).toEqual({ fromBps: 825, toBps: 825, changed: false });
    expect(await getPlatformFee()).toMatchObject({ feeBps: 825, updatedByName: "Oriel Vantongeren" });
    await expect(setPlatformFee({ actorId: "demo-admin", feeBps: 5001 })).rejects.toMatchObject({ status: 422 });
    const { rows } = await world.pool.query("select actor_id, details from audit_log where action = 'platform.fee_changed'");
    expect(rows).toEqual([{ actor_id: "demo-admin", details: { fromBps: 800, toBps: 825 } }]);
  });
});
