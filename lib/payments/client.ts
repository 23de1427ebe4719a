import "server-only";
import Stripe from "stripe";
import { env } from "@/lib/env";

/** How the SDK reaches the provider: the hosted API, or a local stand-in named by STRIPE_API_URL. */
export function stripeConfig(apiUrl: string | undefined): Stripe.StripeConfig {
  // One retry rides over a dropped connection; the 10 s timeout keeps a seller's click from hanging.
  const common: Stripe.StripeConfig = { maxNetworkRetries: 1, timeout: 10_000 };
  if (!apiUrl) return common;
  const url = new URL(apiUrl);
  const protocol = url.protocol === "http:" ? "http" : "https";
  const port = url.port === "" ? (protocol === "http" ? 80 : 443) : Number(url.port);
  return { ...common, host: url.hostname, port, protocol };
}

let client: Stripe | undefined;

/** The one payments client of the process. */
export function payments(): Stripe {
  const { STRIPE_SECRET_KEY, STRIPE_API_URL } = env();
  client ??= new Stripe(STRIPE_SECRET_KEY, stripeConfig(STRIPE_API_URL));
  return client;
}

/** Tests point STRIPE_API_URL at a fake started in-test; the app never calls this. */
export function _resetPaymentsClientForTests(): void {
  client = undefined;
}
