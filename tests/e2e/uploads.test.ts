// The upload routes of the running app, driven by the uploadthing client SDK in Chromium (its
// uploads use XMLHttpRequest, which Node lacks): same-origin requests to /api/uploadthing with
// the signed-in seller's session, cross-origin HEAD/PUT to the uploads fake with its CORS
// answers. Role refusals are also checked from Node with the session cookie from the browser.
// What a stored photo carries is read with tests/support/files.ts (CIPA DC-008 Exif 2.32).
import path from "node:path";
import { build } from "esbuild";
import pg from "pg";
import sharp from "sharp";
import { genUploader } from "uploadthing/client";
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { DEMO_ACCOUNTS } from "../../db/seed-data";
import { exifSegment, handMadePdf, jpegWithCameraMetadata, plainPng, readExif } from "../support/files";
import { BASE_URL, openBrowser, screenshot, type Session } from "./support/browser";
import { signInThroughOutbox } from "./support/sign-in";

const seller = DEMO_ACCOUNTS.find((a) => a.email === "idunn.winds@larkspur.test")!;
const builder = DEMO_ACCOUNTS.find((a) => a.id === "demo-builder")!;
const UPLOADS_URL = process.env.E2E_UPLOADS_URL ?? "http://127.0.0.1:4130";
const DATABASE_URL = process.env.E2E_DATABASE_URL;

type BrowserFile = { name: string; type: string; base64: string };
type ServerData = { ok: true; key: string; url: string; thumbUrl: string | null; width: number | null; height: number | null; name: string; bytes: number } | { ok: false; message: string };
type BrowserResult =
  | { ok: true; files: { key: string; ufsUrl: string; serverData: ServerData }[]; progress: number[] }
  | { ok: false; code: string; message: string };

// The client SDK as a browser script, exposing one function the test calls in the page.
const ENTRY = `
import { genUploader } from "uploadthing/client";
const { uploadFiles } = genUploader({ url: "/api/uploadthing", package: "fluxyard-e2e" });
const decode = (b64) => Uint8Array.from(atob(b64), (c) => c.charCodeAt(0));
window.__uploadForTest = async (endpoint, files) => {
  const progress = [];
  try {
    const done = await uploadFiles(endpoint, {
      files: files.map((f) => new File([decode(f.base64)], f.name, { type: f.type })),
      onUploadProgress: (p) => progress.push(p.progress),
    });
    return { ok: true, progress, files: done.map((d) => ({ key: d.key, ufsUrl: d.ufsUrl, serverData: d.serverData })) };
  } catch (error) {
    return { ok: false, code: String(error.code ?? ""), message: String(error.message ?? error) };
  }
};
`;

// The two uploaders, mounted by the test in a page of the app (the product has no page of its
// own for them; the listing form places them). Same origin, so the session and the app's CSS apply.
const HARNESS = `
import { createElement, useState } from "react";
import { createRoot } from "react-dom/client";
import { PhotoUploader } from "@/components/uploads/photo-uploader";
import { DocumentUploader } from "@/components/uploads/document-uploader";
function Harness() {
  const [photos, setPhotos] = useState([]);
  const [documents, setDocuments] = useState([]);
  window.__uploaderValues = { photos, documents };
  return createElement("div", { className: "flex flex-col gap-8 bg-paper p-4" },
    createElement(PhotoUploader, { value: photos, onChange: setPhotos, name: "photos" }),
    createElement(DocumentUploader, { value: documents, onChange: setDocuments }));
}
const host = document.createElement("div");
host.id = "uploader-harness";
(document.querySelector("main") ?? document.body).prepend(host);
createRoot(host).render(createElement(Harness));
`;

let clientScript: string;
let harnessScript: string;
let pool: pg.Pool;

async function uploadInPage(s: Session, endpoint: string, files: BrowserFile[]): Promise<BrowserResult> {
  if (!(await s.page.evaluate(() => "__uploadForTest" in window))) await s.page.addScriptTag({ content: clientScript });
  return s.page.evaluate(
    ([e, f]) => (window as unknown as { __uploadForTest: (e: string, f: BrowserFile[]) => Promise<BrowserResult> }).__uploadForTest(e, f),
    [endpoint, files] as const,
  );
}

const asBrowserFile = (name: string, type: string, bytes: Buffer): BrowserFile => ({ name, type, base64: bytes.toString("base64") });

async function cookieHeader(s: Session): Promise<string> {
  return (await s.context.cookies(BASE_URL)).map((c) => `${c.name}=${c.value}`).join("; ");
}

/** genUploader in Node, sending the browser's session cookie; enough for refusals, which come before any PUT. */
function nodeUploader(cookie: string | null) {
  return genUploader({
    url: `${BASE_URL}/api/uploadthing`,
    package: "fluxyard-e2e-node",
    fetch: (input, init) => fetch(input, { ...init, headers: { ...Object.fromEntries(new Headers(init?.headers)), ...(cookie ? { cookie } : {}) } }),
  });
}

beforeAll(async () => {
  if (!DATABASE_URL) throw new Error("E2E_DATABASE_URL is not set: run through `npm test -- --e2e-only`");
  pool = new pg.Pool({ connectionString: DATABASE_URL });
  const bundled = await build({
    stdin: { contents: ENTRY, resolveDir: path.resolve(import.meta.dirname, "../.."), loader: "js" },
    bundle: true,
    format: "iife",
    platform: "browser",
    write: false,
    logLevel: "silent",
    define: { "process.env.NODE_ENV": '"production"' },
  });
  clientScript = bundled.outputFiles[0]!.text;
  const harness = await build({
    stdin: { contents: HARNESS, resolveDir: path.resolve(import.meta.dirname, "../.."), loader: "tsx" },
    bundle: true,
    format: "iife",
    platform: "browser",
    jsx: "automatic",
    write: false,
    logLevel: "silent",
    tsconfig: path.resolve(import.meta.dirname, "../../tsconfig.json"),
    define: { "process.env.NODE_ENV": '"production"' },
    // Next gives client bundles a `process` shim; so does this one.
    banner: { js: "var process = { env: {} };" },
  });
  harnessScript = harness.outputFiles[0]!.text;
});

afterAll(async () => {
  await pool?.end();
});

describe("uploads through the app's route handler", () => {
  let s: Session;
  beforeEach(async () => {
    s = await openBrowser();
  });
  afterEach(async () => {
    await s.close();
  });

  it("a seller's GPS-tagged JPEG is stored without EXIF; a PNG renamed .pdf is refused and removed", async () => {
    await signInThroughOutbox(s.page, seller.email);
    await s.page.goto("/sell");

    const jpeg = await jpegWithCameraMetadata({ width: 1200, height: 900, orientation: 6 });
    expect(readExif(exifSegment(jpeg)!).gps.get(0x0002)).toBe("52/1 31/1 12/1");
    const photo = await uploadInPage(s, "listingPhoto", [asBrowserFile("winding-jig.jpg", "image/jpeg", jpeg)]);
    if (!photo.ok) throw new Error(`photo upload failed: ${photo.message}`);
    const [sent] = photo.files;
    const data = sent!.serverData;
    if (!data.ok) throw new Error(data.message);
    expect(data).toMatchObject({ name: "winding-jig.jpg", width: 900, height: 1200 });
    // The browser saw the bytes go up (the SDK counts the multipart framing too, so it ends at or just over 100).
    expect(photo.progress.at(-1)).toBeGreaterThanOrEqual(100);

    const stored = Buffer.from(await (await fetch(data.url)).arrayBuffer());
    expect((await sharp(stored).metadata()).exif).toBeUndefined();
    expect(exifSegment(stored)).toBeUndefined();
    expect((await fetch(sent!.ufsUrl)).status).toBe(404); // the original, with its GPS, is gone
    expect((await fetch(data.thumbUrl!)).status).toBe(200);
    const { rows } = await pool.query("select owner_id, purpose, width, height from uploads where key = $1", [data.key]);
    expect(rows).toEqual([{ owner_id: seller.id, purpose: "listing-photo", width: 900, height: 1200 }]);

    const png = await plainPng();
    const renamed = await uploadInPage(s, "listingDocument", [asBrowserFile("schematic.pdf", "application/pdf", png)]);
    if (!renamed.ok) throw new Error(`document upload failed: ${renamed.message}`);
    const [refused] = renamed.files;
    expect(refused!.serverData).toEqual({ ok: false, message: "schematic.pdf is a PNG image, not a PDF." });
    expect((await fetch(`${UPLOADS_URL}/f/${refused!.key}`)).status).toBe(404);
    expect((await pool.query("select 1 from uploads where key = $1", [refused!.key])).rowCount).toBe(0);
  });

  it("refuses a member on the listing routes and a visitor everywhere, with words to show", async () => {
    await signInThroughOutbox(s.page, builder.email);
    const member = nodeUploader(await cookieHeader(s));
    const png = await plainPng({ width: 16, height: 16 });
    const file = new File([new Uint8Array(png)], "bench.png", { type: "image/png" });
    await expect(member.uploadFiles("listingPhoto", { files: [file] })).rejects.toMatchObject({
      code: "FORBIDDEN",
      message: "Only sellers can upload listing photos.",
    });
    await expect(nodeUploader(null).uploadFiles("readingPhoto", { files: [file] })).rejects.toMatchObject({
      code: "FORBIDDEN",
      message: "Sign in to upload files.",
    });
    // The same member may upload a reading photo (in the browser, which has XMLHttpRequest).
    const reading = await uploadInPage(s, "readingPhoto", [asBrowserFile("bench.png", "image/png", png)]);
    expect(reading.ok && reading.files[0]?.serverData.ok).toBe(true);
  });
});

describe("the uploader components in Chromium", () => {
  let s: Session;
  beforeEach(async () => {
    s = await openBrowser();
  });
  afterEach(async () => {
    await s.close();
  });

  type Values = { photos: { key: string; url: string; thumbUrl: string; alt: string }[]; documents: { key: string; kind: string; title: string }[] };
  const values = () => s.page.evaluate(() => (window as unknown as { __uploaderValues: Values }).__uploaderValues);

  it("shows progress per file, previews with the cover first, refusals beside the kept files, reorder and remove", async () => {
    await signInThroughOutbox(s.page, seller.email);
    await s.page.goto("/sell");
    await s.page.addScriptTag({ content: harnessScript });
    const photos = s.page.getByTestId("photo-uploader");
    await photos.waitFor();

    // A slow upstream link, so each file's progress bar can be watched (Chrome DevTools Protocol).
    const cdp = await s.context.newCDPSession(s.page);
    await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 20, downloadThroughput: -1, uploadThroughput: 256 * 1024 });

    const first = await jpegWithCameraMetadata({ width: 1200, height: 900, orientation: 1 });
    const second = await plainPng({ width: 900, height: 600 });
    await s.page.getByLabel("Add photos to photos").setInputFiles([
      { name: "first-wind.jpg", mimeType: "image/jpeg", buffer: first },
      { name: "second-wind.png", mimeType: "image/png", buffer: second },
      { name: "cover.jpg", mimeType: "image/jpeg", buffer: Buffer.from("<!doctype html><script>alert(1)</script>") },
    ]);
    const bars = photos.getByRole("progressbar");
    await expect.poll(() => bars.count()).toBeGreaterThanOrEqual(2);
    await expect.poll(async () => Number(await bars.first().getAttribute("aria-valuenow"))).toBeGreaterThan(0);
    await screenshot(s.page, "uploads-progress");
    await cdp.send("Network.emulateNetworkConditions", { offline: false, latency: 0, downloadThroughput: -1, uploadThroughput: -1 });

    await expect.poll(() => photos.getByTestId("uploaded-photo").count(), { timeout: 60_000 }).toBe(2);
    await expect.poll(() => bars.count()).toBe(0);
    // The refused file is named with its reason; the two good ones stay.
    await expect.poll(() => photos.getByTestId("upload-problems").textContent()).toContain("cover.jpg is an HTML page, not a JPEG, PNG or WebP photo.");
    const items = photos.getByTestId("uploaded-photo");
    expect(await items.nth(0).textContent()).toContain("Cover");
    expect(await items.nth(1).textContent()).not.toContain("Cover");
    await s.page.getByLabel("Alt text for photo 1 (cover)").fill("Output choke on the winding jig");
    await screenshot(s.page, "uploads-previews");

    const before = (await values()).photos;
    expect(before).toHaveLength(2);
    expect(before[0]?.alt).toBe("Output choke on the winding jig");
    await s.page.getByRole("button", { name: "Move photo 2 up" }).click();
    const swapped = (await values()).photos;
    expect(swapped.map((p) => p.key)).toEqual([before[1]?.key, before[0]?.key]);
    // The alt text travels with its photo; the cover label stays on whichever photo is first.
    expect(swapped[1]?.alt).toBe("Output choke on the winding jig");
    expect(await items.nth(0).locator("img").getAttribute("src")).toBe(swapped[0]?.thumbUrl);
    const hidden = await photos.locator('input[type="hidden"][name="photos"]').inputValue();
    expect((JSON.parse(hidden) as { key: string }[]).map((p) => p.key)).toEqual(swapped.map((p) => p.key));

    // Dragging the second photo onto the first puts it back in front.
    await items.nth(1).dragTo(items.nth(0));
    await expect.poll(async () => (await values()).photos.map((p) => p.key)).toEqual(before.map((p) => p.key));

    await s.page.getByRole("button", { name: "Remove photo 1" }).click();
    expect((await values()).photos.map((p) => p.key)).toEqual([before[1]?.key]);

    const documents = s.page.getByTestId("document-uploader");
    await s.page.getByLabel("Add PDFs to documents").setInputFiles([
      { name: "power-stage-schematic.pdf", mimeType: "application/pdf", buffer: handMadePdf() },
      { name: "bom.pdf", mimeType: "application/pdf", buffer: await plainPng({ width: 8, height: 8 }) },
    ]);
    await expect.poll(() => documents.getByTestId("uploaded-document").count(), { timeout: 30_000 }).toBe(1);
    await expect.poll(() => documents.getByTestId("upload-problems").textContent()).toContain("bom.pdf is a PNG image, not a PDF.");
    expect(await s.page.getByLabel("Kind of document 1").inputValue()).toBe("schematic");
    expect(await s.page.getByLabel("Title of document 1").inputValue()).toBe("power stage schematic");
    await screenshot(s.page, "uploads-documents");
  });
});
