import { handlePaymentsWebhook } from "@/lib/payments/webhooks";

// The raw body is read as text and verified before anything else happens.
export const dynamic = "force-dynamic";

export async function POST(request: Request): Promise<Response> {
  return handlePaymentsWebhook(request);
}
