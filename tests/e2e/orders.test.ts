import { randomBytes } from "node:crypto";
import { eq } from "drizzle-orm";
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import type Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as schema from "../../db/schema";
import { DEMO_ACCOUNTS } from "../../db/seed-data";
import { openBrowser, screenshot, type Session } from "./support/browser";
import { messagesTo, type OutboxMessage } from "./support/outbox";
import { signInThroughOutbox } from "./support/sign-in";
import { fakePaymentsClient, PAYMENTS_URL } from "./support/payments";

// After the sale, in Chromium: a paid order from the demo seller of kits to the demo builder is put in
// the database as the checkout's webhook would leave it (with a real paid intent and transfer in the
// payments fake); the seller ships it, the buyer sees it shipped with its tracking and gets the e-mail,
// the seller refunds part of a line and the buyer sees the refund — checked against the fake's charge.
const seller = DEMO_ACCOUNTS.find((a) => a.id === "demo-seller-kits")!;
const buyer = DEMO_ACCOUNTS.find((a) => a.id === "demo-builder")!;
const DATABASE_URL = process.env.E2E_DATABASE_URL!;

let pool: pg.Pool;
let stripe: Stripe;
let order: { id: string; number: string; chargeId: string; chokeLineId: string; shopName: string };

async function waitForSubject(address: string, contains: string, timeoutMs = 20_000): Promise<OutboxMessage> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    const found = (await messagesTo(address)).find((m) => m.subject.includes(contains));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 300));
  }
  throw new Error(`no message to ${address} with "${contains}" within ${timeoutMs / 1000} s`);
}

async function insertPaidOrder(): Promise<typeof order> {
  const db = drizzle(pool, { schema });
  const account = await stripe.accounts.create({ type: "express", country: "DE", email: seller.email, capabilities: { card_payments: { requested: true }, transfers: { requested: true } } });
  await fetch(`${PAYMENTS_URL}/api/test/complete-onboarding`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ account: account.id }) });
  await db
    .insert(schema.sellerProfiles)
    .values({
      userId: seller.id,
      shopName: "Oyelaran Inverter Works",
      slug: "oyelaran-inverter-works",
      profileMd: "Inverter boards and kits, designed in the yard.",
      country: "NL",
      returnsPolicyMd: "Unbuilt kits within 14 days.",
      returnsWindowDays: 14,
      payoutAccountId: account.id,
      chargesEnabled: true,
      payoutsEnabled: true,
    })
    // The demo seed already gives the seller a shop; keep it as it is.
    .onConflictDoNothing();
  const [shop] = await db.select({ name: schema.sellerProfiles.shopName }).from(schema.sellerProfiles).where(eq(schema.sellerProfiles.userId, seller.id));

  const tag = randomBytes(3).toString("hex");
  const lines = [
    { title: "Half-bridge stick welder kit", unitPriceMinor: 12_900, quantity: 1, kind: "kit" as const },
    { title: "Gate-drive transformer board", unitPriceMinor: 1_850, quantity: 2, kind: "board" as const },
  ];
  const subtotal = lines.reduce((s, l) => s + l.unitPriceMinor * l.quantity, 0);
  const fee = Math.floor((subtotal * 800 + 5_000) / 10_000);
  const intent = await stripe.paymentIntents.create({ amount: subtotal, currency: "eur", confirm: true, payment_method: "pm_card_visa", allowed_payment_method_types: ["card"] });
  const chargeId = intent.latest_charge as string;
  const transfer = await stripe.transfers.create({ amount: subtotal - fee, currency: "eur", destination: account.id, source_transaction: chargeId });
  const listingRows = await db
    .insert(schema.listings)
    .values(
      lines.map((l, i) => ({
        sellerId: seller.id,
        kind: l.kind,
        title: l.title,
        slug: `e2e-orders-${tag}-${i}`,
        descriptionMd: "Demo listing for the orders journey.",
        priceMinor: l.unitPriceMinor,
        currency: "EUR",
        stock: 3,
        declaration: { mainsConnected: true, mainsVrms: 230, busCapacitanceF: 0.00094, bleederOhm: 47_000, liveHeatsinks: i === 0, weldingSource: i === 0, openCircuitV: 68, ocvKind: "dc" as const, environment: "normal" as const },
        state: "live" as const,
        sheetRevision: 3,
      })),
    )
    .returning({ id: schema.listings.id });
  const now = new Date();
  const [checkout] = await db
    .insert(schema.checkouts)
    .values({ buyerId: buyer.id, email: buyer.email, currency: "EUR", totalMinor: subtotal, feeBps: 800, status: "paid", paymentIntentId: intent.id, expiresAt: new Date(now.getTime() + 3_600_000), paidAt: now })
    .returning({ id: schema.checkouts.id });
  const number = `FY-E2E-${tag.toUpperCase()}`;
  const [row] = await db
    .insert(schema.orders)
    .values({ number, checkoutId: checkout!.id, buyerId: buyer.id, sellerId: seller.id, state: "paid", currency: "EUR", subtotalMinor: subtotal, feeMinor: fee, sellerShareMinor: subtotal - fee, transferId: transfer.id, createdAt: new Date(now.getTime() - 120_000), paidAt: now })
    .returning({ id: schema.orders.id });
  const lineRows = await db
    .insert(schema.orderLines)
    .values(lines.map((l, i) => ({ orderId: row!.id, listingId: listingRows[i]!.id, title: l.title, unitPriceMinor: l.unitPriceMinor, quantity: l.quantity, sheetRevision: 3 })))
    .returning({ id: schema.orderLines.id });
  await db.insert(schema.orderAcknowledgements).values(
    listingRows.map((l) => ({ checkoutId: checkout!.id, listingId: l.id, sheetRevision: 3, policyRevision: 1, hazards: ["connects to 230 V mains", "its bus reaches 358 V and stores 60 J"] })),
  );
  return { id: row!.id, number, chargeId, chokeLineId: lineRows[1]!.id, shopName: shop!.name };
}

describe("orders after the sale in Chromium", () => {
  let sellerSession: Session;
  let buyerSession: Session;

  beforeAll(async () => {
    pool = new pg.Pool({ connectionString: DATABASE_URL, max: 2 });
    stripe = fakePaymentsClient();
    order = await insertPaidOrder();
    sellerSession = await openBrowser();
    buyerSession = await openBrowser();
  });

  afterAll(async () => {
    await sellerSession?.close();
    await buyerSession?.close();
    await pool?.end();
  });

  it("the seller ships with a tracking reference; the buyer sees it shipped and gets the e-mail", async () => {
    const s = sellerSession.page;
    await signInThroughOutbox(s, seller.email, "/sell/orders");
    await s.goto("/sell/orders");
    const row = s.getByTestId(`seller-order-row-${order.number}`);
    await row.waitFor();
    expect(await row.textContent()).toContain("To ship");
    expect(await row.textContent()).toContain("Paid");
    await screenshot(s, "orders-seller-table");
    await row.getByRole("link", { name: order.number }).click();
    await s.getByTestId("ship-form").waitFor();
    await s.getByLabel("Carrier").fill("Larkspur Courier");
    await s.getByLabel("Tracking reference").fill("LC-2026-118834");
    await s.getByRole("button", { name: "Mark shipped" }).click();
    await s.locator('[data-testid="seller-order-page"][data-state="shipped"]').waitFor();
    await screenshot(s, "orders-seller-shipped");

    const b = buyerSession.page;
    await signInThroughOutbox(b, buyer.email, "/orders");
    await b.goto("/orders");
    const mine = b.getByTestId(`order-row-${order.number}`);
    await mine.waitFor();
    expect(await mine.textContent()).toContain("Shipped");
    expect(await mine.textContent()).toContain(order.shopName);
    await screenshot(b, "orders-buyer-history");
    await mine.getByRole("link", { name: order.number }).click();
    await b.getByTestId("order-tracking").waitFor();
    expect(await b.getByTestId("order-tracking").textContent()).toContain("LC-2026-118834");
    expect(await b.locator("header").filter({ hasText: order.number }).textContent()).toContain("Shipped");
    expect(await b.getByTestId("order-acknowledgements").textContent()).toContain("revision 3");
    await screenshot(b, "orders-buyer-shipped");

    // The worker delivers the outbox within seconds.
    const mail = await waitForSubject(buyer.email, `Shipped: order ${order.number}`);
    expect(mail.text).toContain("LC-2026-118834");
    expect(mail.text).toContain("Larkspur Courier");
  });

  it("the seller refunds part of a line and the buyer sees the refund; the fake's charge shows it", async () => {
    const s = sellerSession.page;
    await s.goto(`/sell/orders/${order.id}`);
    await s.getByTestId("refund-form").waitFor();
    await s.getByLabel("Line to refund").selectOption(order.chokeLineId);
    await s.getByLabel("Amount (EUR)").fill("10.50");
    await s.getByLabel("Reason").fill("One gate-drive board arrived with a cracked ferrite.");
    await s.getByRole("button", { name: "Refund", exact: true }).click();
    await s.getByText("€10.50 refunded to the buyer.").waitFor();
    await screenshot(s, "orders-seller-refunded");
    expect((await stripe.charges.retrieve(order.chargeId)).amount_refunded).toBe(1_050);

    // More than is left on the line is refused beside the amount, and nothing moves.
    await s.getByLabel("Line to refund").selectOption(order.chokeLineId);
    await s.getByLabel("Amount (EUR)").fill("26.51");
    await s.getByLabel("Reason").fill("Too much on purpose.");
    await s.getByRole("button", { name: "Refund", exact: true }).click();
    await s.getByText("At most €26.50 of this line can still be refunded.").waitFor();
    expect((await stripe.charges.retrieve(order.chargeId)).amount_refunded).toBe(1_050);

    const b = buyerSession.page;
    await b.goto(`/orders/${order.id}`);
    const refunds = b.getByTestId("order-refunds");
    await refunds.waitFor();
    expect(await refunds.textContent()).toContain("€10.50");
    expect(await refunds.textContent()).toContain("Refunded");
    expect(await refunds.textContent()).toContain("cracked ferrite");
    expect(await b.getByTestId("order-refunded-total").textContent()).toContain("€10.50");
    await screenshot(b, "orders-buyer-refund");
    const mail = await waitForSubject(buyer.email, `Refund of €10.50 for order ${order.number}`);
    expect(mail.text).toContain("Gate-drive transformer board");
  });

  it("the buyer confirms delivery and asks for a return; the seller accepts and the rest is refunded", async () => {
    const b = buyerSession.page;
    await b.goto(`/orders/${order.id}`);
    await b.getByRole("button", { name: "Confirm delivery" }).click();
    await b.locator('[data-testid="order-page"][data-state="delivered"]').waitFor();
    expect(await b.getByTestId("returns-window").textContent()).toContain("30 days");
    await b.getByLabel("Why do you want to return it?").fill("The kit's board is an older revision than the photos show.");
    await b.getByRole("button", { name: "Request a return" }).click();
    await b.getByTestId("order-returns").getByText("Waiting for the seller").waitFor();
    await screenshot(b, "orders-buyer-return-requested");
    const notice = await waitForSubject(seller.email, `Return requested for order ${order.number}`);
    expect(notice.text).toContain("older revision");

    const s = sellerSession.page;
    await s.goto("/sell/orders");
    expect(await s.getByTestId(`seller-order-row-${order.number}`).textContent()).toContain("Return requested");
    await s.goto(`/sell/orders/${order.id}`);
    await screenshot(s, "orders-seller-return-decision");
    await s.getByRole("button", { name: "Accept and refund the rest" }).click();
    await s.locator('[data-testid="seller-order-page"][data-state="refunded"]').waitFor();
    await screenshot(s, "orders-seller-refunded-in-full");
    expect((await stripe.charges.retrieve(order.chargeId)).amount_refunded).toBe(16_600);

    await b.goto(`/orders/${order.id}`);
    await b.locator('[data-testid="order-page"][data-state="refunded"]').waitFor();
    expect(await b.getByTestId("order-returns").textContent()).toContain("Accepted");
    await screenshot(b, "orders-buyer-refunded-in-full");
    await waitForSubject(buyer.email, `Return accepted for order ${order.number}`);
  });

  it("an admin sets the platform fee, which applies to new orders only", async () => {
    const session = await openBrowser();
    try {
      const p = session.page;
      const admin = DEMO_ACCOUNTS.find((a) => a.roles.includes("admin"))!;
      await signInThroughOutbox(p, admin.email, "/admin/fee");
      await p.goto("/admin/fee");
      await p.getByText("Applies to new orders only").waitFor();
      await p.getByLabel("Platform fee").fill("8.5");
      await p.getByRole("button", { name: "Save the fee" }).click();
      await p.getByText("The fee is now 8.5 % (was 8 %)").waitFor();
      expect(await p.getByTestId("fee-current").textContent()).toContain("850");
      await screenshot(p, "orders-admin-fee");
      await p.getByLabel("Platform fee").fill("51");
      await p.getByRole("button", { name: "Save the fee" }).click();
      await p.getByText("The fee can be at most 50 %.").waitFor();
      const { rows } = await pool.query("select fee_bps from platform_settings where id = 1");
      expect(rows[0].fee_bps).toBe(850);
      // The order placed before the change keeps its fee.
      const { rows: placed } = await pool.query("select fee_minor from orders where id = $1", [order.id]);
      expect(placed[0].fee_minor).toBe(1_328);
      await p.getByLabel("Platform fee").fill("8");
      await p.getByRole("button", { name: "Save the fee" }).click();
      await p.getByText("The fee is now 8 % (was 8.5 %)").waitFor();
    } finally {
      await session.close();
    }
  });
});
