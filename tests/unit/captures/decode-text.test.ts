// Capture files in UTF-8 and in Windows-1252. The byte values are those of the Unicode Standard's
// UTF-8 encoding form (U+00B5 MICRO SIGN is C2 B5) and of the WHATWG Encoding Standard's
// windows-1252 index (byte B5 is U+00B5, byte 80 is U+20AC).
import { describe, expect, it } from "vitest";
import { decodeCaptureText } from "@/lib/captures/decode-text";
import { parseCaptureCsv } from "@/lib/engineering";

describe("capture text", () => {
  it("reads UTF-8, and Windows-1252 where the bytes are not UTF-8", () => {
    expect(decodeCaptureText(Uint8Array.from([0x54, 0x20, 0x28, 0xc2, 0xb5, 0x73, 0x29]))).toBe("T (µs)");
    expect(decodeCaptureText(Uint8Array.from([0x54, 0x20, 0x28, 0xb5, 0x73, 0x29]))).toBe("T (µs)");
    expect(decodeCaptureText(Uint8Array.from([0x80]))).toBe("€");
  });

  it("keeps an ANSI file's time unit, so its times are read in microseconds", () => {
    const ansi = Buffer.from("Time (\xb5s),CH1 (V)\n0,0\n1,15\n2,0\n3,15\n", "latin1");
    const parsed = parseCaptureCsv(decodeCaptureText(ansi));
    expect(parsed.sampleIntervalS).toBeCloseTo(1e-6, 15);
  });
});
