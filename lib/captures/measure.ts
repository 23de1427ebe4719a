import "server-only";
import {
  CaptureGoneError,
  claimCapture,
  failCapture,
  releaseCapture,
  setCaptureProgress,
  storeMeasurement,
  type MeasuredCapture,
} from "@/db/queries/captures";
import { EngineeringInputError, measurePulses, parseCaptureCsv } from "@/lib/engineering";
import { downloadStored } from "@/lib/uploads/store";
import { UPLOAD_ROUTES } from "@/lib/uploads/limits";
import { encodeBlocks, spacingOf } from "./blocks";
import { decodeCaptureText } from "./decode-text";
import { storableFigures } from "./figures";

// Measuring one capture: read the original back from the store, parse it, measure every channel,
// store the figures and the sample blocks. The same steps run inline for a small file (in the
// attaching request) and in the worker for a big one; progress goes to the capture row at each
// step, where the page polls it.

/** Above this the file is measured in the background job; below it the builder waits a moment. */
export const INLINE_MEASURE_BYTES = 2 * 1024 * 1024;

export type MeasureOutcome = "measured" | "failed" | "not-claimed" | "retry";

/** A passing failure (the store did not answer): the capture goes back to the queue. */
export class CaptureRetryError extends Error {
  constructor(message: string, options?: ErrorOptions) {
    super(message, options);
    this.name = "CaptureRetryError";
  }
}

function rangeOf(values: Float64Array): { minValue: number; maxValue: number } {
  let minValue = Infinity;
  let maxValue = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const v = values[i] ?? 0;
    if (v < minValue) minValue = v;
    if (v > maxValue) maxValue = v;
  }
  return Number.isFinite(minValue) ? { minValue, maxValue } : { minValue: 0, maxValue: 0 };
}

/** Parses and measures a capture's text, reporting progress from 20 % to 85 %. Throws EngineeringInputError for a bad file. */
export async function measureText(text: string, progress: (percent: number) => Promise<void>): Promise<MeasuredCapture> {
  const parsed = parseCaptureCsv(text);
  await progress(45);
  const n = parsed.timeS.length;
  const channels: MeasuredCapture["channels"] = [];
  for (const [i, channel] of parsed.channels.entries()) {
    const figures = storableFigures(measurePulses({ timeS: parsed.timeS, values: channel.values }));
    channels.push({ name: channel.name, unit: channel.unit ?? null, ...rangeOf(channel.values), figures });
    await progress(45 + (35 * (i + 1)) / parsed.channels.length);
  }
  const spacing = spacingOf(parsed.timeS);
  const blocks = encodeBlocks(parsed.timeS, parsed.channels, spacing);
  await progress(85);
  const startTimeS = parsed.timeS[0] ?? 0;
  const endTimeS = parsed.timeS[n - 1] ?? startTimeS;
  return {
    sampleCount: n,
    startTimeS,
    endTimeS,
    sampleIntervalS: spacing.evenly ? spacing.intervalS : parsed.sampleIntervalS,
    evenlySpaced: spacing.evenly,
    channels,
    blocks,
  };
}

/**
 * Measures a queued capture if nobody else is. A bad file ends as "failed" with the parser's
 * message (it names the line); a store that does not answer puts the capture back in the queue
 * and answers "retry", for the job to throw and pg-boss to try again later.
 */
export async function measureCapture(captureId: string): Promise<MeasureOutcome> {
  const claimed = await claimCapture(captureId);
  if (!claimed) return "not-claimed";
  const progress = (percent: number) => setCaptureProgress(captureId, percent);

  let text: string;
  try {
    const bytes = await downloadStored(claimed.url, UPLOAD_ROUTES.capture.maxBytes);
    await progress(20);
    text = decodeCaptureText(bytes);
  } catch (error) {
    console.error(`[captures] could not read back ${captureId}:`, (error as Error).message);
    await releaseCapture(captureId);
    return "retry";
  }

  let measured: MeasuredCapture;
  try {
    measured = await measureText(text, progress);
  } catch (error) {
    if (error instanceof EngineeringInputError) {
      await failCapture(captureId, error.message);
      return "failed";
    }
    console.error(`[captures] measuring ${captureId} failed:`, error);
    await failCapture(captureId, "Fluxyard could not measure this file. If it opens in a spreadsheet as columns of numbers, please attach it again; otherwise save the capture as CSV from the instrument.");
    return "failed";
  }

  try {
    await storeMeasurement(captureId, measured);
  } catch (error) {
    if (error instanceof CaptureGoneError) return "not-claimed";
    console.error(`[captures] storing ${captureId} failed:`, (error as Error).message);
    await releaseCapture(captureId);
    return "retry";
  }
  return "measured";
}
