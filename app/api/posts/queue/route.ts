import { postQueue } from "@/db/queries/qa";
import { guardRoute } from "@/lib/auth/guard";
import { jsonError } from "@/lib/http/json";

export const dynamic = "force-dynamic";

/** GET /api/posts/queue → { pending, flagged } (moderators and admins): posts waiting in pre-moderation, and hidden or flagged ones. */
export const GET = guardRoute(["moderator"], async () => {
  try {
    return Response.json(await postQueue(), { headers: { "cache-control": "no-store" } });
  } catch (error) {
    console.error("[qa/queue]", error);
    return jsonError(500, "internal_error", "The queue could not be read just now. It will try again.");
  }
});
