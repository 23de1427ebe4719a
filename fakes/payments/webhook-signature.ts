import { createHmac } from "node:crypto";

/**
 * The provider's webhook signature: `t=<unix seconds>,v1=<hex HMAC-SHA256 of "t.payload">`
 * keyed with the endpoint secret, which `stripe.webhooks.constructEvent` verifies.
 */
export function signWebhookPayload(payload: string, secret: string, timestamp: number): string {
  const signature = createHmac("sha256", secret).update(`${timestamp}.${payload}`, "utf8").digest("hex");
  return `t=${timestamp},v1=${signature}`;
}
