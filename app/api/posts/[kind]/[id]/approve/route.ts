import { moderatePost } from "@/lib/qa/moderation";
import { qaPostRoute } from "@/lib/qa/respond";

export const dynamic = "force-dynamic";

/** POST /api/posts/[kind]/[id]/approve (kind: question | answer), moderators only. */
export const POST = qaPostRoute<{ kind: string; id: string }>("approve", (user, { kind, id }, body) => moderatePost(user, kind, id, "approve", body), {
  roles: ["moderator"],
});
