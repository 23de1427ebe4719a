import { describe, expect, it } from "vitest";
import { describeContent, sniffContent } from "@/lib/uploads/sniff";
import { plainPng, plainWebp, handMadePdf, jpegWithCameraMetadata } from "../../support/files";

const bytes = (...values: number[]) => new Uint8Array(values);
const text = (value: string) => new Uint8Array(Buffer.from(value, "latin1"));

describe("sniffContent: file signatures", () => {
  it("recognises each accepted kind by its published signature", () => {
    // ITU-T T.81 Annex B: SOI (FF D8) followed by the next marker's FF.
    expect(sniffContent(bytes(0xff, 0xd8, 0xff, 0xe0, 0, 0x10))).toBe("jpeg");
    // ISO/IEC 15948 §5.2: the 8-byte PNG signature.
    expect(sniffContent(bytes(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0))).toBe("png");
    // RFC 9649 §2.5: "RIFF", a 32-bit size, "WEBP".
    expect(sniffContent(text("RIFF\x24\x00\x00\x00WEBPVP8 "))).toBe("webp");
    // ISO 32000-1 §7.5.2: the header line starts with %PDF-.
    expect(sniffContent(text("%PDF-1.7\n"))).toBe("pdf");
  });

  it("recognises files made by an independent encoder (sharp/libvips) and the hand-made PDF", async () => {
    expect(sniffContent(await jpegWithCameraMetadata({ width: 16, height: 16 }))).toBe("jpeg");
    expect(sniffContent(await plainPng())).toBe("png");
    expect(sniffContent(await plainWebp())).toBe("webp");
    expect(sniffContent(handMadePdf())).toBe("pdf");
  });

  it("refuses near misses: one byte short, one byte wrong, another RIFF format, a prefix before %PDF-", () => {
    expect(sniffContent(bytes(0xff, 0xd8))).toBeNull();
    expect(sniffContent(bytes(0xff, 0xd8, 0xfe))).toBeNull();
    expect(sniffContent(bytes(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a))).toBeNull();
    expect(sniffContent(bytes(0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0b))).toBeNull();
    // RIFF is also the container of WAVE audio (same header, other form type).
    expect(sniffContent(text("RIFF\x24\x00\x00\x00WAVEfmt "))).toBeNull();
    expect(sniffContent(text("RIFF"))).toBeNull();
    expect(sniffContent(text(" %PDF-1.7"))).toBeNull();
    expect(sniffContent(text("%PDF"))).toBeNull();
    expect(sniffContent(new Uint8Array())).toBeNull();
  });

  it("does not take page markup or a drawing for an image, whatever it is called", () => {
    expect(sniffContent(text("<!DOCTYPE html><html><script>alert(1)</script>"))).toBeNull();
    expect(sniffContent(text('<?xml version="1.0"?><svg xmlns="http://www.w3.org/2000/svg" onload="alert(1)"/>'))).toBeNull();
    expect(sniffContent(text("GIF89a\x01\x00\x01\x00"))).toBeNull();
  });
});

describe("describeContent: words for a refusal", () => {
  it("names what the file really is", async () => {
    expect(describeContent(await plainPng())).toBe("a PNG image");
    expect(describeContent(text("  <!doctype html><p>hi"))).toBe("an HTML page");
    expect(describeContent(text("\uFEFF<svg viewBox='0 0 1 1'></svg>"))).toBe("an SVG drawing");
    expect(describeContent(text("GIF87a...."))).toBe("a GIF image");
    expect(describeContent(text("PK\x03\x04rest"))).toBe("a ZIP archive or office document");
    expect(describeContent(text("time,volts\n0,325\n"))).toBe("something else");
  });
});
