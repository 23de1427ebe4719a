// What a file is, by its first bytes rather than its name or declared type. The signatures:
//   JPEG  FF D8 FF                      (ITU-T T.81 Annex B: SOI marker, then the next marker's FF)
//   PNG   89 50 4E 47 0D 0A 1A 0A       (ISO/IEC 15948 §5.2)
//   WebP  "RIFF" <u32 size> "WEBP"      (RFC 9649 §2.5, the RIFF header)
//   PDF   "%PDF-"                       (ISO 32000-1 §7.5.2; readers accept it later in the file,
//                                        we insist on offset 0 so nothing can sit in front of it)

export type ContentKind = "jpeg" | "png" | "webp" | "pdf";

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a] as const;

function startsWith(bytes: Uint8Array, signature: readonly number[], offset = 0): boolean {
  if (bytes.length < offset + signature.length) return false;
  return signature.every((byte, i) => bytes[offset + i] === byte);
}

function ascii(text: string): number[] {
  return [...text].map((c) => c.charCodeAt(0));
}

export function sniffContent(bytes: Uint8Array): ContentKind | null {
  if (startsWith(bytes, [0xff, 0xd8, 0xff])) return "jpeg";
  if (startsWith(bytes, PNG_SIGNATURE)) return "png";
  if (startsWith(bytes, ascii("RIFF")) && startsWith(bytes, ascii("WEBP"), 8)) return "webp";
  if (startsWith(bytes, ascii("%PDF-"))) return "pdf";
  return null;
}

export const PHOTO_KINDS: readonly ContentKind[] = ["jpeg", "png", "webp"];

/**
 * A few words for a refusal: "a PNG image", "an HTML page". Only for messages; never the basis
 * of an acceptance, which is `sniffContent` alone.
 */
export function describeContent(bytes: Uint8Array): string {
  switch (sniffContent(bytes)) {
    case "jpeg":
      return "a JPEG image";
    case "png":
      return "a PNG image";
    case "webp":
      return "a WebP image";
    case "pdf":
      return "a PDF";
    case null:
      break;
  }
  if (startsWith(bytes, ascii("GIF87a")) || startsWith(bytes, ascii("GIF89a"))) return "a GIF image";
  if (startsWith(bytes, ascii("ftyp"), 4)) return "a HEIC or video file";
  if (startsWith(bytes, [0x50, 0x4b, 0x03, 0x04])) return "a ZIP archive or office document";
  // Programs: PE/COFF ("MZ", Microsoft PE format), ELF (\x7fELF, System V ABI), Mach-O (FEEDFACE/FEEDFACF
  // either byte order) and CAFEBABE (Mach-O universal or Java class), and scripts with a "#!" line.
  if (startsWith(bytes, ascii("MZ"))) return "a Windows program";
  if (startsWith(bytes, [0x7f, 0x45, 0x4c, 0x46])) return "a Linux program";
  if ([[0xfe, 0xed, 0xfa, 0xce], [0xfe, 0xed, 0xfa, 0xcf], [0xce, 0xfa, 0xed, 0xfe], [0xcf, 0xfa, 0xed, 0xfe], [0xca, 0xfe, 0xba, 0xbe]].some((m) => startsWith(bytes, m))) {
    return "a program";
  }
  if (startsWith(bytes, ascii("#!"))) return "a script";
  const head = new TextDecoder("latin1").decode(bytes.subarray(0, 512)).replace(/^\uFEFF/, "").trimStart().toLowerCase();
  if (head.startsWith("<!doctype html") || head.startsWith("<html")) return "an HTML page";
  if (head.includes("<svg")) return "an SVG drawing";
  if (head.startsWith("<")) return "markup (XML or HTML)";
  return "something else";
}
