import { deflateSync } from "node:zlib";
import { describe, expect, it } from "vitest";
import { checkPdf } from "@/lib/uploads/pdf-check";
import { handMadePdf, objectStream } from "../../support/files";

// Names and structures from ISO 32000-1: JavaScript actions §12.6.4.16 (/S /JavaScript /JS),
// name escapes §7.3.5 (#xx), object streams §7.5.7, launch actions §12.6.4.5, embedded files
// §7.11.4, encryption dictionary §7.6.1 (/Encrypt in the trailer), end-of-file marker §7.5.5.

describe("checkPdf", () => {
  it("accepts a plain one-page document", () => {
    expect(checkPdf(handMadePdf())).toEqual({ ok: true });
  });

  it("refuses a JavaScript open action", () => {
    const pdf = handMadePdf({ catalogExtra: "/OpenAction << /S /JavaScript /JS (app.alert\\(1\\)) >> " });
    expect(checkPdf(pdf)).toEqual({ ok: false, reason: "it contains embedded JavaScript" });
  });

  it("refuses a document-level script in the /Names tree", () => {
    const pdf = handMadePdf({ catalogExtra: "/Names << /JavaScript 5 0 R >> ", objects: ["<< /Names [(init) 6 0 R] >>", "<< /S /JavaScript /JS 7 0 R >>", "(app.alert\\(1\\))"] });
    expect(checkPdf(pdf)).toEqual({ ok: false, reason: "it contains embedded JavaScript" });
  });

  it("reads names through their #xx escapes", () => {
    // /J#61vaScript is /JavaScript and /J#53 is /JS once decoded.
    const pdf = handMadePdf({ catalogExtra: "/OpenAction << /S /J#61vaScript /J#53 (app.alert\\(1\\)) >> " });
    expect(checkPdf(pdf)).toEqual({ ok: false, reason: "it contains embedded JavaScript" });
  });

  it("does not mistake longer names for /JS", () => {
    const pdf = handMadePdf({ catalogExtra: "/PieceInfo << /JSONExport << /LastModified (D:20240101) >> >> " });
    expect(checkPdf(pdf)).toEqual({ ok: true });
  });

  it("finds a script hidden in a compressed object stream", () => {
    const pdf = handMadePdf({ catalogExtra: "/OpenAction 6 0 R ", objects: [objectStream(6, "<< /S /JavaScript /JS (app.alert\\(1\\)) >>")] });
    // The raw bytes do not show the name: it is only there once inflated.
    expect(pdf.includes("/JavaScript")).toBe(false);
    expect(checkPdf(pdf)).toEqual({ ok: false, reason: "it contains embedded JavaScript" });
  });

  it("accepts a compressed object stream with nothing active in it", () => {
    const pdf = handMadePdf({ objects: [objectStream(5, "<< /Producer (Larkspur bench notes) >>")] });
    expect(checkPdf(pdf)).toEqual({ ok: true });
  });

  it("refuses an object stream it cannot inflate completely", () => {
    const broken = objectStream(5, "<< /S /JavaScript /JS (x) >>");
    const dataStart = broken.indexOf("stream\n") + "stream\n".length;
    const cut = Buffer.concat([broken.subarray(0, dataStart), broken.subarray(dataStart, dataStart + 6), Buffer.from("\nendstream")]);
    const fixedLength = Buffer.from(cut.toString("latin1").replace(/\/Length \d+/, "/Length 6"), "latin1");
    expect(checkPdf(handMadePdf({ objects: [fixedLength] }))).toEqual({
      ok: false,
      reason: "part of it could not be read (a damaged or oversized object stream)",
    });
  });

  it("refuses object streams in a compression it does not read", () => {
    const data = Buffer.from("<< /S /JavaScript /JS (x) >>").toString("hex");
    const stream = `<< /Type /ObjStm /N 1 /First 4 /Filter /ASCIIHexDecode /Length ${data.length} >>\nstream\n${data}\nendstream`;
    expect(checkPdf(handMadePdf({ objects: [stream] }))).toEqual({ ok: false, reason: "it stores objects with a compression that cannot be checked" });
  });

  it("refuses launch actions, embedded files and encrypted documents", () => {
    expect(checkPdf(handMadePdf({ catalogExtra: "/OpenAction << /S /Launch /F (calc.exe) >> " }))).toEqual({
      ok: false,
      reason: "it contains an action that launches a program",
    });
    expect(checkPdf(handMadePdf({ objects: ["<< /Type /EmbeddedFile /Length 0 >>\nstream\n\nendstream"] }))).toEqual({
      ok: false,
      reason: "it contains an embedded file",
    });
    expect(checkPdf(handMadePdf({ trailerExtra: "/Encrypt 9 0 R " }))).toEqual({ ok: false, reason: "it is encrypted or password-protected, so it cannot be checked" });
  });

  it("refuses a truncated file (no %%EOF near the end)", () => {
    const pdf = handMadePdf();
    expect(checkPdf(pdf.subarray(0, Math.floor(pdf.length * 0.7)))).toEqual({
      ok: false,
      reason: "it looks incomplete (no end-of-file marker); it may be truncated",
    });
  });

  it("ignores a compressed content stream's random bytes (only object streams are inflated)", () => {
    const content = deflateSync(Buffer.from("BT (JS) Tj ET /JS"));
    const stream = Buffer.concat([Buffer.from(`<< /Filter /FlateDecode /Length ${content.length} >>\nstream\n`), content, Buffer.from("\nendstream")]);
    expect(checkPdf(handMadePdf({ objects: [stream] }))).toEqual({ ok: true });
  });
});
