// The payout connect flow through the real `stripe` SDK against the payments fake started here
// on a free port: a connected account and an onboarding link, the fake's hosted page, the status
// read back; and a clear error, not a hang, when the provider is down. Shapes: the SDK's own types
// (node_modules/stripe/esm/resources/Accounts.d.ts, AccountLinks.d.ts).
import Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startPaymentsFake, type PaymentsFake } from "@/fakes/payments/server";
import { addShop, setupSellingDb, type SellingDb } from "./setup";

let t: SellingDb;
let fake: PaymentsFake;
let direct: Stripe;
const SELLER = { id: "demo-seller-kits", email: "bram.kits@larkspur.test" };

beforeAll(async () => {
  t = await setupSellingDb("selling_payouts");
  fake = await startPaymentsFake({ port: 0, log: () => {} });
  process.env.STRIPE_API_URL = fake.url;
  process.env.APP_URL = "http://localhost:3999";
  const { _resetEnvForTests } = await import("@/lib/env");
  _resetEnvForTests();
  const { _resetPaymentsClientForTests } = await import("@/lib/payments/client");
  _resetPaymentsClientForTests();
  const { hostname, port } = new URL(fake.url);
  direct = new Stripe("sk_test_direct", { host: hostname, port: Number(port), protocol: "http", maxNetworkRetries: 0 });
});

afterAll(async () => {
  await fake?.close();
  await t?.teardown();
});

async function profileRow() {
  const { rows } = await t.pool.query("select payout_account_id, charges_enabled, payouts_enabled from seller_profiles where user_id = $1", [SELLER.id]);
  return rows[0];
}

describe("connecting a payout account", () => {
  it("needs a shop first", async () => {
    const { startPayoutOnboarding, PayoutSetupError } = await import("@/lib/payments/connect");
    await expect(startPayoutOnboarding({ id: "demo-builder", email: "noor.builds@larkspur.test" })).rejects.toBeInstanceOf(PayoutSetupError);
  });

  it("creates one express account, links to the fake's onboarding page, and reads back the enabled status", async () => {
    const { startPayoutOnboarding, refreshPayoutStatus } = await import("@/lib/payments/connect");
    await addShop(t.pool, SELLER.id, "Oyelaran Boards", false);

    const url = await startPayoutOnboarding(SELLER);
    expect(url.startsWith(`${fake.url}/onboarding/`)).toBe(true);
    const { payout_account_id: accountId } = await profileRow();
    expect(accountId).toMatch(/^acct_/);
    const account = await direct.accounts.retrieve(accountId);
    expect(account).toMatchObject({ type: "express", country: "NL", email: SELLER.email, metadata: { userId: SELLER.id } });

    // A second click reuses the account and only makes a new link.
    const again = await startPayoutOnboarding(SELLER);
    expect(again).not.toBe(url);
    expect((await profileRow()).payout_account_id).toBe(accountId);
    expect((await direct.accounts.list({ limit: 100 })).data.filter((a) => a.metadata?.userId === SELLER.id)).toHaveLength(1);

    expect(await refreshPayoutStatus(SELLER.id)).toEqual({ payoutAccountId: accountId, chargesEnabled: false, payoutsEnabled: false });

    // The seller finishes the hosted page, which sends them back to the app's return route.
    const page = await fetch(again);
    expect(await page.text()).toContain("Finish test onboarding");
    const finish = await fetch(again, { method: "POST", body: new URLSearchParams({ business_name: "Oyelaran Boards" }), redirect: "manual" });
    expect(finish.status).toBe(303);
    expect(finish.headers.get("location")).toBe("http://localhost:3999/sell/payouts/return");

    expect(await refreshPayoutStatus(SELLER.id)).toEqual({ payoutAccountId: accountId, chargesEnabled: true, payoutsEnabled: true });
    expect(await profileRow()).toEqual({ payout_account_id: accountId, charges_enabled: true, payouts_enabled: true });
  });

  it("says the provider is not answering, promptly, when it is down — and changes nothing", async () => {
    const { startPayoutOnboarding, refreshPayoutStatus, PaymentsUnavailableError, PAYMENTS_UNAVAILABLE_MESSAGE } = await import("@/lib/payments/connect");
    const before = await profileRow();
    await fetch(`${fake.url}/api/test/fail-mode`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ down: true }) });
    try {
      const started = Date.now();
      const error = await startPayoutOnboarding(SELLER).catch((e: unknown) => e);
      expect(error).toBeInstanceOf(PaymentsUnavailableError);
      expect((error as Error).message).toBe(PAYMENTS_UNAVAILABLE_MESSAGE);
      await expect(refreshPayoutStatus(SELLER.id)).rejects.toBeInstanceOf(PaymentsUnavailableError);
      // One retry with the SDK's back-off, well inside the 10 s timeout.
      expect(Date.now() - started).toBeLessThan(10_000);
      expect(await profileRow()).toEqual(before);
    } finally {
      await fetch(`${fake.url}/api/test/fail-mode`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ down: false }) });
    }
  });

  it("says the same when nothing listens at the provider's address at all", async () => {
    const { _resetEnvForTests } = await import("@/lib/env");
    const { _resetPaymentsClientForTests } = await import("@/lib/payments/client");
    const { refreshPayoutStatus, PaymentsUnavailableError } = await import("@/lib/payments/connect");
    const saved = process.env.STRIPE_API_URL;
    process.env.STRIPE_API_URL = "http://127.0.0.1:1";
    _resetEnvForTests();
    _resetPaymentsClientForTests();
    try {
      await expect(refreshPayoutStatus(SELLER.id)).rejects.toBeInstanceOf(PaymentsUnavailableError);
    } finally {
      process.env.STRIPE_API_URL = saved;
      _resetEnvForTests();
      _resetPaymentsClientForTests();
    }
  });
});
