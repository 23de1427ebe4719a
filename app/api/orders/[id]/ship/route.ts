import { shipOrder } from "@/db/queries/orders";
import { shipOrderSchema } from "@/lib/validations/orders";
import { orderRoute, parseWith } from "../../order-route";

export const dynamic = "force-dynamic";

export const POST = orderRoute(async ({ body, user, params }) => {
  const parsed = parseWith(shipOrderSchema, body);
  if (!parsed.ok) return parsed.response;
  return Response.json({ ok: true, ...(await shipOrder({ orderId: params.id, actorId: user.id, ...parsed.data })) });
}, "ship");
