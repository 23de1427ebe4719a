"use client";

import { useEffect, useId, useRef } from "react";
import { Button } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { DOCUMENT_KIND_OPTIONS, guessDocumentKind, titleFromFileName, type DocumentKind } from "@/lib/uploads/document-kinds";
import { formatBytes, UPLOAD_ROUTES } from "@/lib/uploads/limits";
import { FileDrop } from "./file-drop";
import { removeAt, replaceAt } from "./list-moves";
import { UploadStatus } from "./upload-status";
import { useUploadQueue, type AcceptedUpload } from "./use-upload-queue";

export type DocumentValue = { key: string; url: string; kind: DocumentKind; title: string };

export type DocumentUploaderProps = {
  value: readonly DocumentValue[];
  onChange: (documents: DocumentValue[]) => void;
  /** Most documents the value may hold. */
  max?: number;
  label?: string;
  /** A form's field error, e.g. "Give every document a title." */
  error?: string | readonly string[];
  /** When set, the value is also submitted as JSON in a hidden input of this name. */
  name?: string;
  disabled?: boolean;
};

/** PDFs for a listing (schematic, BOM, build notes), each with a kind and a title. Controlled. */
export function DocumentUploader({ value, onChange, max = 8, label = "Documents", error, name, disabled = false }: DocumentUploaderProps) {
  const headingId = useId();
  const errorId = useId();
  const latest = useRef(value);
  useEffect(() => {
    latest.current = value;
  }, [value]);
  const change = (next: DocumentValue[]) => {
    latest.current = next;
    onChange(next);
  };

  const queue = useUploadQueue({
    endpoint: "listingDocument",
    onAccepted: (upload: AcceptedUpload) =>
      change([...latest.current, { key: upload.key, url: upload.url, kind: guessDocumentKind(upload.name), title: titleFromFileName(upload.name) }]),
  });

  const room = max - value.length - queue.pending.length;
  const addFiles = (files: File[]) => {
    const taken = files.slice(0, Math.max(0, room));
    queue.refuse(files.slice(taken.length).map((f) => `${f.name} was not added: at most ${max} documents.`));
    queue.upload(taken);
  };
  const errorText = typeof error === "string" ? error : error?.join(" ");

  return (
    <section aria-labelledby={headingId} aria-describedby={errorText ? errorId : undefined} className="flex flex-col gap-3" data-testid="document-uploader">
      <h3 id={headingId} className="text-base font-semibold text-graphite-900">
        {label}
      </h3>
      <p className="text-sm text-graphite-600">
        PDF only, up to {formatBytes(UPLOAD_ROUTES.listingDocument.maxBytes)} each. PDFs with scripts, embedded files or a password are refused.
      </p>
      <FileDrop
        accept={UPLOAD_ROUTES.listingDocument.accept}
        disabled={disabled || room <= 0}
        buttonLabel="Choose PDFs"
        inputLabel={`Add PDFs to ${label.toLowerCase()}`}
        onFiles={addFiles}
      />
      <UploadStatus pending={queue.pending} problems={queue.problems} onDismiss={queue.dismiss} />
      {errorText ? (
        <p id={errorId} className="text-sm font-medium text-signal-700">
          {errorText}
        </p>
      ) : null}

      {value.length > 0 ? (
        <ul className="flex flex-col gap-3" aria-label={label}>
          {value.map((doc, index) => (
            <li key={doc.key} className="grid gap-3 rounded border border-graphite-200 bg-paper-raised p-3 sm:grid-cols-[1fr_14rem_auto] sm:items-end" data-testid="uploaded-document">
              <TextField
                label={`Title of document ${index + 1}`}
                value={doc.title}
                maxLength={120}
                required
                disabled={disabled}
                onChange={(event) => {
                  const title = event.currentTarget.value;
                  change(replaceAt(value, index, (d) => ({ ...d, title })));
                }}
              />
              <SelectField
                label={`Kind of document ${index + 1}`}
                value={doc.kind}
                options={DOCUMENT_KIND_OPTIONS}
                disabled={disabled}
                onChange={(event) => {
                  const kind = event.currentTarget.value as DocumentKind;
                  change(replaceAt(value, index, (d) => ({ ...d, kind })));
                }}
              />
              <div className="flex gap-1">
                <a href={doc.url} target="_blank" rel="noopener noreferrer" className="inline-flex h-8 items-center px-2 text-sm">
                  Open PDF
                </a>
                <Button variant="quiet" size="sm" disabled={disabled} aria-label={`Remove document ${index + 1}`} onClick={() => change(removeAt(value, index))}>
                  Remove
                </Button>
              </div>
            </li>
          ))}
        </ul>
      ) : null}
      {name ? <input type="hidden" name={name} value={JSON.stringify(value)} /> : null}
    </section>
  );
}
