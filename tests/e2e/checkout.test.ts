// A buyer's checkout in Chromium against the production build, the payments fake (its hosted test
// page and its signed webhooks) and the mail outbox. Run alone with
// `FLUXYARD_TEST_SLOT=4 npm test -- --e2e-only tests/e2e/checkout.test.ts`.
import { randomUUID } from "node:crypto";
import pg from "pg";
import type Stripe from "stripe";
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { openBrowser, screenshot, type Session } from "./support/browser";
import { waitForMessage } from "./support/outbox";
import { signInThroughOutbox } from "./support/sign-in";
import { fakePaymentsClient, PAYMENTS_URL } from "./support/payments";

const DATABASE_URL = process.env.E2E_DATABASE_URL ?? "";
const KITS_SELLER = { id: "demo-seller-kits", email: "bram.kits@larkspur.test" };
const COILS_SELLER = { id: "demo-seller-magnetics", email: "idunn.winds@larkspur.test" };

// Invented listings with invented figures; the kit's declaration is the welder of the example.
const KIT_DECLARATION = {
  mainsConnected: true,
  mainsVrms: 230,
  mainsTolerance: 0.1,
  busCapacitanceF: 1000e-6,
  bleederOhm: 47_000,
  liveHeatsinks: true,
  weldingSource: true,
  openCircuitV: 62,
  ocvKind: "dc",
  environment: "normal",
};
const KIT_NOTES = [
  { topic: "mains-isolation", text: "Unplug the mains lead and switch off the rear isolator before opening the case; the input filter and bridge stay live while the lead is in." },
  { topic: "stored-charge", waitSeconds: 180, text: "The 1000 µF bus holds about 64 J. After unplugging wait 180 s, then measure across the bus terminals and go on only below 60 V." },
  { topic: "first-power-up", text: "Power the control supply alone first, then bring mains up through a 100 W series lamp and check the bus voltage before any load is connected." },
  { topic: "protective-earth", text: "The chassis, the heatsink brackets and the output clamp frame are bonded to the earth stud; check under 0.1 Ω from each to the plug's earth pin." },
  { topic: "live-heatsinks", text: "Both switch heatsinks sit at bus potential; they are mounted on insulating pillars behind a perforated cover that must stay fitted whenever mains is present." },
  { topic: "output-voltage", text: "The open-circuit output is 62 V DC, held below the arc-welding limit by the transformer ratio and the clamp on the output rectifier." },
  { topic: "arc-hazards", text: "Wear a welding helmet with the right shade, cover your skin, weld with fume extraction and keep anything that can burn well clear of the work." },
  { topic: "codes-and-competence", text: "Local electrical codes and licensed practice come first; build this only with experience of mains equipment and someone who can check your work." },
];
const CHOKE_NOTES = [
  { topic: "codes-and-competence", text: "This choke sits on the isolated output side; wiring it into a mains build still follows local electrical codes and licensed practice." },
];

let pool: pg.Pool;
let stripe: Stripe;
const run = randomUUID().slice(0, 8);
const kit = { id: randomUUID(), slug: `e2e-welder-kit-${run}`, title: `Bench welder kit 120 A (${run})` };
const choke = { id: randomUUID(), slug: `e2e-output-choke-${run}`, title: `Output choke 25 µH, 120 A (${run})` };

async function onboardedAccount(email: string): Promise<string> {
  const account = await stripe.accounts.create({ type: "express", country: "DE", email, capabilities: { transfers: { requested: true } } });
  const res = await fetch(`${PAYMENTS_URL}/api/test/complete-onboarding`, { method: "POST", headers: { "Content-Type": "application/json" }, body: JSON.stringify({ account: account.id }) });
  if (!res.ok) throw new Error(`onboarding ${account.id} failed with ${res.status}`);
  return account.id;
}

async function sellerReady(seller: { id: string; email: string }, shopName: string) {
  const account = await onboardedAccount(seller.email);
  await pool.query(
    `insert into seller_profiles (user_id, shop_name, slug, profile_md, country, returns_policy_md, payout_account_id, payouts_enabled, charges_enabled)
     values ($1, $2, $3, 'An invented workshop of the demo.', 'DE', 'Returns within 30 days, unused.', $4, true, true)
     on conflict (user_id) do update set payout_account_id = excluded.payout_account_id, payouts_enabled = true, charges_enabled = true`,
    [seller.id, shopName, shopName.toLowerCase().replaceAll(" ", "-"), account],
  );
}

async function stockOf(id: string): Promise<number> {
  return (await pool.query("select stock from listings where id = $1", [id])).rows[0].stock;
}

beforeAll(async () => {
  pool = new pg.Pool({ connectionString: DATABASE_URL, max: 2 });
  stripe = fakePaymentsClient();
  await sellerReady(KITS_SELLER, "Yard Kitworks");
  await sellerReady(COILS_SELLER, "Larkspur Coil Room");
  const insert = `insert into listings (id, seller_id, kind, magnetic_subtype, title, slug, description_md, price_minor, currency, stock, declaration, safety_notes, sheet_revision, state, policy_revision, policy_status, live_at)
    values ($1, $2, $3, $4, $5, $6, $7, $8, 'EUR', $9, $10, $11, $12, 'live', 2, 'clear', now())`;
  await pool.query(insert, [kit.id, KITS_SELLER.id, "kit", null, kit.title, kit.slug, "A stick-welding inverter kit: board, heatsinks and hardware.", 24_900, 3, JSON.stringify(KIT_DECLARATION), JSON.stringify(KIT_NOTES), 3]);
  await pool.query(insert, [choke.id, COILS_SELLER.id, "magnetic", "choke", choke.title, choke.slug, "Powder-core toroid wound with flat copper strip.", 4_800, 5, JSON.stringify({ mainsConnected: false, liveHeatsinks: false, weldingSource: false }), JSON.stringify(CHOKE_NOTES), 1]);
});

afterAll(async () => {
  await pool?.end();
});

describe("checkout in Chromium", () => {
  let s: Session;
  beforeEach(async () => {
    s = await openBrowser();
  });
  afterEach(async () => {
    await s.close();
  });

  async function addToCart(slug: string) {
    await s.page.goto(`/listings/${slug}`);
    const form = s.page.getByTestId("add-to-cart");
    await form.getByRole("button", { name: "Add to cart" }).click();
    await form.getByText(/in your cart/).waitFor();
  }

  it("a visitor fills a cart from two sellers, signs in (the cart follows), acknowledges the sheet, pays, and sees the order paid", async () => {
    const buyer = `e2e.buyer.${run}@example.test`;
    await addToCart(kit.slug);
    await screenshot(s.page, "checkout-01-listing-added");
    await addToCart(choke.slug);

    await s.page.goto("/cart");
    expect(await s.page.getByTestId("cart-line").count()).toBe(2);
    expect(await s.page.getByTestId("cart-seller").count()).toBe(2);
    expect(await s.page.getByTestId("cart-total").textContent()).toBe("€297.00");
    await screenshot(s.page, "checkout-02-visitor-cart");
    await s.page.getByRole("link", { name: "Sign in and check out" }).click();
    await s.page.getByTestId("sign-in-prompt").waitFor();

    await signInThroughOutbox(s.page, buyer, "/checkout");
    await s.page.waitForURL(/\/checkout$/);
    // The visitor's cart was merged into the new member's at sign-in.
    expect(await s.page.getByTestId("cart-line").count()).toBe(2);
    const ack = s.page.getByTestId("acknowledgement");
    expect(await ack.count()).toBe(1);
    expect(await ack.textContent()).toContain(
      "This kit connects to 230 V mains; its bus reaches 358 V and stores 64 J; the bus needs 84 s to fall below 60 V after unplugging; heatsinks are live; it is a welding source with 62 V open-circuit output. I have read its safety sheet (revision 3).",
    );
    await ack.getByRole("checkbox").check();
    await screenshot(s.page, "checkout-03-acknowledged");

    const since = new Date(Date.now() - 1000);
    await s.page.getByRole("button", { name: "Pay €297.00" }).click();
    await s.page.waitForURL(/\/pay\/cs_/);
    expect(await s.page.getByText("Local test checkout — no real money").count()).toBeGreaterThan(0);
    await s.page.getByLabel("Card number").fill("4242 4242 4242 4242");
    await screenshot(s.page, "checkout-04-provider-page");
    await s.page.getByRole("button", { name: /^Pay / }).click();

    await s.page.waitForURL(/\/checkout\/done\?session=/);
    await s.page.locator('[data-testid="payment-status"][data-status="paid"]').waitFor({ timeout: 30_000 });
    expect(await s.page.getByText("Payment received — order paid").count()).toBe(1);
    expect(await s.page.getByTestId("paid-order").count()).toBe(2);
    await screenshot(s.page, "checkout-05-paid");

    const receipt = await waitForMessage(buyer, since, 30_000, /^Paid:/);
    expect(receipt.subject).toBe("Paid: 2 orders from one checkout");
    expect(receipt.text).toContain("€297.00");
    const toSeller = await waitForMessage(KITS_SELLER.email, since, 30_000, /^New paid order/);
    expect(toSeller.subject).toMatch(/^New paid order FY-/);

    expect(await stockOf(kit.id)).toBe(2);
    expect(await stockOf(choke.id)).toBe(4);
    const { rows } = await pool.query(
      "select o.state, o.transfer_id from orders o join users u on u.id = o.buyer_id where u.email = $1",
      [buyer],
    );
    expect(rows.map((r) => r.state)).toEqual(["paid", "paid"]);
    // The cart is cleared of what was bought.
    await s.page.goto("/cart");
    await s.page.getByText("Your cart is empty").waitFor();
  });

  it("a declined card shows the provider's message; cancelling back leaves the cart intact and the stock released", async () => {
    const buyer = `e2e.declined.${run}@example.test`;
    await addToCart(kit.slug);
    await signInThroughOutbox(s.page, buyer, "/checkout");
    await s.page.waitForURL(/\/checkout$/);
    const before = await stockOf(kit.id);
    await s.page.getByTestId("acknowledgement").getByRole("checkbox").check();
    await s.page.getByRole("button", { name: "Pay €249.00" }).click();
    await s.page.waitForURL(/\/pay\/cs_/);
    expect(await stockOf(kit.id)).toBe(before - 1);

    await s.page.getByLabel("Card number").fill("4000 0000 0000 0002");
    await s.page.getByRole("button", { name: /^Pay / }).click();
    const error = s.page.getByRole("alert");
    await error.waitFor();
    expect(await error.textContent()).toMatch(/declined/i);
    await screenshot(s.page, "checkout-06-declined");

    await s.page.getByRole("link", { name: "Cancel and go back" }).click();
    await s.page.waitForURL(/\/cart\?cancelled=1/);
    await s.page.getByText("Payment cancelled").waitFor();
    expect(await s.page.getByTestId("cart-line").count()).toBe(1);
    expect(await s.page.getByTestId("cart-line").textContent()).toContain(kit.title);
    await screenshot(s.page, "checkout-07-cancelled-cart");
    expect(await stockOf(kit.id)).toBe(before);
    const { rows } = await pool.query("select c.status from checkouts c join users u on u.id = c.buyer_id where u.email = $1", [buyer]);
    expect(rows.map((r) => r.status)).toHaveLength(1);
    expect(["failed", "expired"]).toContain(rows[0].status);
  });
});
