import { listQuestions } from "@/db/queries/qa";
import { getSessionUser } from "@/lib/auth/guard";
import { jsonError } from "@/lib/http/json";
import { askQuestion } from "@/lib/qa/posting";
import { qaPostRoute } from "@/lib/qa/respond";
import { questionFiltersSchema } from "@/lib/validations/qa";

export const dynamic = "force-dynamic";

/** GET /api/questions?listing=<id>&show=newest|unanswered&page=N → { questions, hasMore }; visitors see visible questions. */
export async function GET(request: Request): Promise<Response> {
  const params = Object.fromEntries(new URL(request.url).searchParams);
  const filters = questionFiltersSchema.parse(params);
  try {
    const viewer = await getSessionUser();
    const { rows, hasMore } = await listQuestions(viewer, { listingId: filters.listing, unanswered: filters.show === "unanswered", page: filters.page });
    return Response.json({ questions: rows, hasMore }, { headers: { "cache-control": "no-store" } });
  } catch (error) {
    console.error("[qa/list]", error);
    return jsonError(500, "internal_error", "The questions could not be read just now.");
  }
}

/** POST /api/questions { title, bodyMd, listingId?, logId?, photos? } → 201 { id, state } (state "pending" while it waits for a moderator). */
export const POST = qaPostRoute("ask", (user, _params, body) => askQuestion(user, body), { successStatus: 201 });
