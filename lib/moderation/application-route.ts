import "server-only";
import { ApplicationError, approveApplication, declineApplication } from "@/db/queries/seller-applications";
import { guardRoute } from "@/lib/auth/guard";
import { fieldErrorsFromZod, jsonError } from "@/lib/http/json";
import { declineApplicationSchema } from "@/lib/validations/moderation";
import { readOptionalJson } from "@/lib/http/json";

const CODES = { 403: "forbidden", 404: "not_found", 409: "conflict", 422: "invalid_input" } as const;

/** POST /api/moderation/applications/[id]/approve · /decline { reason } (moderators and admins). */
export function applicationDecisionRoute(decision: "approve" | "decline") {
  return guardRoute<{ id: string }>(["moderator"], async (request, user, { params }) => {
    const { id } = await params;
    const read = await readOptionalJson(request);
    if (!read.ok) return read.response;
    try {
      if (decision === "approve") return Response.json({ ok: true, ...(await approveApplication({ actor: user, applicationId: id })) });
      const parsed = declineApplicationSchema.safeParse(read.body);
      if (!parsed.success) return jsonError(422, "invalid_input", "Say why the application is declined.", fieldErrorsFromZod(parsed.error));
      await declineApplication({ actor: user, applicationId: id, reason: parsed.data.reason });
      return Response.json({ ok: true });
    } catch (error) {
      if (error instanceof ApplicationError) return jsonError(error.status, CODES[error.status], error.message);
      console.error(`[moderation/applications/${decision}]`, error);
      return jsonError(500, "internal_error", "Something went wrong on our side. Please try again.");
    }
  });
}
