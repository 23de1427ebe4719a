import type { CaptureDetail } from "@/db/queries/captures";
import { proposeReading } from "./proposal";
import type { CaptureStatusView } from "./types";

/** The JSON the capture card polls and the pages render first: the same shape from both. */
export function captureStatusView(detail: CaptureDetail): CaptureStatusView {
  const { capture, checkpoint, channels } = detail;
  const measured = capture.state === "measured";
  const applied =
    capture.appliedAt && capture.appliedChannel !== null && capture.appliedFigure !== null && capture.appliedValue !== null
      ? {
          at: capture.appliedAt.toISOString(),
          channel: capture.appliedChannel,
          figure: capture.appliedFigure,
          value: capture.appliedValue,
          valueBefore: capture.valueBefore ?? capture.appliedValue,
          enteredBefore: { value: capture.enteredValueBefore ?? capture.valueBefore ?? capture.appliedValue, unit: capture.enteredUnitBefore ?? checkpoint.unit },
        }
      : null;
  return {
    id: capture.id,
    state: capture.state,
    progress: capture.state === "measured" ? 100 : capture.progress,
    error: capture.state === "failed" ? (capture.errorMessage ?? "The capture could not be measured.") : null,
    fileName: detail.upload.name,
    bytes: detail.upload.bytes,
    fileUrl: detail.upload.url,
    reading: { id: detail.reading.id, value: detail.reading.value, verdict: detail.reading.verdict },
    checkpoint,
    sampleCount: capture.sampleCount,
    startTimeS: capture.startTimeS,
    endTimeS: capture.endTimeS,
    sampleIntervalS: capture.sampleIntervalS,
    channels,
    proposal: measured && !applied ? proposeReading(checkpoint, channels) : null,
    applied,
    canEdit: detail.canEdit,
    createdAt: capture.createdAt.toISOString(),
  };
}
