// One SDK call, intercepted by msw (2.x, `setupServer` from "msw/node") at the HTTP layer the stripe
// SDK uses: what the checkout asks the provider for. Parameter names follow the provider's API
// reference for `POST /v1/checkout/sessions` and its Idempotency-Key header.
import { http, HttpResponse } from "msw";
import { setupServer } from "msw/node";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";

const API = "http://127.0.0.1:12111";
const captured: { url: string; headers: Headers; body: URLSearchParams }[] = [];
let openPaymentSession: typeof import("@/lib/payments/checkout").openPaymentSession;

const server = setupServer(
  http.post(`${API}/v1/checkout/sessions`, async ({ request }) => {
    captured.push({ url: request.url, headers: request.headers, body: new URLSearchParams(await request.text()) });
    return HttpResponse.json({ id: "cs_test_msw", object: "checkout.session", url: "http://pay.test/pay/cs_test_msw", status: "open" });
  }),
);

beforeAll(async () => {
  process.env.STRIPE_API_URL = API;
  process.env.APP_URL = "http://shop.test";
  const { _resetEnvForTests } = await import("@/lib/env");
  const { _resetPaymentsClientForTests } = await import("@/lib/payments/client");
  _resetEnvForTests();
  _resetPaymentsClientForTests();
  server.listen({ onUnhandledRequest: "error" });
  // The module pulls in the database layer and the mail templates: slow to load on a busy machine.
  ({ openPaymentSession } = await import("@/lib/payments/checkout"));
}, 60_000);
afterEach(() => server.resetHandlers());
afterAll(() => server.close());

describe("openPaymentSession", () => {
  it("sends our re-read prices as price_data lines, our ids, the reservation's expiry and the checkout id as idempotency key", async () => {
    const checkoutId = "6f1d7c1e-2b7a-4c55-9b1e-0c7a5d3e9f10";
    const expiresAt = new Date("2026-11-04T10:31:00.000Z");
    const session = await openPaymentSession({
      checkoutId,
      email: "buyer@example.test",
      currency: "EUR",
      totalMinor: 2 * 12_900 + 4_550,
      expiresAt,
      lines: [
        { listingId: "l1", title: "Half-bridge welder kit", unitPriceMinor: 12_900, quantity: 2, sellerId: "s1", shopName: "Bench Kits" },
        { listingId: "l2", title: "Output choke 40 µH", unitPriceMinor: 4_550, quantity: 1, sellerId: "s2", shopName: "Wound Here" },
      ],
    });
    expect(session.url).toBe("http://pay.test/pay/cs_test_msw");
    expect(captured).toHaveLength(1);
    const { headers, body } = captured[0]!;
    expect(headers.get("idempotency-key")).toBe(checkoutId);
    expect(Object.fromEntries(body)).toMatchObject({
      mode: "payment",
      customer_email: "buyer@example.test",
      client_reference_id: checkoutId,
      "metadata[checkoutId]": checkoutId,
      "line_items[0][quantity]": "2",
      "line_items[0][price_data][currency]": "eur",
      "line_items[0][price_data][unit_amount]": "12900",
      "line_items[0][price_data][product_data][name]": "Half-bridge welder kit",
      "line_items[1][quantity]": "1",
      "line_items[1][price_data][unit_amount]": "4550",
      success_url: "http://shop.test/checkout/done?session={CHECKOUT_SESSION_ID}",
      cancel_url: `http://shop.test/api/checkout/cancel?checkout=${checkoutId}`,
      expires_at: String(expiresAt.getTime() / 1000),
      "payment_intent_data[transfer_group]": checkoutId,
      "payment_intent_data[metadata][checkoutId]": checkoutId,
    });
    // The API version that the SDK pins renamed this parameter; the old name is refused (fakes/payments/README.md).
    expect(body.has("payment_method_types[0]")).toBe(false);
  });
});
