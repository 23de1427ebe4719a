import "server-only";
import { guardRoute } from "@/lib/auth/guard";
import { jsonError } from "@/lib/http/json";
import { readOptionalJson } from "@/lib/http/json";
import { moderateListing, outcomeResponse, type ModeratorAction } from "./listing-actions";

/** POST /api/moderation/listings/[id]/<action>: 401/403 from the session guard, then 404/409/422 from the transition. */
export function listingActionRoute(action: ModeratorAction) {
  return guardRoute<{ id: string }>(["moderator"], async (request, user, { params }) => {
    const { id } = await params;
    const read = await readOptionalJson(request);
    if (!read.ok) return read.response;
    try {
      return outcomeResponse(await moderateListing(user, id, action, read.body));
    } catch (error) {
      console.error(`[moderation/${action}]`, error);
      return jsonError(500, "internal_error", "Something went wrong on our side. Please try again.");
    }
  });
}
