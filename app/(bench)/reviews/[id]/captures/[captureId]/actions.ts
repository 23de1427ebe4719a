"use server";

import { revalidatePath } from "next/cache";
import { formatTime } from "@/components/captures/format";
import { addPin } from "@/db/queries/captures";
import { requireUser } from "@/lib/auth/guard";
import { benchFailure, invalidForm } from "@/lib/bench/action-failure";
import type { CaptureActionResult } from "@/lib/captures/action-schemas";
import { pinSchema } from "@/lib/captures/pin-schema";

/** The reviewer pins a comment to a time on a capture of the log under review; the query checks the session again. */
export async function addPinAction(sessionId: string, raw: unknown): Promise<CaptureActionResult> {
  let message: string;
  let captureId: string;
  try {
    const user = await requireUser();
    const parsed = pinSchema.safeParse(raw);
    if (!parsed.success) return invalidForm(parsed.error);
    captureId = parsed.data.captureId;
    await addPin(user, sessionId, parsed.data);
    message = `Comment pinned at ${formatTime(parsed.data.time, 5)}. The builder sees it on the trace.`;
  } catch (error) {
    return benchFailure(error, "pin-capture");
  }
  revalidatePath(`/reviews/${sessionId}/captures/${captureId}`);
  revalidatePath(`/bench/captures/${captureId}`);
  return { ok: true, message };
}
