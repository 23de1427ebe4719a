import fc from "fast-check";
import Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { malformedJson, toJsonText, wrongShape } from "./bad-input";
import { callRoute, expectRefusal, fuzz } from "./call-route";
import { changedTables, startFuzzWorld, tableDigest, type FuzzWorld } from "./world";

// The payments webhook is the one JSON route open to anyone; what guards it is the signature
// (Stripe's scheme: `t=<unix time>,v1=<hex HMAC-SHA256 of "t.body">`, a five-minute tolerance, as
// the SDK's constructEvent checks it). Fuzzed here only with requests that must fail that check:
// no header, junk headers, a signature made with another secret, a true signature over another
// body, and a true signature that is an hour old. Each is a 400 with a JSON error, and nothing is
// recorded — not even the event id.

vi.mock("@/lib/jobs/boss", () => ({ sendJob: async () => {} }));

const FILE = "webhooks/payments/route.ts";
const RUNS = 60;

let world: FuzzWorld;
let secret: string;
const sdk = new Stripe("sk_test_signature_fuzz");

beforeAll(async () => {
  world = await startFuzzWorld("fuzz_webhook");
  secret = (await import("@/lib/env")).env().STRIPE_WEBHOOK_SECRET;
});

afterAll(async () => {
  await world?.close();
});

function event(id: string, type: string): string {
  return JSON.stringify({
    id,
    object: "event",
    type,
    created: Math.floor(Date.now() / 1000),
    data: { object: { id: "cs_test_fuzz", object: "checkout.session", payment_status: "paid", metadata: { checkoutId: "00000000-0000-4000-8000-000000000000" } } },
  });
}

const payload = fc.oneof(
  fc.tuple(fc.stringMatching(/^evt_[A-Za-z0-9]{8,24}$/), fc.constantFrom("checkout.session.completed", "checkout.session.expired", "payment_intent.payment_failed", "account.updated")).map(([id, type]) => event(id, type)),
  wrongShape.map(toJsonText),
  malformedJson,
);

type Forgery = { what: string; header: (body: string) => string | undefined; body?: (body: string) => string };

const forgery: fc.Arbitrary<Forgery> = fc.oneof(
  fc.constant<Forgery>({ what: "no header", header: () => undefined }),
  fc.string({ maxLength: 120 }).map((junk): Forgery => ({ what: "a junk header", header: () => junk })),
  fc.stringMatching(/^[0-9a-f]{64}$/).map((hex): Forgery => ({ what: "a random v1", header: () => `t=${Math.floor(Date.now() / 1000)},v1=${hex}` })),
  fc.constant<Forgery>({ what: "a non-numeric time", header: () => "t=now,v1=" + "0".repeat(64) }),
  fc.string({ minLength: 8, maxLength: 40 }).map((other): Forgery => ({
    what: "another secret",
    header: (body) => sdk.webhooks.generateTestHeaderString({ payload: body, secret: `whsec_${other}` }),
  })),
  fc.constant<Forgery>({
    what: "a true signature over another body",
    header: (body) => sdk.webhooks.generateTestHeaderString({ payload: body, secret }),
    body: (body) => body + " ",
  }),
  fc.constant<Forgery>({
    what: "a true signature an hour old",
    header: (body) => sdk.webhooks.generateTestHeaderString({ payload: body, secret, timestamp: Math.floor(Date.now() / 1000) - 3600 }),
  }),
  fc.constant<Forgery>({
    what: "a true signature under the v0 scheme only",
    header: (body) => sdk.webhooks.generateTestHeaderString({ payload: body, secret }).replace("v1=", "v0="),
  }),
);

async function post(body: string, header: string | undefined): Promise<Response> {
  const { routeHandler } = await import("./call-route");
  const handler = await routeHandler(FILE, "POST");
  const headers: Record<string, string> = { "content-type": "application/json" };
  if (header !== undefined) headers["stripe-signature"] = header;
  return handler(new Request("http://localhost:3000/api/webhooks/payments", { method: "POST", headers, body }), { params: Promise.resolve({}) });
}

describe("POST app/api/webhooks/payments with bad signatures", () => {
  it("accepts a correctly signed event (so the refusals below are about the signature)", async () => {
    const body = event("evt_fuzz_control", "account.updated");
    const response = await post(body, sdk.webhooks.generateTestHeaderString({ payload: body, secret }));
    expect(response.status, await response.clone().text()).toBeLessThan(300);
  });

  it("refuses every forged or stale signature with a 400 and records nothing", async () => {
    const baseline = await tableDigest(world.pool);
    await fuzz(
      fc.tuple(payload, forgery),
      async ([body, forged]) => {
        const context = `webhook with ${forged.what}: ${body.slice(0, 120)}`;
        const refusal = await expectRefusal(await post(forged.body?.(body) ?? body, forged.header(body)), context);
        expect(refusal.status, context).toBe(400);
        expect(changedTables(baseline, await tableDigest(world.pool)), `${context} wrote to the database`).toEqual([]);
      },
      RUNS,
    );
  });

  it("refuses a 2 MB body under a forged signature", async () => {
    const body = `{"id":"evt_big","padding":"${"x".repeat(2 * 1024 * 1024)}"}`;
    const refusal = await expectRefusal(await callRoute(FILE, "POST", { body }), "webhook with 2 MB and no signature");
    expect(refusal.status).toBe(400);
    const forged = await expectRefusal(await post(body, sdk.webhooks.generateTestHeaderString({ payload: body, secret: "whsec_not_ours" })), "2 MB, another secret");
    expect(forged.status).toBe(400);
  });
});
