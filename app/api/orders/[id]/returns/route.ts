import { requestReturn } from "@/db/queries/orders";
import { returnRequestSchema } from "@/lib/validations/orders";
import { orderRoute, parseWith } from "../../order-route";

export const dynamic = "force-dynamic";

/** POST { reason } — the buyer asks to return the order, within the seller's returns window. */
export const POST = orderRoute(async ({ body, user, params }) => {
  const parsed = parseWith(returnRequestSchema, body);
  if (!parsed.ok) return parsed.response;
  return Response.json({ ok: true, ...(await requestReturn({ orderId: params.id, actorId: user.id, reason: parsed.data.reason })) }, { status: 201 });
}, "returns");
