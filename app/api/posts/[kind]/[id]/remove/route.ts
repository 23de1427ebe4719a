import { moderatePost } from "@/lib/qa/moderation";
import { qaPostRoute } from "@/lib/qa/respond";

export const dynamic = "force-dynamic";

/** POST /api/posts/[kind]/[id]/remove { reason } (kind: question | answer), moderators only; the author is e-mailed the reason. */
export const POST = qaPostRoute<{ kind: string; id: string }>("remove", (user, { kind, id }, body) => moderatePost(user, kind, id, "remove", body), {
  roles: ["moderator"],
});
