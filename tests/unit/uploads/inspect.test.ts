import { describe, expect, it } from "vitest";
import { inspectUpload, safeFileName } from "@/lib/uploads/inspect";
import { refuseDeclaredFile, MB } from "@/lib/uploads/limits";
import { handMadePdf, jpegWithComment, plainPng, jpegWithCameraMetadata } from "../../support/files";

const text = (value: string) => new Uint8Array(Buffer.from(value, "latin1"));

describe("inspectUpload: the content decides, not the name", () => {
  it("refuses a PNG renamed .pdf on the document route, saying what it is", async () => {
    expect(inspectUpload("listing-document", await plainPng(), "schematic.pdf")).toEqual({
      ok: false,
      message: "schematic.pdf is a PNG image, not a PDF.",
    });
  });

  it("refuses HTML and SVG named as photos", () => {
    expect(inspectUpload("listing-photo", text("<!doctype html><script>alert(1)</script>"), "board.jpg")).toEqual({
      ok: false,
      message: "board.jpg is an HTML page, not a JPEG, PNG or WebP photo.",
    });
    expect(inspectUpload("reading-photo", text('<svg xmlns="http://www.w3.org/2000/svg"/>'), "scope.png")).toMatchObject({ ok: false });
  });

  it("refuses a PDF on the photo route and a photo on the document route", async () => {
    expect(inspectUpload("listing-photo", handMadePdf(), "cover.jpg")).toEqual({ ok: false, message: "cover.jpg is a PDF, not a JPEG, PNG or WebP photo." });
    expect(inspectUpload("listing-document", await jpegWithCameraMetadata({ width: 8, height: 8 }), "bom.pdf")).toMatchObject({ ok: false });
  });

  it("refuses a valid JPEG that also carries a script (a polyglot)", async () => {
    expect(inspectUpload("listing-photo", await jpegWithComment("<script>alert(document.cookie)</script>"), "choke.jpg")).toEqual({
      ok: false,
      message: "choke.jpg was not accepted: it hides page markup or script inside the image (<script).",
    });
  });

  it("refuses a PDF with JavaScript and keeps a clean one", () => {
    expect(inspectUpload("listing-document", handMadePdf({ catalogExtra: "/OpenAction << /S /JavaScript /JS (x) >> " }), "bom.pdf")).toEqual({
      ok: false,
      message: "bom.pdf was not accepted: it contains embedded JavaScript.",
    });
    expect(inspectUpload("listing-document", handMadePdf(), "bom.pdf")).toEqual({ ok: true, kind: "pdf" });
  });

  it("accepts photos by content whatever their name, and takes captures as data", async () => {
    expect(inspectUpload("listing-photo", await plainPng(), "photo.jpeg")).toEqual({ ok: true, kind: "photo", content: "png" });
    expect(inspectUpload("capture", text("t,v\n0,325\n"), "bus.csv")).toEqual({ ok: true, kind: "capture" });
    expect(inspectUpload("capture", text("t,v\n<script>x</script>"), "bus.csv")).toMatchObject({ ok: false });
  });

  it("refuses an empty file", () => {
    expect(inspectUpload("capture", new Uint8Array(), "empty.csv")).toEqual({ ok: false, message: "empty.csv was not accepted: the file is empty." });
  });
});

describe("safeFileName", () => {
  it("keeps the base name and drops paths and control characters", () => {
    expect(safeFileName("C:\\photos\\board.jpg")).toBe("board.jpg");
    expect(safeFileName("../../etc/passwd")).toBe("passwd");
    expect(safeFileName("a\u0000b<c>.pdf")).toBe("abc.pdf");
    expect(safeFileName("   ")).toBe("file");
    expect(safeFileName("x".repeat(300))).toHaveLength(120);
  });
});

describe("refuseDeclaredFile: what the browser declares", () => {
  it("refuses a photo over 10 MB (uploadthing's MB is 1024² bytes) and takes one at the limit", () => {
    expect(refuseDeclaredFile("listingPhoto", { name: "big.jpg", size: 12.3 * MB, type: "image/jpeg" })).toBe(
      "big.jpg is 12.3 MB; listing photos can be at most 10 MB.",
    );
    expect(refuseDeclaredFile("listingPhoto", { name: "edge.jpg", size: 10 * MB + 1, type: "image/jpeg" })).toMatch(/at most 10 MB/);
    expect(refuseDeclaredFile("listingPhoto", { name: "ok.jpg", size: 10 * MB, type: "image/jpeg" })).toBeNull();
    expect(refuseDeclaredFile("listingDocument", { name: "bom.pdf", size: 21 * MB, type: "application/pdf" })).toBe(
      "bom.pdf is 21 MB; listing documents can be at most 20 MB.",
    );
  });

  it("refuses declared types the route does not take, such as SVG, GIF, HEIC or an HTML capture", () => {
    for (const type of ["image/svg+xml", "image/gif", "image/heic"]) {
      expect(refuseDeclaredFile("listingPhoto", { name: "x", size: 10, type })).toBe("x is not a JPEG, PNG or WebP photo.");
    }
    expect(refuseDeclaredFile("capture", { name: "page.html", size: 10, type: "text/html" })).toBe("page.html is not a CSV, text or raw data file.");
    expect(refuseDeclaredFile("capture", { name: "scope.dat", size: 10, type: "" })).toBeNull();
  });
});
