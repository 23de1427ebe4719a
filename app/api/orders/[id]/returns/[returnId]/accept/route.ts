import { acceptReturn } from "@/db/queries/orders";
import { orderRoute, refundResponse } from "../../../../order-route";

export const dynamic = "force-dynamic";

export const POST = orderRoute(async ({ user, params }) => {
  const result = await acceptReturn({ orderId: params.id, returnId: params.returnId ?? "", actorId: user.id });
  return refundResponse(result.refunds, { accepted: true });
}, "returns/accept");
