import "server-only";
import { strandedCaptureIds } from "@/db/queries/captures";
import { CaptureRetryError, measureCapture } from "./measure";

// The background side of measuring: the job for one big capture, and the sweep for captures whose
// job was never queued (the app could not reach pg-boss) or whose worker stopped half-way.

/** Throws on a passing failure so pg-boss retries the job with back-off. */
export async function runCaptureMeasureJob(captureId: string): Promise<void> {
  const outcome = await measureCapture(captureId);
  if (outcome === "retry") throw new CaptureRetryError(`capture ${captureId} could not be measured yet; retrying`);
}

export async function sweepStrandedCaptures(): Promise<number> {
  let measured = 0;
  for (const id of await strandedCaptureIds()) {
    if ((await measureCapture(id)) === "measured") measured++;
  }
  return measured;
}
