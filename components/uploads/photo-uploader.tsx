"use client";

import { useEffect, useId, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import { cx } from "@/components/ui/cx";
import { TextField } from "@/components/ui/field";
import { formatBytes, UPLOAD_ROUTES } from "@/lib/uploads/limits";
import { hasFiles, FileDrop } from "./file-drop";
import { moveItem, removeAt, replaceAt } from "./list-moves";
import { UploadStatus } from "./upload-status";
import { useUploadQueue, type AcceptedUpload } from "./use-upload-queue";

export type PhotoValue = { key: string; url: string; thumbUrl: string; alt: string };

export type PhotoUploaderProps = {
  value: readonly PhotoValue[];
  onChange: (photos: PhotoValue[]) => void;
  /** listingPhoto (sellers, up to 8) or readingPhoto (any member, up to 6 per log entry). */
  endpoint?: "listingPhoto" | "readingPhoto";
  /** The most photos the value may hold; defaults to the route's limit. */
  max?: number;
  label?: string;
  /** A form's field error, e.g. "Add at least one photo." */
  error?: string | readonly string[];
  /** When set, the value is also submitted as JSON in a hidden input of this name. */
  name?: string;
  disabled?: boolean;
};

/**
 * Photos for a listing or a reading: pick or drop, progress per file, previews, alt text,
 * reorder (buttons or drag), remove. The first photo is the cover. Controlled: the form holds
 * the value and submits the keys.
 */
export function PhotoUploader({
  value,
  onChange,
  endpoint = "listingPhoto",
  max = UPLOAD_ROUTES[endpoint].maxFiles,
  label = "Photos",
  error,
  name,
  disabled = false,
}: PhotoUploaderProps) {
  const headingId = useId();
  const errorId = useId();
  // Several uploads can finish in one tick; each must add to the newest value, not a stale one.
  const latest = useRef(value);
  useEffect(() => {
    latest.current = value;
  }, [value]);
  const change = (next: PhotoValue[]) => {
    latest.current = next;
    onChange(next);
  };

  const queue = useUploadQueue({
    endpoint,
    onAccepted: (upload: AcceptedUpload) =>
      change([...latest.current, { key: upload.key, url: upload.url, thumbUrl: upload.thumbUrl ?? upload.url, alt: "" }]),
  });
  const [dragging, setDragging] = useState<number | null>(null);

  const room = max - value.length - queue.pending.length;
  const addFiles = (files: File[]) => {
    const taken = files.slice(0, Math.max(0, room));
    const left = files.slice(taken.length);
    queue.refuse(left.map((f) => `${f.name} was not added: at most ${max} photos.`));
    queue.upload(taken);
  };

  const errorText = typeof error === "string" ? error : error?.join(" ");
  const rule = UPLOAD_ROUTES[endpoint];

  return (
    <section aria-labelledby={headingId} aria-describedby={errorText ? errorId : undefined} className="flex flex-col gap-3" data-testid="photo-uploader">
      <div className="flex flex-wrap items-baseline justify-between gap-2">
        <h3 id={headingId} className="text-base font-semibold text-graphite-900">
          {label}
        </h3>
        <span className="text-sm text-graphite-600">
          <span className="figure font-mono">{value.length}</span> of <span className="figure font-mono">{max}</span> photos
        </span>
      </div>
      <p className="text-sm text-graphite-600">
        JPEG, PNG or WebP, up to {formatBytes(rule.maxBytes)} each. The first photo is the cover. Location and camera details are removed from every
        photo before it is stored.
      </p>

      <FileDrop
        accept={rule.accept}
        disabled={disabled || room <= 0}
        buttonLabel="Choose photos"
        inputLabel={`Add photos to ${label.toLowerCase()}`}
        onFiles={addFiles}
      />
      <UploadStatus pending={queue.pending} problems={queue.problems} onDismiss={queue.dismiss} />
      {errorText ? (
        <p id={errorId} className="text-sm font-medium text-signal-700">
          {errorText}
        </p>
      ) : null}

      {value.length > 0 ? (
        <ol className="grid gap-3 sm:grid-cols-2" aria-label={`${label}, in order`}>
          {value.map((photo, index) => (
            <li
              key={photo.key}
              draggable={!disabled}
              onDragStart={(event) => {
                setDragging(index);
                event.dataTransfer.effectAllowed = "move";
                event.dataTransfer.setData("text/plain", photo.key);
              }}
              onDragEnd={() => setDragging(null)}
              onDragOver={(event) => {
                if (dragging !== null || hasFiles(event)) event.preventDefault();
              }}
              onDrop={(event) => {
                event.preventDefault();
                if (hasFiles(event)) return addFiles(Array.from(event.dataTransfer.files));
                if (dragging !== null) change(moveItem(value, dragging, index));
                setDragging(null);
              }}
              className={cx(
                "flex gap-3 rounded border bg-paper-raised p-3",
                index === 0 ? "border-copper-500" : "border-graphite-200",
                dragging === index && "opacity-50",
              )}
              data-testid="uploaded-photo"
            >
              <div className="flex w-28 shrink-0 flex-col gap-1">
                {/* Plain <img>: the uploads host and the sizes are not known to next/image. */}
                {/* eslint-disable-next-line @next/next/no-img-element */}
                <img src={photo.thumbUrl} alt={photo.alt} className="h-24 w-28 rounded-sm bg-graphite-100 object-cover" />
                <span className="text-xs font-semibold text-graphite-700">
                  {index === 0 ? (
                    <span className="rounded-sm bg-copper-100 px-1.5 py-0.5 text-copper-700">Cover</span>
                  ) : (
                    `Photo ${index + 1}`
                  )}
                </span>
              </div>
              <div className="flex min-w-0 flex-1 flex-col gap-2">
                <TextField
                  label={`Alt text for photo ${index + 1}${index === 0 ? " (cover)" : ""}`}
                  hint="What the photo shows, for people who cannot see it."
                  value={photo.alt}
                  maxLength={200}
                  disabled={disabled}
                  onChange={(event) => {
                    const alt = event.currentTarget.value;
                    change(replaceAt(value, index, (p) => ({ ...p, alt })));
                  }}
                />
                <div className="flex flex-wrap gap-1">
                  <Button
                    variant="secondary"
                    size="sm"
                    disabled={disabled || index === 0}
                    aria-label={`Move photo ${index + 1} up`}
                    onClick={() => change(moveItem(value, index, index - 1))}
                  >
                    Up
                  </Button>
                  <Button
                    variant="secondary"
                    size="sm"
                    disabled={disabled || index === value.length - 1}
                    aria-label={`Move photo ${index + 1} down`}
                    onClick={() => change(moveItem(value, index, index + 1))}
                  >
                    Down
                  </Button>
                  <Button
                    variant="quiet"
                    size="sm"
                    disabled={disabled}
                    aria-label={`Remove photo ${index + 1}`}
                    onClick={() => change(removeAt(value, index))}
                  >
                    Remove
                  </Button>
                </div>
              </div>
            </li>
          ))}
        </ol>
      ) : null}
      {name ? <input type="hidden" name={name} value={JSON.stringify(value)} /> : null}
    </section>
  );
}
