import { flagPost } from "@/lib/qa/moderation";
import { qaPostRoute } from "@/lib/qa/respond";

export const dynamic = "force-dynamic";

/** POST /api/posts/[kind]/[id]/flag { reason } → { openFlags, hidden }; once per member and post (409), 429 over the flagging limit. */
export const POST = qaPostRoute<{ kind: string; id: string }>("flag", (user, { kind, id }, body) => flagPost(user, kind, id, body), { successStatus: 201 });
