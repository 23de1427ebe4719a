import { answerQuestion } from "@/lib/qa/posting";
import { qaPostRoute } from "@/lib/qa/respond";
import { revalidatePostListingPage } from "@/lib/listings/listing-pages";

export const dynamic = "force-dynamic";

/** POST /api/questions/[id]/answers { bodyMd, photos? } → 201 { id, state }. */
export const POST = qaPostRoute<{ id: string }>(
  "answer",
  async (user, { id }, body) => {
    const outcome = await answerQuestion(user, id, body);
    if (outcome.ok && outcome.state === "visible") await revalidatePostListingPage("question", id);
    return outcome;
  },
  { successStatus: 201 },
);
