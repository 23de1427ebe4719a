import { refundCurrencyFor, refundLine } from "@/db/queries/orders";
import { lineRefundSchema } from "@/lib/validations/orders";
import { orderRoute, parseWith, refundResponse } from "../../order-route";

export const dynamic = "force-dynamic";

/** POST { lineId, amount: "12.50", reason } — a refund of part of a line, amount in the order's major units. */
export const POST = orderRoute(async ({ body, user, params }) => {
  const parsed = parseWith(lineRefundSchema(await refundCurrencyFor(params.id, user.id)), body);
  if (!parsed.ok) return parsed.response;
  const outcome = await refundLine({ orderId: params.id, lineId: parsed.data.lineId, actorId: user.id, amountMinor: parsed.data.amount, reason: parsed.data.reason });
  return refundResponse([outcome]);
}, "refunds");
