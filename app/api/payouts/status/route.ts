// GET → { payoutAccountId, chargesEnabled, payoutsEnabled }, read fresh from the payment provider; 503 when it does not answer.
import { guardRoute } from "@/lib/auth/guard";
import { jsonError } from "@/lib/http/json";
import { PAYMENTS_UNAVAILABLE_MESSAGE, PaymentsUnavailableError, refreshPayoutStatus } from "@/lib/payments/connect";

export const GET = guardRoute(["seller"], async (_request, user) => {
  try {
    return Response.json(await refreshPayoutStatus(user.id));
  } catch (error) {
    if (error instanceof PaymentsUnavailableError) return jsonError(503, "payments_unavailable", PAYMENTS_UNAVAILABLE_MESSAGE);
    console.error("[api/payouts/status] unexpected error", error);
    return jsonError(500, "internal_error", "Something went wrong on our side. Please try again.");
  }
});
