import { captureForViewer } from "@/db/queries/captures";
import { getSessionUser } from "@/lib/auth/guard";
import { captureStatusView } from "@/lib/captures/status-view";
import { jsonError } from "@/lib/http/json";

export const dynamic = "force-dynamic";

/**
 * GET /api/captures/[id] → the capture's state, progress, error, figures per channel and the
 * proposed reading value; the capture card polls it while the capture is being measured. Readable
 * by whoever may read the capture's log; 404 for everyone else, as for a missing capture.
 */
export async function GET(_request: Request, { params }: { params: Promise<{ id: string }> }): Promise<Response> {
  const { id } = await params;
  try {
    const detail = await captureForViewer(await getSessionUser(), id);
    if (!detail) return jsonError(404, "not_found", "There is no such capture, or it is not shared with you.");
    return Response.json(captureStatusView(detail), { headers: { "cache-control": "private, no-store" } });
  } catch (error) {
    console.error("[captures/status]", error);
    return jsonError(500, "internal_error", "The capture could not be read just now.");
  }
}
