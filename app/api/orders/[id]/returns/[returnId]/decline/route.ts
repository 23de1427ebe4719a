import { declineReturn } from "@/db/queries/orders";
import { declineReturnSchema } from "@/lib/validations/orders";
import { orderRoute, parseWith } from "../../../../order-route";

export const dynamic = "force-dynamic";

export const POST = orderRoute(async ({ body, user, params }) => {
  const parsed = parseWith(declineReturnSchema, body);
  if (!parsed.ok) return parsed.response;
  await declineReturn({ orderId: params.id, returnId: params.returnId ?? "", actorId: user.id, reason: parsed.data.reason });
  return Response.json({ ok: true });
}, "returns/decline");
