import { cancelOrderAndRefresh } from "@/lib/orders/cancel";
import { orderRoute, refundResponse } from "../../order-route";

export const dynamic = "force-dynamic";

export const POST = orderRoute(async ({ user, params }) => {
  const result = await cancelOrderAndRefresh({ orderId: params.id, actorId: user.id });
  // The order is cancelled whatever the payment service said; the status tells how the refunds went.
  return refundResponse(result.refunds, { from: result.from, to: result.to });
}, "cancel");
