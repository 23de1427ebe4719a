import { reviewQueue } from "@/db/queries/moderation";
import { guardRoute } from "@/lib/auth/guard";
import { jsonError } from "@/lib/http/json";

export const dynamic = "force-dynamic";

/** GET /api/moderation/queue → { listings: QueueRow[] }, oldest submission first (moderators and admins). */
export const GET = guardRoute(["moderator"], async () => {
  try {
    return Response.json({ listings: await reviewQueue() }, { headers: { "cache-control": "no-store" } });
  } catch (error) {
    console.error("[moderation/queue]", error);
    return jsonError(500, "internal_error", "The queue could not be read just now. It will try again.");
  }
});
