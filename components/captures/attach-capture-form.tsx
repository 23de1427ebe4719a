"use client";

import { useId, useState, useTransition } from "react";
import { FileDrop } from "@/components/uploads/file-drop";
import { UploadStatus } from "@/components/uploads/upload-status";
import { useUploadQueue, type AcceptedUpload } from "@/components/uploads/use-upload-queue";
import { SelectField } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import type { CaptureActionResult } from "@/lib/captures/action-schemas";
import { formatBytes, UPLOAD_ROUTES } from "@/lib/uploads/limits";

export type AttachCaptureFormProps = {
  checkpointName: string;
  /** the checkpoint's readings, newest first; the first is chosen by default */
  readings: readonly { id: string; label: string }[];
  attach: (input: unknown) => Promise<CaptureActionResult>;
};

/**
 * Attaches a scope capture (CSV or text) to one of the checkpoint's readings: the file goes up
 * through the upload route, then the server measures it — at once for a small file, in the
 * background for a big one.
 */
export function AttachCaptureForm({ checkpointName, readings, attach }: AttachCaptureFormProps) {
  const id = useId();
  const [readingId, setReadingId] = useState(readings[0]?.id ?? "");
  const [result, setResult] = useState<CaptureActionResult | null>(null);
  const [pending, startTransition] = useTransition();

  const queue = useUploadQueue({
    endpoint: "capture",
    // The queue calls the newest of these, so the reading chosen when the upload ends is the one used.
    onAccepted: (upload: AcceptedUpload) =>
      startTransition(async () => {
        setResult(await attach({ readingId, uploadKey: upload.key }));
      }),
  });
  const rule = UPLOAD_ROUTES.capture;
  const busy = pending || queue.pending.length > 0;

  return (
    <section aria-label={`Attach a scope capture at ${checkpointName}`} className="space-y-3" data-testid="attach-capture">
      <p className="text-sm text-graphite-600">
        Save the capture on the instrument as CSV (or tab- or semicolon-separated text), up to {formatBytes(rule.maxBytes)}. Fluxyard measures its pulses and proposes
        the figure this checkpoint needs; the reading changes only when you confirm it.
      </p>
      {readings.length > 1 ? (
        <SelectField
          id={`${id}-reading`}
          label="For the reading"
          value={readingId}
          onChange={(event) => setReadingId(event.currentTarget.value)}
          options={readings.map((r) => ({ value: r.id, label: r.label }))}
          disabled={busy}
        />
      ) : (
        <p className="text-sm text-graphite-700">For the reading {readings[0]?.label}.</p>
      )}
      <FileDrop
        accept={rule.accept}
        multiple={false}
        disabled={busy || readingId === ""}
        buttonLabel={busy ? "Working…" : "Choose a capture file"}
        inputLabel={`Capture file for ${checkpointName}`}
        onFiles={(files) => {
          setResult(null);
          queue.upload(files.slice(0, 1));
        }}
      />
      <UploadStatus pending={queue.pending} problems={queue.problems} onDismiss={queue.dismiss} />
      {pending ? (
        <p className="text-sm text-graphite-700" aria-live="polite">
          Attaching and measuring…
        </p>
      ) : null}
      <div data-testid="attach-capture-result">
        <FormMessage tone={result?.ok ? "success" : "error"} message={result?.message} />
      </div>
    </section>
  );
}
