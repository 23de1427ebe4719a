import { answersForViewer, getQuestionForViewer } from "@/db/queries/qa";
import { getSessionUser } from "@/lib/auth/guard";
import { jsonError } from "@/lib/http/json";
import { orderAnswers } from "@/lib/qa/rules";

export const dynamic = "force-dynamic";

/** GET /api/questions/[id] → { question, answers } (accepted first, then by score); 404 when the viewer may not see it. */
export async function GET(_request: Request, { params }: { params: Promise<{ id: string }> }): Promise<Response> {
  const { id } = await params;
  try {
    const viewer = await getSessionUser();
    const question = await getQuestionForViewer(viewer, id);
    if (!question) return jsonError(404, "not_found", "No such question.");
    const answers = orderAnswers(await answersForViewer(viewer, question), question.acceptedAnswerId);
    return Response.json({ question, answers }, { headers: { "cache-control": "no-store" } });
  } catch (error) {
    console.error("[qa/question]", error);
    return jsonError(500, "internal_error", "The question could not be read just now.");
  }
}
