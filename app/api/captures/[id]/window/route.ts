import { captureForViewer } from "@/db/queries/captures";
import { getSessionUser } from "@/lib/auth/guard";
import { captureWindow } from "@/lib/captures/window";
import { clampWindow, parseWindowQuery } from "@/lib/captures/window-params";
import { invalidInput, jsonError } from "@/lib/http/json";

export const dynamic = "force-dynamic";

/**
 * GET /api/captures/[id]/window?from=&to=&points=&channel= → the trace of the window [from, to]
 * (seconds; each defaults to the capture's end), downsampled with LTTB to at most `points` per
 * channel (default 1200), for one channel or all. 422 on bad parameters or a window outside the
 * capture, 409 while the capture is not measured, 404 for a capture the viewer may not read.
 */
export async function GET(request: Request, { params }: { params: Promise<{ id: string }> }): Promise<Response> {
  const { id } = await params;
  const parsed = parseWindowQuery(new URL(request.url).searchParams);
  if (!parsed.ok) return invalidInput("The window's parameters are not valid.", parsed.fieldErrors);
  const { query } = parsed;
  try {
    const detail = await captureForViewer(await getSessionUser(), id);
    if (!detail) return jsonError(404, "not_found", "There is no such capture, or it is not shared with you.");
    const { capture } = detail;
    if (capture.state !== "measured" || capture.startTimeS === null || capture.endTimeS === null) {
      return jsonError(409, "not_measured", "The capture is not measured yet.");
    }
    if (query.channel !== undefined && !detail.channels.some((c) => c.index === query.channel)) {
      return invalidInput("The capture has no such channel.", { channel: [`Use a channel from 0 to ${detail.channels.length - 1}.`] });
    }
    const window = clampWindow(query, { from: capture.startTimeS, to: capture.endTimeS });
    if (!window) {
      return invalidInput("The window lies outside the capture.", { from: [`The capture runs from ${capture.startTimeS} s to ${capture.endTimeS} s.`] });
    }
    const body = await captureWindow(detail, window, query.points, query.channel);
    // A measured capture's samples never change; a short private cache spares a re-read when panning back.
    return Response.json(body, { headers: { "cache-control": "private, max-age=60" } });
  } catch (error) {
    console.error("[captures/window]", error);
    return jsonError(500, "internal_error", "The capture's trace could not be read just now.");
  }
}
