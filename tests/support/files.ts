// Test files made in the test, no binary fixtures: photos with camera metadata (drawn by sharp),
// PDFs written by hand, and small readers of the metadata formats so a test can see what a file
// carries without trusting the code under test.
//   JPEG markers: ITU-T T.81 Annex B (SOI FFD8, APPn FFE0–FFEF, COM FFFE, SOS FFDA, EOI FFD9).
//   EXIF: CIPA DC-008 (Exif 2.32) §4.5–4.6 — APP1 "Exif\0\0", a TIFF header (TIFF 6.0 §2),
//         IFD0 with pointers 0x8769 (Exif IFD) and 0x8825 (GPS IFD); GPS tags 0x0001–0x0004.
//   PDF: ISO 32000-1 §7.5 (header, body, xref table, trailer), §7.5.7 object streams.
import { deflateSync } from "node:zlib";
import sharp from "sharp";

/** Deterministic noise, so JPEG data is large and unstructured like a real photo's. */
export function noisePixels(width: number, height: number, channels = 3, seed = 7): Buffer {
  const pixels = Buffer.alloc(width * height * channels);
  let state = seed >>> 0;
  for (let i = 0; i < pixels.length; i++) {
    // xorshift32
    state ^= state << 13;
    state ^= state >>> 17;
    state ^= state << 5;
    pixels[i] = state & 0xff;
  }
  return pixels;
}

export const CAMERA = { make: "Yardlight Optics", model: "YL-20", serial: "YL20-0042-7781" };
/** 52° 31′ 12″ N, 13° 24′ 36″ E: an invented spot, written as EXIF rationals. */
export const GPS = { latitude: "52/1 31/1 12/1", longitude: "13/1 24/1 36/1" };

/** A JPEG with camera make, model and serial number, a GPS position and an EXIF orientation. */
export async function jpegWithCameraMetadata({ width = 640, height = 480, orientation = 6 } = {}): Promise<Buffer> {
  return sharp(noisePixels(width, height), { raw: { width, height, channels: 3 } })
    .jpeg({ quality: 90 })
    .withMetadata({ orientation })
    .withExif({
      IFD0: { Make: CAMERA.make, Model: CAMERA.model },
      IFD2: { BodySerialNumber: CAMERA.serial },
      IFD3: { GPSLatitudeRef: "N", GPSLatitude: GPS.latitude, GPSLongitudeRef: "E", GPSLongitude: GPS.longitude },
    })
    .toBuffer();
}

export async function plainPng({ width = 320, height = 200, alpha = false } = {}): Promise<Buffer> {
  const channels = alpha ? 4 : 3;
  return sharp(noisePixels(width, height, channels), { raw: { width, height, channels } }).png().toBuffer();
}

export async function plainWebp({ width = 320, height = 200 } = {}): Promise<Buffer> {
  return sharp(noisePixels(width, height), { raw: { width, height, channels: 3 } }).webp().toBuffer();
}

export type JpegSegment = { marker: number; data: Buffer };

/** The marker segments before the scan data (T.81 §B.1.1.4: FF, marker byte, 2-byte length). */
export function jpegSegments(jpeg: Uint8Array): JpegSegment[] {
  const bytes = Buffer.from(jpeg);
  if (bytes[0] !== 0xff || bytes[1] !== 0xd8) throw new Error("not a JPEG: no SOI marker");
  const segments: JpegSegment[] = [];
  let at = 2;
  while (at + 4 <= bytes.length) {
    if (bytes[at] !== 0xff) throw new Error(`expected a marker at byte ${at}`);
    const marker = bytes[at + 1] ?? 0;
    const length = bytes.readUInt16BE(at + 2);
    segments.push({ marker, data: bytes.subarray(at + 4, at + 2 + length) });
    if (marker === 0xda) break; // SOS: entropy-coded data follows
    at += 2 + length;
  }
  return segments;
}

export function exifSegment(jpeg: Uint8Array): Buffer | undefined {
  return jpegSegments(jpeg).find((s) => s.marker === 0xe1 && s.data.subarray(0, 6).toString("latin1") === "Exif\0\0")?.data;
}

export type ExifTags = { ifd0: Map<number, unknown>; exif: Map<number, unknown>; gps: Map<number, unknown> };

/** Reads the IFD0, Exif and GPS directories of an EXIF block ("Exif\0\0" + TIFF). */
export function readExif(block: Buffer): ExifTags {
  const tiff = block.subarray(0, 6).toString("latin1") === "Exif\0\0" ? block.subarray(6) : block;
  const little = tiff.subarray(0, 2).toString("latin1") === "II";
  const u16 = (o: number) => (little ? tiff.readUInt16LE(o) : tiff.readUInt16BE(o));
  const u32 = (o: number) => (little ? tiff.readUInt32LE(o) : tiff.readUInt32BE(o));
  const TYPE_SIZES: Record<number, number> = { 1: 1, 2: 1, 3: 2, 4: 4, 5: 8, 7: 1, 9: 4, 10: 8 };
  const readIfd = (offset: number) => {
    const tags = new Map<number, unknown>();
    const count = u16(offset);
    for (let i = 0; i < count; i++) {
      const entry = offset + 2 + i * 12;
      const tag = u16(entry);
      const type = u16(entry + 2);
      const n = u32(entry + 4);
      const size = (TYPE_SIZES[type] ?? 1) * n;
      const at = size <= 4 ? entry + 8 : u32(entry + 8);
      if (type === 2) tags.set(tag, tiff.subarray(at, at + n).toString("latin1").replace(/\0+$/, ""));
      else if (type === 3) tags.set(tag, u16(at));
      else if (type === 4) tags.set(tag, u32(at));
      else if (type === 5) tags.set(tag, Array.from({ length: n }, (_, k) => `${u32(at + 8 * k)}/${u32(at + 8 * k + 4)}`).join(" "));
      else tags.set(tag, tiff.subarray(at, at + size));
    }
    return tags;
  };
  const ifd0 = readIfd(u32(4));
  const exifAt = ifd0.get(0x8769);
  const gpsAt = ifd0.get(0x8825);
  return {
    ifd0,
    exif: typeof exifAt === "number" ? readIfd(exifAt) : new Map(),
    gps: typeof gpsAt === "number" ? readIfd(gpsAt) : new Map(),
  };
}

/** A JPEG that decodes fine but carries markup in a comment segment (COM, T.81 §B.2.4.5). */
export async function jpegWithComment(comment: string): Promise<Buffer> {
  const jpeg = await sharp(noisePixels(64, 64), { raw: { width: 64, height: 64, channels: 3 } }).jpeg().toBuffer();
  const body = Buffer.from(comment, "latin1");
  const segment = Buffer.alloc(4 + body.length);
  segment.writeUInt16BE(0xfffe, 0);
  segment.writeUInt16BE(body.length + 2, 2);
  body.copy(segment, 4);
  return Buffer.concat([jpeg.subarray(0, 2), segment, jpeg.subarray(2)]);
}

/**
 * A one-page PDF with a correct cross-reference table. `catalogExtra` goes into the catalog
 * dictionary (e.g. an /OpenAction); `objects` are appended as further indirect objects.
 */
export function handMadePdf({ catalogExtra = "", objects = [] as (string | Buffer)[], trailerExtra = "" } = {}): Buffer {
  const content = "BT /F1 12 Tf 24 120 Td (Bus 325 V after rectification) Tj ET";
  const bodies: (string | Buffer)[] = [
    `<< /Type /Catalog /Pages 2 0 R ${catalogExtra}>>`,
    "<< /Type /Pages /Kids [3 0 R] /Count 1 >>",
    "<< /Type /Page /Parent 2 0 R /MediaBox [0 0 300 200] /Contents 4 0 R /Resources << /Font << /F1 << /Type /Font /Subtype /Type1 /BaseFont /Courier >> >> >> >>",
    `<< /Length ${content.length} >>\nstream\n${content}\nendstream`,
    ...objects,
  ];
  const parts: Buffer[] = [Buffer.from("%PDF-1.7\n%\xe2\xe3\xcf\xd3\n", "latin1")];
  const offsets: number[] = [];
  let length = parts[0]!.length;
  bodies.forEach((body, i) => {
    offsets.push(length);
    const chunk = Buffer.concat([Buffer.from(`${i + 1} 0 obj\n`, "latin1"), Buffer.isBuffer(body) ? body : Buffer.from(body, "latin1"), Buffer.from("\nendobj\n", "latin1")]);
    parts.push(chunk);
    length += chunk.length;
  });
  const xref = [`xref\n0 ${bodies.length + 1}\n`, "0000000000 65535 f \n", ...offsets.map((o) => `${String(o).padStart(10, "0")} 00000 n \n`)].join("");
  parts.push(Buffer.from(`${xref}trailer\n<< /Size ${bodies.length + 1} /Root 1 0 R ${trailerExtra}>>\nstartxref\n${length}\n%%EOF\n`, "latin1"));
  return Buffer.concat(parts);
}

/** An object stream (ISO 32000-1 §7.5.7) holding one object, Flate-compressed. */
export function objectStream(objectNumber: number, object: string): Buffer {
  const header = `${objectNumber} 0 `;
  const data = deflateSync(Buffer.from(header + object, "latin1"));
  return Buffer.concat([
    Buffer.from(`<< /Type /ObjStm /N 1 /First ${header.length} /Filter /FlateDecode /Length ${data.length} >>\nstream\n`, "latin1"),
    data,
    Buffer.from("\nendstream", "latin1"),
  ]);
}
