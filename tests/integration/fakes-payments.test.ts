// The local payments fake, driven through the real `stripe` SDK (23.1.0).
// Reference for shapes and rules: the SDK's own type definitions
// (node_modules/stripe/esm/resources/*.d.ts) and its request/response handling
// (RequestSender.js, Error.js); webhook signatures are checked with the SDK's
// `webhooks.constructEvent`, which implements the provider's published scheme.
import Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { startPaymentsFake, type PaymentsFake } from "@/fakes/payments/server";
import { startWebhookReceiver, type WebhookReceiver } from "@/fakes/payments/testing/webhook-receiver";

const WEBHOOK_SECRET = "whsec_fluxyard_integration_main";
const SHOP = "http://localhost:3000";

let fake: PaymentsFake;
let receiver: WebhookReceiver;
let stripe: Stripe;

beforeAll(async () => {
  receiver = await startWebhookReceiver();
  fake = await startPaymentsFake({
    port: 0,
    webhooks: [{ url: receiver.url, secret: WEBHOOK_SECRET }],
    webhookRetryBaseMs: 50,
    log: () => {},
  });
  stripe = client("sk_test_fluxyard_integration");
});

afterAll(async () => {
  await fake?.close();
  await receiver?.close();
});

// The SDK retries 409/5xx and network errors twice by default (PlatformFunctions
// getDefaultMaxNetworkRetries = 2); 0 keeps failures immediate in these tests.
function client(key: string, maxNetworkRetries = 0): Stripe {
  const { hostname, port } = new URL(fake.url);
  return new Stripe(key, { host: hostname, port: Number(port), protocol: "http", maxNetworkRetries });
}

async function testHook(path: string, body?: unknown): Promise<{ status: number; json: Record<string, any> }> {
  const res = await fetch(`${fake.url}/api/test${path}`, {
    method: body === undefined ? "GET" : "POST",
    headers: { "Content-Type": "application/json" },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  return { status: res.status, json: (await res.json()) as Record<string, any> };
}

/** Every event the receiver accepted, each verified against the endpoint secret. */
function verifiedEvents(): Stripe.Event[] {
  return receiver.received
    .filter((r) => r.answeredWith === 200)
    .map((r) => stripe.webhooks.constructEvent(r.body, r.signature ?? "", WEBHOOK_SECRET));
}

async function waitForEvent(type: string, objectId: string): Promise<Stripe.Event> {
  const match = (e: Stripe.Event) => e.type === type && (e.data.object as { id?: string }).id === objectId;
  await receiver.waitFor(() => verifiedEvents().some(match));
  const found = verifiedEvents().find(match);
  if (!found) throw new Error(`no ${type} for ${objectId}`);
  return found;
}

function sessionParams(overrides: Partial<Stripe.Checkout.SessionCreateParams> = {}): Stripe.Checkout.SessionCreateParams {
  return {
    mode: "payment",
    line_items: [
      { price_data: { currency: "eur", unit_amount: 4850, product_data: { name: "Output choke 40 µH / 30 A" } }, quantity: 2 },
      { price_data: { currency: "eur", unit_amount: 1200, product_data: { name: "Current-sense transformer 1:100" } }, quantity: 1 },
    ],
    customer_email: "builder.one@example.test",
    client_reference_id: "order_1001",
    metadata: { orderId: "order_1001" },
    success_url: `${SHOP}/checkout/done?session={CHECKOUT_SESSION_ID}`,
    cancel_url: `${SHOP}/cart`,
    payment_intent_data: { metadata: { orderId: "order_1001" }, transfer_group: "order_1001" },
    ...overrides,
  };
}

async function onboard(accountId: string): Promise<void> {
  const link = await stripe.accountLinks.create({
    account: accountId,
    refresh_url: `${SHOP}/sell/payouts/refresh`,
    return_url: `${SHOP}/sell/payouts/done`,
    type: "account_onboarding",
  });
  const res = await fetch(link.url, { method: "POST", body: new URLSearchParams({}), redirect: "manual" });
  expect(res.status).toBe(303);
}

async function succeededIntent(amount: number, currency: string): Promise<Stripe.PaymentIntent> {
  return stripe.paymentIntents.create({
    amount,
    currency,
    confirm: true,
    payment_method: "pm_card_visa",
    allowed_payment_method_types: ["card"],
  });
}

describe("health", () => {
  it("answers GET /api/health", async () => {
    const res = await fetch(`${fake.url}/api/health`);
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ ok: true, service: "payments" });
  });
});

describe("connected accounts", () => {
  it("creates, retrieves, updates and deletes an express account", async () => {
    const account = await stripe.accounts.create({
      type: "express",
      country: "DE",
      email: "seller.one@example.test",
      capabilities: { card_payments: { requested: true }, transfers: { requested: true } },
      business_profile: { name: "Coil Bench Co-op", product_description: "Hand-wound magnetics" },
      metadata: { sellerId: "sel_1", tier: "new" },
    });
    // Account object fields as in Accounts.d.ts.
    expect(account.id).toMatch(/^acct_/);
    expect(account.object).toBe("account");
    expect(account.type).toBe("express");
    expect(account.charges_enabled).toBe(false);
    expect(account.payouts_enabled).toBe(false);
    expect(account.details_submitted).toBe(false);
    expect(account.capabilities).toEqual({ card_payments: "inactive", transfers: "inactive" });
    expect(account.business_profile?.name).toBe("Coil Bench Co-op");
    expect(account.metadata).toEqual({ sellerId: "sel_1", tier: "new" });
    expect(account.requirements?.currently_due?.length).toBeGreaterThan(0);

    const fetched = await stripe.accounts.retrieve(account.id);
    expect(fetched.email).toBe("seller.one@example.test");

    // Metadata update semantics (MetadataParam in shared.d.ts): an empty value unsets the key.
    const updated = await stripe.accounts.update(account.id, {
      metadata: { tier: "", region: "north" },
      business_profile: { support_email: "help@coil-bench.example.test" },
    });
    expect(updated.metadata).toEqual({ sellerId: "sel_1", region: "north" });
    expect(updated.business_profile?.support_email).toBe("help@coil-bench.example.test");
    expect(updated.business_profile?.name).toBe("Coil Bench Co-op");
    const updateEvent = await waitForEvent("account.updated", account.id);
    expect(updateEvent.data.previous_attributes).toMatchObject({ metadata: { sellerId: "sel_1", tier: "new" } });

    const deleted = await stripe.accounts.del(account.id);
    expect(deleted).toMatchObject({ id: account.id, object: "account", deleted: true });
    const missing = await stripe.accounts.retrieve(account.id).catch((e: unknown) => e);
    expect(missing).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(missing).toMatchObject({ statusCode: 404, code: "resource_missing" });
  });

  it("onboards through the hosted page and redirects to return_url", async () => {
    const account = await stripe.accounts.create({
      type: "express",
      country: "GB",
      email: "seller.two@example.test",
      capabilities: { transfers: { requested: true } },
    });
    const link = await stripe.accountLinks.create({
      account: account.id,
      refresh_url: `${SHOP}/sell/payouts/refresh`,
      return_url: `${SHOP}/sell/payouts/done`,
      type: "account_onboarding",
    });
    // AccountLink in AccountLinks.d.ts: object, created, expires_at, url.
    expect(link.object).toBe("account_link");
    expect(link.url.startsWith(`${fake.url}/onboarding/`)).toBe(true);
    expect(link.expires_at).toBeGreaterThan(link.created);

    const page = await fetch(link.url);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain("Finish test onboarding");
    expect(html.toLowerCase()).toContain("local test page");
    expect(html).toContain("Fluxyard payments stand-in");
    expect(html).toContain('value="000123456789"');

    // 303 See Other turns the form POST into a GET of return_url (RFC 9110 §15.4.4).
    const done = await fetch(link.url, {
      method: "POST",
      body: new URLSearchParams({ business_name: "Bench Supply Works", account_number: "000987654321" }),
      redirect: "manual",
    });
    expect(done.status).toBe(303);
    expect(done.headers.get("location")).toBe(`${SHOP}/sell/payouts/done`);

    const enabled = await stripe.accounts.retrieve(account.id);
    expect(enabled.charges_enabled).toBe(true);
    expect(enabled.payouts_enabled).toBe(true);
    expect(enabled.details_submitted).toBe(true);
    expect(enabled.capabilities?.transfers).toBe("active");
    expect(enabled.business_profile?.name).toBe("Bench Supply Works");
    expect(enabled.external_accounts?.data[0]).toMatchObject({ object: "bank_account", last4: "4321" });

    const event = await waitForEvent("account.updated", account.id);
    expect((event.data.object as Stripe.Account).charges_enabled).toBe(true);
    expect(event.data.previous_attributes).toMatchObject({ charges_enabled: false, details_submitted: false });

    // A link works once; afterwards it sends the seller to refresh_url for a new one.
    const reused = await fetch(link.url, { redirect: "manual" });
    expect(reused.status).toBe(303);
    expect(reused.headers.get("location")).toBe(`${SHOP}/sell/payouts/refresh`);
  });

  it("sends an expired link to refresh_url and leaves the account as it was", async () => {
    const account = await stripe.accounts.create({ type: "express", country: "US", capabilities: { transfers: { requested: true } } });
    const link = await stripe.accountLinks.create({
      account: account.id,
      refresh_url: `${SHOP}/sell/payouts/refresh?again=1`,
      return_url: `${SHOP}/sell/payouts/done`,
      type: "account_onboarding",
    });
    const lifetime = link.expires_at - link.created;
    await testHook("/advance-clock", { seconds: lifetime + 1 });
    const res = await fetch(link.url, { method: "POST", body: new URLSearchParams({}), redirect: "manual" });
    expect(res.status).toBe(303);
    expect(res.headers.get("location")).toBe(`${SHOP}/sell/payouts/refresh?again=1`);
    expect((await stripe.accounts.retrieve(account.id)).charges_enabled).toBe(false);
  });

  it("refuses a link for an unknown account", async () => {
    const error = await stripe.accountLinks
      .create({ account: "acct_unknown000000", refresh_url: `${SHOP}/r`, return_url: `${SHOP}/d`, type: "account_onboarding" })
      .catch((e: unknown) => e);
    expect(error).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(error).toMatchObject({ param: "account", code: "resource_missing" });
  });
});

describe("checkout sessions", () => {
  it("creates an open session whose url is the hosted page", async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    expect(session.id).toMatch(/^cs_test_/);
    expect(session.object).toBe("checkout.session");
    expect(session.url).toBe(`${fake.url}/pay/${session.id}`);
    expect(session.status).toBe("open");
    expect(session.payment_status).toBe("unpaid");
    // 2 × 48.50 + 1 × 12.00 = 109.00 EUR in minor units.
    expect(session.amount_total).toBe(2 * 4850 + 1200);
    expect(session.currency).toBe("eur");
    expect(session.client_reference_id).toBe("order_1001");
    expect(session.metadata).toEqual({ orderId: "order_1001" });
    expect(session.payment_intent).toBeNull();
    expect(session.livemode).toBe(false);

    const items = await stripe.checkout.sessions.listLineItems(session.id);
    expect(items.data.map((i) => [i.description, i.quantity, i.amount_total])).toEqual([
      ["Output choke 40 µH / 30 A", 2, 9700],
      ["Current-sense transformer 1:100", 1, 1200],
    ]);
  });

  it("pays through the test hook and signs the events so constructEvent accepts them", async () => {
    const session = await stripe.checkout.sessions.create(sessionParams());
    const paid = await testHook("/pay", { sessionId: session.id, card: "4242 4242 4242 4242" });
    expect(paid.status).toBe(200);
    expect(paid.json.redirect_to).toBe(`${SHOP}/checkout/done?session=${session.id}`);

    const after = await stripe.checkout.sessions.retrieve(session.id, { expand: ["payment_intent.latest_charge"] });
    expect(after.status).toBe("complete");
    expect(after.payment_status).toBe("paid");
    const intent = after.payment_intent as Stripe.PaymentIntent;
    expect(intent.id).toMatch(/^pi_/);
    expect(intent.status).toBe("succeeded");
    expect(intent.amount_received).toBe(10900);
    expect(intent.metadata).toEqual({ orderId: "order_1001" });
    expect(intent.transfer_group).toBe("order_1001");
    const charge = intent.latest_charge as Stripe.Charge;
    expect(charge.id).toMatch(/^ch_/);
    expect(charge).toMatchObject({ amount: 10900, amount_captured: 10900, captured: true, paid: true, status: "succeeded" });

    const completed = await waitForEvent("checkout.session.completed", session.id);
    expect(completed.id).toMatch(/^evt_/);
    expect((completed.data.object as Stripe.Checkout.Session).payment_status).toBe("paid");
    expect(completed.api_version).toBeTruthy();
    const succeeded = await waitForEvent("payment_intent.succeeded", intent.id);
    expect((succeeded.data.object as Stripe.PaymentIntent).latest_charge).toBe(charge.id);

    // The same bytes must fail with another secret or when altered, or the check above proves nothing.
    const raw = receiver.received.find((r) => r.body.includes(completed.id));
    expect(raw?.signature).toMatch(/^t=\d+,v1=[0-9a-f]{64}$/);
    expect(() => stripe.webhooks.constructEvent(raw?.body ?? "", raw?.signature ?? "", "whsec_other")).toThrow(
      Stripe.errors.StripeSignatureVerificationError,
    );
    expect(() =>
      stripe.webhooks.constructEvent((raw?.body ?? "").replace("complete", "expired"), raw?.signature ?? "", WEBHOOK_SECRET),
    ).toThrow(Stripe.errors.StripeSignatureVerificationError);

    expect((await stripe.events.retrieve(completed.id)).type).toBe("checkout.session.completed");
    const listed = await stripe.checkout.sessions.list({ payment_intent: intent.id });
    expect(listed.data.map((s) => s.id)).toEqual([session.id]);
  });

  it("shows the hosted page and pays when its form is posted", async () => {
    const session = await stripe.checkout.sessions.create(sessionParams({ client_reference_id: "order_1002" }));
    const page = await fetch(session.url ?? "");
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html.toLowerCase()).toContain("local test checkout — no real money");
    expect(html).toContain("Output choke 40 µH / 30 A");
    expect(html).toContain("Current-sense transformer 1:100");
    // The total as Intl formats 10900 minor units of EUR.
    expect(html).toContain(new Intl.NumberFormat("en", { style: "currency", currency: "EUR" }).format(109));
    for (const number of ["4242 4242 4242 4242", "4000 0000 0000 0002", "4000 0000 0000 9995"]) expect(html).toContain(number);
    expect(html).toMatch(new RegExp(`<a href="${SHOP}/cart">Cancel and go back</a>`));

    const res = await fetch(session.url ?? "", {
      method: "POST",
      body: new URLSearchParams({ card: "4242424242424242", email: "builder.two@example.test", name: "B. Two" }),
      redirect: "manual",
    });
    expect(res.status).toBe(303);
    expect(res.headers.get("location")).toBe(`${SHOP}/checkout/done?session=${session.id}`);
    const after = await stripe.checkout.sessions.retrieve(session.id);
    expect(after.status).toBe("complete");
    expect(after.customer_details?.email).toBe("builder.two@example.test");
    await waitForEvent("checkout.session.completed", session.id);

    const again = await fetch(session.url ?? "");
    expect(await again.text()).toContain("already paid");
  });

  it("keeps the session open after a decline and reports payment_intent.payment_failed", async () => {
    const session = await stripe.checkout.sessions.create(sessionParams({ client_reference_id: "order_1003" }));
    const declined = await fetch(session.url ?? "", {
      method: "POST",
      body: new URLSearchParams({ card: "4000 0000 0000 0002" }),
      redirect: "manual",
    });
    expect(declined.status).toBe(402);
    const html = await declined.text();
    expect(html).toContain('role="alert"');
    expect(html).toContain("Your card was declined.");

    const open = await stripe.checkout.sessions.retrieve(session.id, { expand: ["payment_intent"] });
    expect(open.status).toBe("open");
    expect(open.payment_status).toBe("unpaid");
    const intent = open.payment_intent as Stripe.PaymentIntent;
    expect(intent.status).toBe("requires_payment_method");
    expect(intent.last_payment_error).toMatchObject({ code: "card_declined", decline_code: "generic_decline" });
    await waitForEvent("payment_intent.payment_failed", intent.id);

    const poor = await testHook("/pay", { sessionId: session.id, card: "4000000000009995" });
    expect(poor.status).toBe(402);
    expect(poor.json.error).toMatchObject({ code: "card_declined", decline_code: "insufficient_funds" });

    const unknown = await testHook("/pay", { sessionId: session.id, card: "4111 1111 1111 1112" });
    expect(unknown.status).toBe(400);

    // The same session can still be paid, on the same intent.
    const ok = await testHook("/pay", { sessionId: session.id, card: "4242424242424242" });
    expect(ok.status).toBe(200);
    expect(ok.json.payment_intent.id).toBe(intent.id);
    expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe("complete");
  });

  it("expires a session on request and refuses to pay it afterwards", async () => {
    const session = await stripe.checkout.sessions.create(sessionParams({ client_reference_id: "order_1004" }));
    const expired = await stripe.checkout.sessions.expire(session.id);
    expect(expired.status).toBe("expired");
    expect(expired.url).toBeNull();
    await waitForEvent("checkout.session.expired", session.id);

    const twice = await stripe.checkout.sessions.expire(session.id).catch((e: unknown) => e);
    expect(twice).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    const pay = await testHook("/pay", { sessionId: session.id, card: "4242424242424242" });
    expect(pay.status).toBe(409);
    expect(await (await fetch(`${fake.url}/pay/${session.id}`)).text()).toContain("expired");
  });

  it("expires a session by timer once expires_at passes", async () => {
    const { json } = await testHook("/advance-clock", { seconds: 0 });
    const now = json.now as number;
    // expires_at must lie 30 min to 24 h ahead (SessionCreateParams.expires_at in Checkout/Sessions.d.ts).
    const tooSoon = await stripe.checkout.sessions.create(sessionParams({ expires_at: now + 60 })).catch((e: unknown) => e);
    expect(tooSoon).toMatchObject({ statusCode: 400, param: "expires_at" });

    const session = await stripe.checkout.sessions.create(sessionParams({ expires_at: now + 1800 }));
    const moved = await testHook("/advance-clock", { seconds: 1798 });
    expect(moved.json.expired_sessions).toBe(0);
    expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe("open");
    // Real seconds now carry the fake clock past expires_at; the one-second sweep must notice.
    await vi.waitFor(
      async () => expect((await stripe.checkout.sessions.retrieve(session.id)).status).toBe("expired"),
      { timeout: 8000, interval: 200 },
    );
    await waitForEvent("checkout.session.expired", session.id);
  });

  it("rejects a session with mixed currencies or below the minimum charge", async () => {
    const mixed = await stripe.checkout.sessions
      .create(
        sessionParams({
          line_items: [
            { price_data: { currency: "eur", unit_amount: 1000, product_data: { name: "A" } }, quantity: 1 },
            { price_data: { currency: "usd", unit_amount: 1000, product_data: { name: "B" } }, quantity: 1 },
          ],
        }),
      )
      .catch((e: unknown) => e);
    expect(mixed).toMatchObject({ statusCode: 400, param: "line_items" });
    // Minimum charge of 0.50 EUR (the provider's published minimums, from memory).
    const tiny = await stripe.checkout.sessions
      .create(sessionParams({ line_items: [{ price_data: { currency: "eur", unit_amount: 49, product_data: { name: "Washer" } }, quantity: 1 }] }))
      .catch((e: unknown) => e);
    expect(tiny).toMatchObject({ statusCode: 400, code: "amount_too_small" });
  });
});

describe("payment intents", () => {
  it("authorises, captures once, refuses a second capture, and cancels another to release it", async () => {
    const held = await stripe.paymentIntents.create({
      amount: 7500,
      currency: "eur",
      capture_method: "manual",
      confirm: true,
      payment_method: "pm_card_visa",
      allowed_payment_method_types: ["card"],
      metadata: { reviewId: "rv_1" },
      transfer_group: "review_rv_1",
    });
    expect(held.id).toMatch(/^pi_/);
    expect(held.status).toBe("requires_capture");
    expect(held.amount_capturable).toBe(7500);
    expect(held.latest_charge).toMatch(/^ch_/);
    await waitForEvent("payment_intent.amount_capturable_updated", held.id);

    const captured = await stripe.paymentIntents.capture(held.id, { amount_to_capture: 6000 });
    expect(captured.status).toBe("succeeded");
    expect(captured.amount_received).toBe(6000);
    expect(captured.amount_capturable).toBe(0);
    const charge = await stripe.charges.retrieve(captured.latest_charge as string);
    expect(charge).toMatchObject({ captured: true, amount_captured: 6000 });
    await waitForEvent("payment_intent.succeeded", held.id);

    const second = await stripe.paymentIntents.capture(held.id).catch((e: unknown) => e);
    expect(second).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(second).toMatchObject({ statusCode: 400, code: "payment_intent_unexpected_state" });

    const other = await stripe.paymentIntents.create({
      amount: 4000,
      currency: "eur",
      capture_method: "manual",
      confirm: true,
      payment_method: "pm_card_visa",
      allowed_payment_method_types: ["card"],
    });
    const released = await stripe.paymentIntents.cancel(other.id, { cancellation_reason: "requested_by_customer" });
    expect(released.status).toBe("canceled");
    expect(released.cancellation_reason).toBe("requested_by_customer");
    expect(released.amount_capturable).toBe(0);
    expect(released.canceled_at).not.toBeNull();
    await waitForEvent("payment_intent.canceled", other.id);
    const late = await stripe.paymentIntents.capture(other.id).catch((e: unknown) => e);
    expect(late).toMatchObject({ statusCode: 400, code: "payment_intent_unexpected_state" });
  });

  it("confirms later, and raises a card error with the intent for a declined card", async () => {
    const pending = await stripe.paymentIntents.create({ amount: 2500, currency: "usd", allowed_payment_method_types: ["card"] });
    expect(pending.status).toBe("requires_payment_method");
    const confirmed = await stripe.paymentIntents.confirm(pending.id, { payment_method: "pm_card_visa" });
    expect(confirmed.status).toBe("succeeded");

    const declined = await stripe.paymentIntents
      .create({ amount: 2500, currency: "usd", confirm: true, payment_method: "pm_card_chargeDeclined", allowed_payment_method_types: ["card"] })
      .catch((e: unknown) => e);
    // 402 maps to StripeCardError (generateV1Error in Error.js).
    expect(declined).toBeInstanceOf(Stripe.errors.StripeCardError);
    const cardError = declined as Stripe.errors.StripeCardError;
    expect(cardError).toMatchObject({ statusCode: 402, code: "card_declined", decline_code: "generic_decline" });
    const intent = cardError.payment_intent as Stripe.PaymentIntent;
    expect(intent.status).toBe("requires_payment_method");
    await waitForEvent("payment_intent.payment_failed", intent.id);
  });

  it("asks for a return_url when automatic payment methods may redirect", async () => {
    const error = await stripe.paymentIntents
      .create({ amount: 2500, currency: "usd", confirm: true, payment_method: "pm_card_visa" })
      .catch((e: unknown) => e);
    expect(error).toMatchObject({ statusCode: 400, param: "return_url" });
    const ok = await stripe.paymentIntents.create({
      amount: 2500,
      currency: "usd",
      confirm: true,
      payment_method: "pm_card_visa",
      automatic_payment_methods: { enabled: true, allow_redirects: "never" },
    });
    expect(ok.status).toBe("succeeded");
  });
});

describe("refunds", () => {
  it("refunds partly, then the rest, and never more than was captured", async () => {
    const intent = await succeededIntent(5000, "eur");
    const charge = intent.latest_charge as string;
    const first = await stripe.refunds.create({ payment_intent: intent.id, amount: 2000, reason: "requested_by_customer", metadata: { orderId: "order_2001" } });
    expect(first.id).toMatch(/^re_/);
    expect(first).toMatchObject({ object: "refund", amount: 2000, charge, payment_intent: intent.id, status: "succeeded" });
    expect(await stripe.charges.retrieve(charge)).toMatchObject({ amount_refunded: 2000, refunded: false });

    const over = await stripe.refunds.create({ charge, amount: 3001 }).catch((e: unknown) => e);
    expect(over).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(over).toMatchObject({ statusCode: 400, param: "amount", code: "amount_too_large" });

    const rest = await stripe.refunds.create({ charge });
    expect(rest.amount).toBe(3000);
    expect(await stripe.charges.retrieve(charge)).toMatchObject({ amount_refunded: 5000, refunded: true });

    const more = await stripe.refunds.create({ payment_intent: intent.id, amount: 1 }).catch((e: unknown) => e);
    expect(more).toMatchObject({ statusCode: 400, code: "charge_already_refunded" });

    await waitForEvent("refund.created", first.id);
    await waitForEvent("refund.created", rest.id);
    await receiver.waitFor(() => verifiedEvents().filter((e) => e.type === "charge.refunded" && (e.data.object as Stripe.Charge).id === charge).length === 2);
    const refundedSnapshots = verifiedEvents()
      .filter((e) => e.type === "charge.refunded" && (e.data.object as Stripe.Charge).id === charge)
      .map((e) => (e.data.object as Stripe.Charge).amount_refunded);
    expect(refundedSnapshots).toEqual([2000, 5000]);
  });

  it("refunds only what a partial capture took", async () => {
    const held = await stripe.paymentIntents.create({
      amount: 8000, currency: "eur", capture_method: "manual", confirm: true, payment_method: "pm_card_visa", allowed_payment_method_types: ["card"],
    });
    const uncaptured = await stripe.refunds.create({ payment_intent: held.id }).catch((e: unknown) => e);
    expect(uncaptured).toMatchObject({ statusCode: 400 });
    await stripe.paymentIntents.capture(held.id, { amount_to_capture: 3000 });
    const over = await stripe.refunds.create({ payment_intent: held.id, amount: 3001 }).catch((e: unknown) => e);
    expect(over).toMatchObject({ statusCode: 400, code: "amount_too_large" });
    expect((await stripe.refunds.create({ payment_intent: held.id })).amount).toBe(3000);
  });
});

describe("transfers", () => {
  it("moves money to an onboarded account and refuses unknown or unfinished ones", async () => {
    const seller = await stripe.accounts.create({ type: "express", country: "GB", capabilities: { transfers: { requested: true } } });
    await onboard(seller.id);
    // GBP is used only here, so the balance below depends on this test alone.
    const intent = await succeededIntent(10000, "gbp");
    const charge = intent.latest_charge as string;

    const transfer = await stripe.transfers.create({
      amount: 8500,
      currency: "gbp",
      destination: seller.id,
      transfer_group: "order_3001",
      source_transaction: charge,
      metadata: { orderId: "order_3001" },
    });
    expect(transfer.id).toMatch(/^tr_/);
    expect(transfer).toMatchObject({ object: "transfer", amount: 8500, destination: seller.id, source_transaction: charge, reversed: false });
    await waitForEvent("transfer.created", transfer.id);

    const unknown = await stripe.transfers.create({ amount: 100, currency: "gbp", destination: "acct_doesnotexist00" }).catch((e: unknown) => e);
    expect(unknown).toBeInstanceOf(Stripe.errors.StripeInvalidRequestError);
    expect(unknown).toMatchObject({ statusCode: 400, param: "destination", code: "resource_missing" });

    const fresh = await stripe.accounts.create({ type: "express", country: "GB", capabilities: { transfers: { requested: true } } });
    const unfinished = await stripe.transfers.create({ amount: 100, currency: "gbp", destination: fresh.id }).catch((e: unknown) => e);
    expect(unfinished).toMatchObject({ statusCode: 400, code: "insufficient_capabilities_for_transfer" });

    // 8500 already sent from a 10000 charge: 1501 more would exceed it.
    const tooMuch = await stripe.transfers
      .create({ amount: 1501, currency: "gbp", destination: seller.id, source_transaction: charge })
      .catch((e: unknown) => e);
    expect(tooMuch).toMatchObject({ statusCode: 400, param: "amount" });

    const reversal = await stripe.transfers.createReversal(transfer.id, { amount: 500 });
    expect(reversal.id).toMatch(/^trr_/);
    const after = await stripe.transfers.retrieve(transfer.id);
    expect(after).toMatchObject({ amount_reversed: 500, reversed: false });

    const balance = await stripe.balance.retrieve();
    expect(balance.object).toBe("balance");
    // 10000 captured − 8500 transferred + 500 reversed.
    expect(balance.available.find((b) => b.currency === "gbp")?.amount).toBe(2000);
  });
});

describe("requests", () => {
  it("returns the same object for a repeated Idempotency-Key and refuses the key for other params", async () => {
    const params = { type: "express" as const, country: "US", email: "idem@example.test" };
    const before = (await stripe.accounts.list({ limit: 100 })).data.length;
    const first = await stripe.accounts.create(params, { idempotencyKey: "seller-signup-77" });
    const again = await stripe.accounts.create(params, { idempotencyKey: "seller-signup-77" });
    expect(again.id).toBe(first.id);
    expect((await stripe.accounts.list({ limit: 100 })).data.length).toBe(before + 1);

    const clash = await stripe.accounts.create({ ...params, email: "other@example.test" }, { idempotencyKey: "seller-signup-77" }).catch((e: unknown) => e);
    expect(clash).toBeInstanceOf(Stripe.errors.StripeIdempotencyError);

    const intentParams = { amount: 1500, currency: "usd", allowed_payment_method_types: ["card"] };
    const a = await stripe.paymentIntents.create(intentParams, { idempotencyKey: "booking-rv-9" });
    const b = await stripe.paymentIntents.create(intentParams, { idempotencyKey: "booking-rv-9" });
    expect(b.id).toBe(a.id);
    const created = await stripe.events.list({ type: "payment_intent.created", limit: 100 });
    expect(created.data.filter((e) => (e.data.object as Stripe.PaymentIntent).id === a.id)).toHaveLength(1);
  });

  it("answers 401 for a missing key or one that is not a test secret key", async () => {
    const live = await client("sk_live_not_allowed").accounts.list().catch((e: unknown) => e);
    expect(live).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);
    expect(live).toMatchObject({ statusCode: 401 });
    const publishable = await client("pk_test_not_secret").accounts.list().catch((e: unknown) => e);
    expect(publishable).toBeInstanceOf(Stripe.errors.StripeAuthenticationError);

    const bare = await fetch(`${fake.url}/v1/accounts`);
    expect(bare.status).toBe(401);
    expect(((await bare.json()) as { error: { type: string } }).error.type).toBe("invalid_request_error");
  });

  it("refuses unknown parameters and bad integers with the parameter named", async () => {
    const unknown = await stripe.accounts
      .create({ type: "express", colour: "copper" } as unknown as Stripe.AccountCreateParams)
      .catch((e: unknown) => e);
    expect(unknown).toMatchObject({ statusCode: 400, code: "parameter_unknown", param: "colour" });
    const badInt = await stripe.paymentIntents
      .create({ amount: "12.5" as unknown as number, currency: "usd" })
      .catch((e: unknown) => e);
    expect(badInt).toMatchObject({ statusCode: 400, param: "amount" });
    // payment_method_types gave way to allowed_payment_method_types in this API version
    // (stripe-node CHANGELOG for the 2026-09-30.endive pin).
    const legacy = await stripe.paymentIntents
      .create({ amount: 1500, currency: "usd", payment_method_types: ["card"] } as unknown as Stripe.PaymentIntentCreateParams)
      .catch((e: unknown) => e);
    expect(legacy).toMatchObject({ statusCode: 400, code: "parameter_unknown", param: "payment_method_types" });
  });

  it("pages through events newest first", async () => {
    const page1 = await stripe.events.list({ limit: 2 });
    expect(page1.data).toHaveLength(2);
    expect(page1.has_more).toBe(true);
    const [newer, older] = page1.data;
    expect((newer?.created ?? 0) >= (older?.created ?? 0)).toBe(true);
    const page2 = await stripe.events.list({ limit: 2, starting_after: older?.id });
    expect(page2.data.map((e) => e.id)).not.toContain(older?.id);
    expect(page2.data.map((e) => e.id)).not.toContain(newer?.id);
  });
});
