import type { DOCUMENT_KINDS } from "@/db/schema/listings";

// Client-safe: the document uploader offers these, the listing form stores them.

export type DocumentKind = (typeof DOCUMENT_KINDS)[number];

export const DOCUMENT_KIND_OPTIONS: readonly { value: DocumentKind; label: string }[] = [
  { value: "schematic", label: "Schematic" },
  { value: "bom", label: "Bill of materials (BOM)" },
  { value: "build-notes", label: "Build notes" },
  { value: "other", label: "Other" },
];

/** A first guess from the file name; the seller can change it. */
export function guessDocumentKind(fileName: string): DocumentKind {
  const name = fileName.toLowerCase();
  if (/\bbom\b|bill[\s_-]*of[\s_-]*materials|parts[\s_-]*list/.test(name)) return "bom";
  if (/schem|circuit|wiring/.test(name)) return "schematic";
  if (/note|guide|build|assembly|bring[\s_-]*up/.test(name)) return "build-notes";
  return "other";
}

/** "output-choke_wiring.pdf" → "output choke wiring". */
export function titleFromFileName(fileName: string): string {
  const stem = fileName.replace(/\.[^.]*$/, "").replace(/[_-]+/g, " ").replace(/\s+/g, " ").trim();
  return stem.slice(0, 120) || "Document";
}
