// Finds page markup or server script hidden in a file whose header is that of an image, a PDF
// or a capture (a "polyglot"). Such a file is refused whole: photos are re-encoded anyway, but
// a PDF or a capture is stored as given and must not double as a page or a script.
//
// The markers are long enough that compressed image data rarely contains one by chance: for
// uniformly random bytes the likeliest, "<?php" (5 bytes, 3 letters either case), turns up with
// probability about 2³/256⁵ ≈ 7e-12 per position, under 1e-4 over a 10 MB photo.

const MARKERS: readonly { label: string; pattern: string }[] = [
  { label: "<script", pattern: "<script" },
  { label: "<?php", pattern: "<\\?php" },
  { label: "<iframe", pattern: "<iframe" },
  { label: "<object", pattern: "<object" },
  { label: "<embed", pattern: "<embed[\\s/>]" },
  { label: "<html", pattern: "<html[\\s>]" },
  { label: "<body", pattern: "<body[\\s>]" },
  { label: "<!doctype html", pattern: "<!doctype\\s+html" },
  // Every stand-alone SVG document names its namespace; shorter "<svg" would match noise.
  { label: "an SVG document", pattern: "http://www\\.w3\\.org/2000/svg" },
  { label: "javascript:", pattern: "javascript\\s*:" },
];

const SCAN = new RegExp(MARKERS.map((m) => `(${m.pattern})`).join("|"), "i");

/** The first marker found (for the refusal message), or null when the file is clean. */
export function findEmbeddedMarkup(bytes: Uint8Array): string | null {
  // latin1 maps every byte to one UTF-16 unit, so the regular expression sees the bytes as they are.
  const text = Buffer.from(bytes.buffer, bytes.byteOffset, bytes.byteLength).toString("latin1");
  const match = SCAN.exec(text);
  if (!match) return null;
  const index = match.slice(1).findIndex((group) => group !== undefined);
  return MARKERS[index]?.label ?? match[0];
}
