"use client";

import type { generateReactHelpers } from "@uploadthing/react";
import type { UploadRouter } from "@/app/api/uploadthing/core";
import type { UploadRouteName } from "@/lib/uploads/limits";
import type { UploadServerData } from "@/lib/uploads/process-upload";

// One file per request: each gets its own progress and its own answer, and one refusal never
// takes the others down with it.

let helpers: ReturnType<typeof generateReactHelpers<UploadRouter>> | undefined;

// Codes whose message the route wrote for people (sign in, sellers only, too large, wrong type).
const READABLE_CODES = new Set(["BAD_REQUEST", "FORBIDDEN", "TOO_MANY_FILES", "TOO_LARGE"]);

function failureMessage(fileName: string, error: unknown): string {
  const code = typeof error === "object" && error !== null && "code" in error ? String(error.code) : "";
  const message = error instanceof Error ? error.message : "";
  if (READABLE_CODES.has(code) && message) return message;
  return `${fileName} could not be uploaded. Check the connection and try again.`;
}

export async function uploadOneFile(
  endpoint: UploadRouteName,
  file: File,
  { onProgress, signal }: { onProgress: (percent: number) => void; signal?: AbortSignal },
): Promise<UploadServerData> {
  try {
    // Loaded and created on first use, in the browser: the helpers resolve /api/uploadthing against
    // window.location, and the upload client is too big to hold back every page with an upload form.
    helpers ??= (await import("@uploadthing/react")).generateReactHelpers<UploadRouter>();
    const [result] = await helpers.uploadFiles(endpoint, {
      files: [file],
      signal,
      onUploadProgress: ({ progress }) => onProgress(progress),
    });
    return result?.serverData ?? { ok: false, message: `${file.name}: the upload was not confirmed. Please try again.` };
  } catch (error) {
    return { ok: false, message: failureMessage(file.name, error) };
  }
}
