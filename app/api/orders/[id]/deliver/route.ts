import { markDelivered } from "@/db/queries/orders";
import { orderRoute } from "../../order-route";

export const dynamic = "force-dynamic";

/** The buyer confirms delivery, or the seller marks it; which one is decided by who asks. */
export const POST = orderRoute(async ({ user, params }) => Response.json({ ok: true, ...(await markDelivered({ orderId: params.id, actorId: user.id })) }), "deliver");
