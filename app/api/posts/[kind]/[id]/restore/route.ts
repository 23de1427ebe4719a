import { moderatePost } from "@/lib/qa/moderation";
import { qaPostRoute } from "@/lib/qa/respond";

export const dynamic = "force-dynamic";

/** POST /api/posts/[kind]/[id]/restore (kind: question | answer), moderators only. */
export const POST = qaPostRoute<{ kind: string; id: string }>("restore", (user, { kind, id }, body) => moderatePost(user, kind, id, "restore", body), {
  roles: ["moderator"],
});
