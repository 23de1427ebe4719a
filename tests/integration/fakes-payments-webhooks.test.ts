// Webhook delivery, outages and restarts of the local payments fake.
// Signatures are checked with the SDK's `webhooks.constructEvent` (stripe@23.1.0), the
// reference implementation of the provider's signing scheme; the SDK's retry rules
// come from its RequestSender.js (_shouldRetry, _getSleepTimeInMS).
import http from "node:http";
import net from "node:net";
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import Stripe from "stripe";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { startPaymentsFake, type PaymentsFake } from "@/fakes/payments/server";
import { startWebhookReceiver, type WebhookReceiver } from "@/fakes/payments/testing/webhook-receiver";

const SECRET = "whsec_fluxyard_integration_webhooks";
const RETRY_BASE_MS = 100;

let fake: PaymentsFake;
let receiver: WebhookReceiver;
let stripe: Stripe;
const extraFakes: PaymentsFake[] = [];
const tempDirs: string[] = [];

// maxNetworkRetries 0: failures surface at once instead of after the SDK's retries.
function clientFor(target: PaymentsFake): Stripe {
  const { hostname, port } = new URL(target.url);
  return new Stripe("sk_test_fluxyard_webhooks", { host: hostname, port: Number(port), protocol: "http", maxNetworkRetries: 0 });
}

async function hook(target: PaymentsFake, path: string, body?: unknown): Promise<{ status: number; json: Record<string, any> }> {
  const res = await fetch(`${target.url}/api/test${path}`, {
    method: body === undefined ? "GET" : "POST",
    headers: { "Content-Type": "application/json" },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
  return { status: res.status, json: (await res.json()) as Record<string, any> };
}

function eventIdOf(body: string): string {
  return (JSON.parse(body) as { id: string }).id;
}

async function newIntent(client: Stripe, amount = 2000): Promise<Stripe.PaymentIntent> {
  return client.paymentIntents.create({ amount, currency: "eur", allowed_payment_method_types: ["card"] });
}

beforeAll(async () => {
  receiver = await startWebhookReceiver();
  fake = await startPaymentsFake({
    port: 0,
    webhooks: [{ url: receiver.url, secret: SECRET }],
    webhookRetryBaseMs: RETRY_BASE_MS,
    log: () => {},
  });
  stripe = clientFor(fake);
});

afterEach(async () => {
  await hook(fake, "/fail-mode", { down: false });
});

afterAll(async () => {
  await fake?.close();
  for (const extra of extraFakes) await extra.close();
  await receiver?.close();
  for (const dir of tempDirs) rmSync(dir, { recursive: true, force: true });
});

describe("webhook delivery", () => {
  it("retries with doubling delays after a receiver fails twice", async () => {
    const start = receiver.received.length;
    receiver.failNext(2, 500);
    const intent = await newIntent(stripe);
    const created = (await stripe.events.list({ type: "payment_intent.created", limit: 1 })).data[0];
    expect((created?.data.object as Stripe.PaymentIntent).id).toBe(intent.id);
    const eventId = created?.id ?? "";

    await receiver.waitFor((all) => all.slice(start).filter((r) => eventIdOf(r.body) === eventId).length === 3);
    const attempts = receiver.received.slice(start).filter((r) => eventIdOf(r.body) === eventId);
    expect(attempts.map((a) => a.answeredWith)).toEqual([500, 500, 200]);
    // Back-off: base, then twice the base (a few ms of slack for timer granularity).
    const [a, b, c] = attempts.map((x) => x.receivedAt);
    expect((b ?? 0) - (a ?? 0)).toBeGreaterThanOrEqual(RETRY_BASE_MS - 5);
    expect((c ?? 0) - (b ?? 0)).toBeGreaterThanOrEqual(2 * RETRY_BASE_MS - 5);
    // Each attempt is signed afresh and verifies.
    for (const attempt of attempts) {
      expect(stripe.webhooks.constructEvent(attempt.body, attempt.signature ?? "", SECRET).id).toBe(eventId);
    }

    const { json } = await hook(fake, `/deliveries?event_id=${eventId}`);
    expect(json.deliveries).toHaveLength(1);
    expect(json.deliveries[0]).toMatchObject({ status: "succeeded", attempts: 3, last_status_code: 200 });
    expect(json.deliveries[0].history.map((h: { status_code: number }) => h.status_code)).toEqual([500, 500, 200]);
    // Once delivered to its only endpoint, nothing is pending for the event.
    expect((await stripe.events.retrieve(eventId)).pending_webhooks).toBe(0);
  });

  it("delivers in order of creation even while an earlier event is being retried", async () => {
    const start = receiver.received.length;
    receiver.failNext(1, 503);
    const intents: Stripe.PaymentIntent[] = [];
    for (let i = 0; i < 4; i += 1) intents.push(await newIntent(stripe, 1000 + i));
    const ids = intents.map((i) => i.id);
    await receiver.waitFor((all) => all.slice(start).filter((r) => r.answeredWith === 200).length >= 4);
    const delivered = receiver.received
      .slice(start)
      .filter((r) => r.answeredWith === 200)
      .map((r) => (stripe.webhooks.constructEvent(r.body, r.signature ?? "", SECRET).data.object as { id: string }).id);
    expect(delivered).toEqual(ids);
  });

  it("gives up after the configured attempts when the endpoint refuses connections", async () => {
    // A port that was free a moment ago and is closed now refuses the connection.
    const probe = http.createServer();
    await new Promise<void>((resolve) => probe.listen(0, "127.0.0.1", resolve));
    const port = (probe.address() as { port: number }).port;
    await new Promise<void>((resolve) => probe.close(() => resolve()));

    const lonely = await startPaymentsFake({
      port: 0,
      webhooks: [{ url: `http://127.0.0.1:${port}/gone`, secret: SECRET }],
      webhookRetryBaseMs: 10,
      webhookMaxAttempts: 3,
      log: () => {},
    });
    extraFakes.push(lonely);
    await newIntent(clientFor(lonely));
    let deliveries: any[] = [];
    for (let i = 0; i < 200 && deliveries[0]?.status !== "failed"; i += 1) {
      deliveries = (await hook(lonely, "/deliveries")).json.deliveries;
      await new Promise((resolve) => setTimeout(resolve, 10));
    }
    expect(deliveries[0]).toMatchObject({ status: "failed", attempts: 3, last_status_code: null });
    expect(deliveries[0].last_error).toBeTruthy();
  });

  it("replays an event on request and delivers to endpoints added at runtime", async () => {
    const second = await startWebhookReceiver();
    try {
      const added = await hook(fake, "/webhooks", { url: second.url, secret: "whsec_second_endpoint" });
      expect(added.json.endpoints.map((e: { url: string }) => e.url)).toContain(second.url);

      const intent = await newIntent(stripe, 3300);
      await second.waitFor((all) => all.length >= 1);
      const first = second.received[0];
      const event = stripe.webhooks.constructEvent(first?.body ?? "", first?.signature ?? "", "whsec_second_endpoint");
      expect((event.data.object as Stripe.PaymentIntent).id).toBe(intent.id);
      // The secret of one endpoint must not verify another's deliveries.
      expect(() => stripe.webhooks.constructEvent(first?.body ?? "", first?.signature ?? "", SECRET)).toThrow();

      const replay = await hook(fake, `/resend/${event.id}`, { url: second.url });
      expect(replay.json.deliveries).toHaveLength(1);
      await second.waitFor((all) => all.filter((r) => eventIdOf(r.body) === event.id).length === 2);
      const again = second.received.filter((r) => eventIdOf(r.body) === event.id)[1];
      expect(stripe.webhooks.constructEvent(again?.body ?? "", again?.signature ?? "", "whsec_second_endpoint").id).toBe(event.id);
    } finally {
      await second.close();
    }
  });
});

describe("simulated outage", () => {
  it("answers 503 while down, which the SDK raises as StripeAPIError", async () => {
    expect((await hook(fake, "/fail-mode", { down: true })).json.down).toBe(true);
    const error = await stripe.accounts.list().catch((e: unknown) => e);
    expect(error).toBeInstanceOf(Stripe.errors.StripeAPIError);
    expect(error).toMatchObject({ statusCode: 503, type: "StripeAPIError" });
    expect((await fetch(`${fake.url}/api/health`)).status).toBe(503);

    await hook(fake, "/fail-mode", { down: false });
    expect((await stripe.accounts.list()).object).toBe("list");
  });

  it("is retried by the SDK's default policy before the error surfaces", async () => {
    await hook(fake, "/fail-mode", { down: true });
    // Default maxNetworkRetries is 2 (PlatformFunctions.getDefaultMaxNetworkRetries), and
    // 5xx answers are retried (_shouldRetry): one request plus two retries.
    const { hostname, port } = new URL(fake.url);
    const defaults = new Stripe("sk_test_fluxyard_webhooks", { host: hostname, port: Number(port), protocol: "http" });
    let attempts = 0;
    defaults.on("request", () => {
      attempts += 1;
    });
    const error = await defaults.balance.retrieve().catch((e: unknown) => e);
    expect(error).toBeInstanceOf(Stripe.errors.StripeAPIError);
    expect(attempts).toBe(3);
  });
});

describe("restarts and shutdown", () => {
  it("keeps accounts, sessions, events and idempotency keys in the store file across a restart", async () => {
    const dir = mkdtempSync(join(tmpdir(), "fluxyard-payments-"));
    tempDirs.push(dir);
    const storeFile = join(dir, "payments.json");
    const first = await startPaymentsFake({ port: 0, storeFile, log: () => {} });
    const firstClient = clientFor(first);
    const account = await firstClient.accounts.create({ type: "express", country: "US", email: "keeps@example.test" });
    const session = await firstClient.checkout.sessions.create({
      mode: "payment",
      line_items: [{ price_data: { currency: "usd", unit_amount: 1999, product_data: { name: "Gate-drive board" } }, quantity: 1 }],
      success_url: "http://localhost:3000/done",
    });
    const keyed = await firstClient.paymentIntents.create(
      { amount: 1200, currency: "usd", allowed_payment_method_types: ["card"] },
      { idempotencyKey: "restart-key-1" },
    );
    await first.close();

    const second = await startPaymentsFake({ port: 0, storeFile, log: () => {} });
    extraFakes.push(second);
    const secondClient = clientFor(second);
    expect((await secondClient.accounts.retrieve(account.id)).email).toBe("keeps@example.test");
    expect((await secondClient.checkout.sessions.retrieve(session.id)).amount_total).toBe(1999);
    const events = await secondClient.events.list({ type: "payment_intent.created" });
    expect(events.data.map((e) => (e.data.object as Stripe.PaymentIntent).id)).toContain(keyed.id);
    const replayed = await secondClient.paymentIntents.create(
      { amount: 1200, currency: "usd", allowed_payment_method_types: ["card"] },
      { idempotencyKey: "restart-key-1" },
    );
    expect(replayed.id).toBe(keyed.id);
  });

  it("closes promptly even with a request still half sent", async () => {
    const target = await startPaymentsFake({ port: 0, log: () => {} });
    const { port } = new URL(target.url);
    // Headers promise 100 bytes of body and only 10 arrive: the connection stays busy,
    // so server.close() alone would wait for it (Node's requestTimeout is 300 s).
    const socket = net.connect(Number(port), "127.0.0.1");
    socket.on("error", () => {});
    await new Promise<void>((resolve) => socket.once("connect", () => resolve()));
    socket.write("POST /v1/accounts HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Length: 100\r\n\r\ntype=expre");
    const ended = new Promise<void>((resolve) => socket.once("close", () => resolve()));
    await new Promise((resolve) => setTimeout(resolve, 50));
    const started = Date.now();
    await target.close();
    await ended;
    expect(Date.now() - started).toBeLessThan(1000);
  });
});
