import { moderatePost } from "@/lib/qa/moderation";
import { qaPostRoute } from "@/lib/qa/respond";
import { revalidatePostListingPage } from "@/lib/listings/listing-pages";

export const dynamic = "force-dynamic";

/** POST /api/posts/[kind]/[id]/restore (kind: question | answer), moderators only. */
export const POST = qaPostRoute<{ kind: string; id: string }>(
  "restore",
  async (user, { kind, id }, body) => {
    const outcome = await moderatePost(user, kind, id, "restore", body);
    if (outcome.ok) await revalidatePostListingPage("question", outcome.questionId);
    return outcome;
  },
  {
    roles: ["moderator"],
  },
);
