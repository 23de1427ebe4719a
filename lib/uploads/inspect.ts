import { checkCaptureText } from "./capture-text";
import type { UploadPurpose } from "./limits";
import { findEmbeddedMarkup } from "./markup-scan";
import { checkPdf } from "./pdf-check";
import { describeContent, PHOTO_KINDS, sniffContent, type ContentKind } from "./sniff";

// Decides from the bytes alone whether an uploaded file may be kept for its purpose. Pure, so
// the unit tests run it on hand-made files.

export type Inspection =
  | { ok: true; kind: "photo"; content: ContentKind }
  | { ok: true; kind: "pdf" }
  | { ok: true; kind: "capture" }
  | { ok: false; message: string };

/** A file name fit for a message or a download name: no paths, no control characters, bounded. */
export function safeFileName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? "";
  const cleaned = base.replace(/[\u0000-\u001f\u007f<>:"|?*]/g, "").trim().slice(0, 120);
  return cleaned === "" ? "file" : cleaned;
}

function refuse(name: string, reason: string): Inspection {
  return { ok: false, message: `${name} was not accepted: ${reason}.` };
}

export function inspectUpload(purpose: UploadPurpose, bytes: Uint8Array, fileName: string): Inspection {
  const name = safeFileName(fileName);
  if (bytes.length === 0) return refuse(name, "the file is empty");
  const content = sniffContent(bytes);
  const markup = findEmbeddedMarkup(bytes);

  switch (purpose) {
    case "listing-photo":
    case "reading-photo": {
      if (content === null || !PHOTO_KINDS.includes(content)) {
        return { ok: false, message: `${name} is ${describeContent(bytes)}, not a JPEG, PNG or WebP photo.` };
      }
      if (markup) return refuse(name, `it hides page markup or script inside the image (${markup})`);
      return { ok: true, kind: "photo", content };
    }
    case "listing-document": {
      if (content !== "pdf") return { ok: false, message: `${name} is ${describeContent(bytes)}, not a PDF.` };
      if (markup) return refuse(name, `it hides page markup or script (${markup})`);
      const verdict = checkPdf(bytes);
      if (!verdict.ok) return refuse(name, verdict.reason);
      return { ok: true, kind: "pdf" };
    }
    case "capture": {
      if (markup) return refuse(name, `a capture must be data, but it contains page markup or script (${markup})`);
      const text = checkCaptureText(bytes);
      if (!text.ok) {
        // A file that is recognisably something else (an image, a program, an archive) says so.
        const what = describeContent(bytes);
        return what === "something else" ? refuse(name, text.reason) : { ok: false, message: `${name} is ${what}, not a CSV or text capture.` };
      }
      return { ok: true, kind: "capture" };
    }
  }
}
