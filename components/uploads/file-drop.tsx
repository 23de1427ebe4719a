"use client";

import { useRef, useState, type DragEvent, type ReactNode } from "react";
import { Button } from "@/components/ui/button";
import { cx } from "@/components/ui/cx";

export function hasFiles(event: DragEvent): boolean {
  return Array.from(event.dataTransfer.types).includes("Files");
}

/** Pick files with a button, or drop them on the area. */
export function FileDrop({
  accept,
  multiple = true,
  disabled = false,
  buttonLabel,
  inputLabel,
  children,
  onFiles,
}: {
  accept: string;
  multiple?: boolean;
  disabled?: boolean;
  buttonLabel: string;
  /** The file input's accessible name (it is hidden; the button opens it). */
  inputLabel: string;
  children?: ReactNode;
  onFiles: (files: File[]) => void;
}) {
  const input = useRef<HTMLInputElement>(null);
  const [over, setOver] = useState(false);

  return (
    <div
      onDragOver={(event) => {
        if (disabled || !hasFiles(event)) return;
        event.preventDefault();
        setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={(event) => {
        setOver(false);
        if (disabled || !hasFiles(event)) return;
        event.preventDefault();
        onFiles(Array.from(event.dataTransfer.files));
      }}
      className={cx(
        "flex flex-col items-start gap-2 rounded border-2 border-dashed px-4 py-4 sm:flex-row sm:items-center",
        over ? "border-copper-500 bg-copper-50" : "border-graphite-300 bg-paper-sunken",
        disabled && "opacity-60",
      )}
    >
      <Button variant="secondary" disabled={disabled} onClick={() => input.current?.click()}>
        {buttonLabel}
      </Button>
      <span className="text-sm text-graphite-600">{disabled ? "The limit is reached." : "or drop files here."}</span>
      {children}
      <input
        ref={input}
        type="file"
        hidden
        accept={accept}
        multiple={multiple}
        disabled={disabled}
        aria-label={inputLabel}
        onChange={(event) => {
          const files = Array.from(event.currentTarget.files ?? []);
          // Cleared so that picking the same file again after a refusal fires a change.
          event.currentTarget.value = "";
          if (files.length > 0) onFiles(files);
        }}
      />
    </div>
  );
}
