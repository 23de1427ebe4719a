"use server";

import { revalidatePath } from "next/cache";
import { formatReading } from "@/components/bench/format";
import { attachCapture, confirmProposal, removeCapture } from "@/db/queries/captures";
import { requireUser } from "@/lib/auth/guard";
import { benchFailure, invalidForm } from "@/lib/bench/action-failure";
import { attachCaptureSchema, confirmProposalSchema, type CaptureActionResult } from "@/lib/captures/action-schemas";
import { INLINE_MEASURE_BYTES, measureCapture } from "@/lib/captures/measure";
import { sendJob } from "@/lib/jobs/boss";
import { deleteStored } from "@/lib/uploads/store";

// The owner's capture changes on a log page, bound to the log's (or capture's) id; the queries
// check ownership again inside their transactions.

function revalidateLog(logId: string, captureId?: string) {
  revalidatePath("/bench");
  revalidatePath(`/bench/logs/${logId}`);
  if (captureId) revalidatePath(`/bench/captures/${captureId}`);
}

const VERDICT_WORDS = { within: "within the expected range", low: "below the expected range", high: "above the expected range" } as const;

/**
 * Attaches an uploaded capture to a reading and measures it: a small file right here (the answer
 * waits a moment for it), a big one in the background job the card then polls.
 */
export async function attachCaptureAction(logId: string, raw: unknown): Promise<CaptureActionResult> {
  let captureId: string;
  let message: string;
  try {
    const user = await requireUser();
    const parsed = attachCaptureSchema.safeParse(raw);
    if (!parsed.success) return invalidForm(parsed.error);
    const attached = await attachCapture(user, logId, parsed.data);
    captureId = attached.id;
    if (attached.bytes <= INLINE_MEASURE_BYTES) {
      const outcome = await measureCapture(captureId);
      if (outcome === "retry") await sendJob("capture-measure", { captureId }, { singletonKey: captureId });
      message = outcome === "measured" ? "Capture attached and measured." : outcome === "failed" ? "Capture attached, but it could not be measured; its card says why." : "Capture attached; it is being measured.";
    } else {
      await sendJob("capture-measure", { captureId }, { singletonKey: captureId });
      message = "Capture attached; it is large, so it is measured in the background. Its card shows the progress.";
    }
  } catch (error) {
    return benchFailure(error, "attach-capture");
  }
  revalidateLog(logId, captureId);
  return { ok: true, message, captureId };
}

/** Makes the figure the capture proposes (of the chosen channel) the reading's value; the server works the figure out again. */
export async function confirmProposalAction(logId: string, captureId: string, raw: unknown): Promise<CaptureActionResult> {
  let message: string;
  let outsideRange: boolean;
  try {
    const user = await requireUser();
    const parsed = confirmProposalSchema.safeParse(raw);
    if (!parsed.success) return invalidForm(parsed.error);
    const applied = await confirmProposal(user, captureId, parsed.data.channel);
    outsideRange = applied.verdict !== "within";
    const far = applied.farOutside ? ", far outside it: read the caution beside the reading before you go on" : "";
    message = `The reading is now ${formatReading(applied.value, applied.unit)} (${applied.figureLabel.toLowerCase()} of ${applied.channelName}): ${VERDICT_WORDS[applied.verdict]}${far}.`;
  } catch (error) {
    return benchFailure(error, "confirm-capture");
  }
  revalidateLog(logId, captureId);
  return { ok: true, message, outsideRange };
}

/** Removes a capture that is not the reading's evidence, and its stored file. */
export async function removeCaptureAction(logId: string, captureId: string): Promise<CaptureActionResult> {
  try {
    const user = await requireUser();
    const removed = await removeCapture(user, captureId);
    // After commit: a file left in the store by a failure here is only unused bytes, never a dangling row.
    await deleteStored([removed.uploadKey]).catch((error: unknown) => console.error(`[captures] could not delete ${removed.uploadKey} from the store`, error));
  } catch (error) {
    return benchFailure(error, "remove-capture");
  }
  revalidateLog(logId, captureId);
  return { ok: true, message: "Capture removed." };
}
