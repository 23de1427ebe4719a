import { answerQuestion } from "@/lib/qa/posting";
import { qaPostRoute } from "@/lib/qa/respond";

export const dynamic = "force-dynamic";

/** POST /api/questions/[id]/answers { bodyMd, photos? } → 201 { id, state }. */
export const POST = qaPostRoute<{ id: string }>("answer", (user, { id }, body) => answerQuestion(user, id, body), { successStatus: 201 });
