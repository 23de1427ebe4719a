import Stripe from "stripe";

// The payments fake of the browser stack (tests/run.ts starts it and passes its address).
export const PAYMENTS_URL = process.env.E2E_PAYMENTS_URL ?? "http://127.0.0.1:4120";

/** The real Stripe SDK, pointed at the payments fake, for tests that set up payments beside the app. */
export function fakePaymentsClient(): Stripe {
  const { hostname, port } = new URL(PAYMENTS_URL);
  return new Stripe("sk_test_local_fake_key", { host: hostname, port: Number(port), protocol: "http", maxNetworkRetries: 0 });
}
