import { qaPostRoute } from "@/lib/qa/respond";
import { acceptAnswer } from "@/lib/qa/votes";

export const dynamic = "force-dynamic";

/** POST /api/questions/[id]/accept { answerId | null } → { acceptedAnswerId }; only the asker (403 otherwise). */
export const POST = qaPostRoute<{ id: string }>("accept", (user, { id }, body) => acceptAnswer(user, id, body));
