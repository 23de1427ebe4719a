import { z } from "zod";

// The capture forms of the log page, shared by the client and the server actions.

export const attachCaptureSchema = z.object({
  readingId: z.uuid({ error: "Choose the reading this capture belongs to." }),
  uploadKey: z.string().trim().min(1, { error: "Upload the capture file first." }).max(200),
});
export type AttachCaptureInput = z.output<typeof attachCaptureSchema>;

export const confirmProposalSchema = z.object({
  channel: z.coerce.number({ error: "Choose the channel whose figure to use." }).int().min(0).max(255),
});

/** What the capture actions answer; field errors are keyed by the form's field names. */
export type CaptureActionResult =
  | { ok: true; message: string; captureId?: string; outsideRange?: boolean }
  | { ok: false; message: string; fieldErrors: Record<string, string[]> };
