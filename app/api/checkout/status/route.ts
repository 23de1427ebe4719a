import { buyerCheckoutBySession } from "@/db/queries/checkout";
import { guardRoute } from "@/lib/auth/guard";
import { fieldErrorsFromZod, jsonError } from "@/lib/http/json";
import { checkoutStatusQuerySchema } from "@/lib/validations/checkout";

export const dynamic = "force-dynamic";

/** `GET /api/checkout/status?session=` — the buyer's own checkout: its status and orders. */
export const GET = guardRoute(undefined, async (request, user) => {
  const parsed = checkoutStatusQuerySchema.safeParse({ session: new URL(request.url).searchParams.get("session") ?? undefined });
  if (!parsed.success) return jsonError(422, "invalid_input", "Name the payment session.", fieldErrorsFromZod(parsed.error));
  const checkout = await buyerCheckoutBySession(parsed.data.session, user.id);
  if (!checkout) return jsonError(404, "not_found", "No checkout of yours has this session.");
  return Response.json(checkout, { headers: { "Cache-Control": "no-store" } });
});
