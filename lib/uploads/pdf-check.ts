import { inflateSync } from "node:zlib";

// A PDF is stored as given, so it must not carry anything a viewer would run. Names (ISO 32000-1
// §7.3.5) are compared after decoding their #xx escapes, so "/J#53" counts as "/JS". Dictionaries
// can also sit compressed inside object streams (§7.5.7, /Type /ObjStm); those are inflated and
// read too. A PDF whose object streams cannot be read, or that is encrypted (its dictionaries'
// strings and streams hidden), is refused: what cannot be checked is not stored.

/** Names that start or embed active content, with the words a seller reads. */
const ACTIVE_NAMES = new Map<string, string>([
  ["JavaScript", "embedded JavaScript"],
  ["JS", "embedded JavaScript"],
  ["Launch", "an action that launches a program"],
  ["EmbeddedFile", "an embedded file"],
  ["EmbeddedFiles", "embedded files"],
  ["RichMedia", "embedded media"],
  ["XFA", "an XFA form, which can carry scripts"],
]);

export type PdfVerdict = { ok: true } | { ok: false; reason: string };

// Delimiters and white space end a name (§7.2.2, Tables 1 and 2).
const NAME = /\/([^\s/[\]<>(){}%\0]*)/g;

function decodeName(raw: string): string {
  return raw.replace(/#([0-9a-fA-F]{2})/g, (_, hex: string) => String.fromCharCode(parseInt(hex, 16)));
}

function namesIn(text: string): Set<string> {
  const names = new Set<string>();
  for (const match of text.matchAll(NAME)) names.add(decodeName(match[1] ?? ""));
  return names;
}

function activeContentIn(text: string): string | null {
  for (const name of namesIn(text)) {
    const what = ACTIVE_NAMES.get(name);
    if (what) return what;
  }
  return null;
}

// Object streams hold dictionaries; decompressing past this is not a document but a bomb.
const MAX_INFLATED_BYTES = 64 * 1024 * 1024;

type ObjectStream = { dictionary: string; data: Uint8Array };

/** /Length as the reader takes it: a direct integer or one indirect object holding it. */
function lengthOf(dictionary: string, text: string): number | null {
  const match = /\/Length\s+(\d+)(?:\s+(\d+)\s+R)?/.exec(dictionary);
  if (!match?.[1]) return null;
  if (!match[2]) return Number(match[1]);
  const target = new RegExp(`(?:^|\\s)${match[1]}\\s+${match[2]}\\s+obj\\s*(\\d+)\\s*endobj`).exec(text);
  return target?.[1] ? Number(target[1]) : null;
}

function objectStreams(bytes: Uint8Array, text: string): ObjectStream[] {
  const found: ObjectStream[] = [];
  let resumeAt = 0;
  for (const match of text.matchAll(/stream\r?\n/g)) {
    if (match.index < resumeAt || text.slice(match.index - 3, match.index) === "end") continue;
    const start = match.index + match[0].length;
    // The stream's dictionary follows its "N G obj" header.
    const header = text.lastIndexOf("obj", match.index);
    const dictionary = text.slice(header === -1 ? Math.max(0, match.index - 4096) : header, match.index);
    const length = lengthOf(dictionary, text);
    const end = length !== null && start + length <= bytes.length ? start + length : text.indexOf("endstream", start);
    if (end === -1) continue;
    resumeAt = end;
    if (namesIn(dictionary).has("ObjStm")) found.push({ dictionary, data: bytes.subarray(start, end) });
  }
  return found;
}

function filtersOf(dictionary: string): string[] {
  const match = /\/Filter\s*(\[[^\]]*\]|\/[^\s/[\]<>(){}%]+)/.exec(dictionary);
  return match?.[1] ? [...namesIn(match[1])] : [];
}

export function checkPdf(bytes: Uint8Array): PdfVerdict {
  const text = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString("latin1");

  // A complete file ends with %%EOF (§7.5.5); readers tolerate a little trailing junk.
  if (!text.slice(-1024).includes("%%EOF")) return { ok: false, reason: "it looks incomplete (no end-of-file marker); it may be truncated" };
  // Readers do tolerate junk after it, which is how a PDF doubles as a ZIP (or JAR) or a page: the
  // file is stored as given, so after the last %%EOF only white space (§7.2.2 Table 1) may follow.
  if (!/^[\0\t\n\f\r ]*$/.test(text.slice(text.lastIndexOf("%%EOF") + 5))) {
    return { ok: false, reason: "it has other data appended after the end of the document" };
  }

  const names = namesIn(text);
  const plain = [...names].map((name) => ACTIVE_NAMES.get(name)).find(Boolean);
  if (plain) return { ok: false, reason: `it contains ${plain}` };
  if (names.has("Encrypt")) return { ok: false, reason: "it is encrypted or password-protected, so it cannot be checked" };

  let inflated = 0;
  for (const stream of objectStreams(bytes, text)) {
    const filters = filtersOf(stream.dictionary);
    if (filters.length === 0) continue; // uncompressed: already read with the rest
    if (filters.length !== 1 || filters[0] !== "FlateDecode") {
      return { ok: false, reason: "it stores objects with a compression that cannot be checked" };
    }
    let data: Buffer;
    try {
      // Strict: a stream that stops early could be hiding its tail from this check.
      data = inflateSync(stream.data, { maxOutputLength: MAX_INFLATED_BYTES - inflated });
    } catch {
      return { ok: false, reason: "part of it could not be read (a damaged or oversized object stream)" };
    }
    inflated += data.length;
    const hidden = activeContentIn(data.toString("latin1"));
    if (hidden) return { ok: false, reason: `it contains ${hidden}` };
  }
  return { ok: true };
}
