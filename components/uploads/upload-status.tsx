"use client";

import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { ProgressBar } from "./progress-bar";
import type { PendingUpload, UploadProblem } from "./use-upload-queue";

/** Files still uploading or being checked, and the files that were refused (each with its reason). */
export function UploadStatus({
  pending,
  problems,
  onDismiss,
}: {
  pending: readonly PendingUpload[];
  problems: readonly UploadProblem[];
  onDismiss: (id: string) => void;
}) {
  return (
    <div className="flex flex-col gap-3">
      {pending.length > 0 ? (
        <ul className="flex flex-col gap-2" aria-label="Uploads in progress">
          {pending.map((p) => (
            <li key={p.id} className="flex flex-col gap-1 rounded border border-graphite-200 bg-paper-raised px-3 py-2" data-testid="pending-upload">
              <span className="flex justify-between gap-2 text-sm">
                <span className="truncate font-medium text-graphite-900">{p.name}</span>
                <span className="text-graphite-600">{p.phase === "checking" ? "Checking the file…" : "Uploading…"}</span>
              </span>
              <ProgressBar value={p.progress} label={`Uploading ${p.name}`} />
            </li>
          ))}
        </ul>
      ) : null}
      {problems.length > 0 ? (
        <Alert tone="stop" title={problems.length === 1 ? "A file was not added" : `${problems.length} files were not added`}>
          <ul className="flex flex-col gap-1" data-testid="upload-problems">
            {problems.map((p) => (
              <li key={p.id} className="flex items-start justify-between gap-3">
                <span>{p.message}</span>
                <Button variant="quiet" size="sm" onClick={() => onDismiss(p.id)} aria-label={`Dismiss: ${p.message}`}>
                  Dismiss
                </Button>
              </li>
            ))}
          </ul>
        </Alert>
      ) : null}
    </div>
  );
}
