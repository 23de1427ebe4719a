import { jsonError } from "@/lib/http/json";
import { qaPostRoute } from "@/lib/qa/respond";
import { voteOnAnswer } from "@/lib/qa/votes";

export const dynamic = "force-dynamic";

const vote = qaPostRoute<{ kind: string; id: string }>("vote", (user, { id }, body) => voteOnAnswer(user, id, body));

/** POST /api/posts/answer/[id]/vote { value: 1 | -1 | 0 } → { score, vote }; questions take no votes (404). */
export async function POST(request: Request, context: { params: Promise<{ kind: string; id: string }> }): Promise<Response> {
  if ((await context.params).kind !== "answer") return jsonError(404, "not_found", "Only answers take votes.");
  return vote(request, context);
}
