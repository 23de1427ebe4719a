import { flagPost } from "@/lib/qa/moderation";
import { qaPostRoute } from "@/lib/qa/respond";
import { revalidatePostListingPage } from "@/lib/listings/listing-pages";

export const dynamic = "force-dynamic";

/** POST /api/posts/[kind]/[id]/flag { reason } → { openFlags, hidden }; once per member and post (409), 429 over the flagging limit. */
export const POST = qaPostRoute<{ kind: string; id: string }>(
  "flag",
  async (user, { kind, id }, body) => {
    const outcome = await flagPost(user, kind, id, body);
    if (outcome.ok && outcome.hidden) await revalidatePostListingPage(kind, id);
    return outcome;
  },
  { successStatus: 201 },
);
