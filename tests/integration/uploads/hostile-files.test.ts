// Hostile files through the real upload routes (the app's file router on the SDK's route handler,
// the uploads fake as the store, a real PostgreSQL), the test playing the browser with the shared
// route harness. Each file is either refused with a message a person can act on — and then nothing
// of it is kept, not a row, not a stored file — or kept only as a re-encoded copy that carries none
// of what it smuggled. The store's folder is read directly after every upload: no file in it, whole
// or partial, may equal what was sent, and none may hold the smuggled marker.
import { createHash } from "node:crypto";
import { mkdtempSync, readdirSync, readFileSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import pg from "pg";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { seedDemo } from "@/db/seed";
import { uploadthingEnv } from "@/fakes/uploads/env";
import { startUploadsFake, type UploadsFake } from "@/fakes/uploads/server";
import { CAMERA, exifSegment, GPS, handMadePdf, jpegWithCameraMetadata, plainPng, plainWebp } from "../../support/files";
import {
  binaryCapture,
  elfHeader,
  FORMULA_CAPTURES,
  gifScriptPolyglot,
  gpsXmp,
  HONEST_CAPTURE,
  htmlBeforePdf,
  jpegHtmlPolyglot,
  jpegWithSvgComment,
  pdfsWithActiveContent,
  pdfWithAppendedZip,
  peHeader,
  photoWithGps,
  pngPixelBomb,
  pngWithAppendedZip,
  pngWithScriptComment,
  SVG_WITH_SCRIPT,
  utf16Capture,
  zipArchive,
} from "../../support/hostile-files";
import { freshDatabase } from "../../support/test-database";
import { listenApp, putFile, requestUpload, uploadOne, type FetchHandler, type Presigned, type TestFile, type UploadOutcome } from "./route-harness";

const API_KEY = "sk_test_hostile_uploads";
const APP_ID = "fluxyard-hostile-uploads";
const SELLER = "demo-seller-magnetics";
const BUILDER = "demo-builder";
const MB = 1024 * 1024;
const PHOTO = "is not a JPEG, PNG or WebP photo";

type Route = "listingPhoto" | "listingDocument" | "readingPhoto" | "capture";
type ServerData = { ok: true; key: string; url: string; thumbUrl: string | null; name: string; bytes: number } | { ok: false; message: string };

let database: Awaited<ReturnType<typeof freshDatabase>>;
let pool: pg.Pool;
let fake: UploadsFake;
let app: Awaited<ReturnType<typeof listenApp>>;
let storageDir: string;
const savedEnv = { ...process.env };

beforeAll(async () => {
  database = await freshDatabase("uploads_hostile");
  await seedDemo(database.url);
  pool = new pg.Pool({ connectionString: database.url });
  // Dropping the database at the end ends any connection still closing; that is not a test failure.
  pool.on("error", () => {});
  storageDir = mkdtempSync(path.join(tmpdir(), "fluxyard-uploads-hostile-"));
  fake = await startUploadsFake({ port: 0, apiKey: API_KEY, appId: APP_ID, storageDir });
  const handlers: Record<string, FetchHandler> = {};
  app = await listenApp(handlers);
  Object.assign(
    process.env,
    uploadthingEnv({ fakeUrl: fake.url, apiKey: API_KEY, appId: APP_ID, callbackUrl: `${app.url}/api/uploadthing` }),
    { DATABASE_URL: database.url, APP_URL: app.url, UPLOADTHING_LOG_LEVEL: "Error" },
  );
  (await import("@/lib/env"))._resetEnvForTests();
  const { createRouteHandler } = await import("uploadthing/server");
  const { buildUploadRouter } = await import("@/lib/uploads/file-router");
  const { uploadHandlerConfig } = await import("@/lib/uploads/handler-config");
  const { getUserWithRoles } = await import("@/db/queries/users");
  const { decideAccess } = await import("@/lib/auth/access");
  const router = buildUploadRouter({
    authorize: async (request, anyOf) => {
      const id = request.headers.get("x-test-user");
      return decideAccess(id ? await getUserWithRoles(id) : null, anyOf);
    },
  });
  handlers["/api/uploadthing"] = createRouteHandler({ router, config: { ...uploadHandlerConfig(), isDev: false } });
});

afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
  await pool?.end();
  await app?.close();
  await fake?.close();
  await database?.drop();
  for (const name of Object.keys(process.env)) if (!(name in savedEnv)) delete process.env[name];
  Object.assign(process.env, savedEnv);
  rmSync(storageDir, { recursive: true, force: true });
});

const sha = (bytes: Uint8Array) => createHash("sha256").update(bytes).digest("hex");

/** Every byte the store holds, finished or partial. */
function storedBlobs(): { name: string; bytes: Buffer }[] {
  return readdirSync(storageDir)
    .filter((name) => name.endsWith(".bin") || name.endsWith(".part"))
    .map((name) => ({ name, bytes: readFileSync(path.join(storageDir, name)) }));
}

async function uploadRows(): Promise<number> {
  const { rows } = await pool.query<{ n: number }>("select count(*)::int as n from uploads");
  return rows[0]?.n ?? 0;
}

/** No stored file equals the upload, and none holds what it smuggled. */
function expectNotStoredAsGiven(file: TestFile, markers: readonly (string | Buffer)[] = []) {
  const original = sha(file.bytes);
  for (const blob of storedBlobs()) {
    expect(sha(blob.bytes), `${file.name} is in the store as given (${blob.name})`).not.toBe(original);
    for (const marker of markers) expect(blob.bytes.includes(marker), `${blob.name} still holds ${String(marker)}`).toBe(false);
  }
}

function messageOf(outcome: UploadOutcome): string {
  if (outcome.stage === "refused") return outcome.message;
  if (outcome.stage === "put-failed") return outcome.error;
  const data = outcome.serverData as ServerData;
  if (data.ok) throw new Error(`expected a refusal, but ${data.name} was kept as ${data.key}`);
  return data.message;
}

/** Uploads a file that must be refused: returns the message; checks nothing of it was kept. */
async function refused(route: Route, file: TestFile, as = route.startsWith("listing") ? SELLER : BUILDER): Promise<string> {
  const rowsBefore = await uploadRows();
  const blobsBefore = storedBlobs().map((b) => b.name).sort();
  const message = messageOf(await uploadOne(app.url, route, file, as));
  expect(await uploadRows(), `${file.name}: a row was recorded`).toBe(rowsBefore);
  expect(storedBlobs().map((b) => b.name).sort(), `${file.name}: something was left in the store`).toEqual(blobsBefore);
  expectNotStoredAsGiven(file);
  return message;
}

/** Uploads a file that may be kept only as a cleaned copy; returns the stored bytes. */
async function cleaned(route: Route, file: TestFile, markers: readonly (string | Buffer)[]): Promise<Buffer> {
  const outcome = await uploadOne(app.url, route, file, route.startsWith("listing") ? SELLER : BUILDER);
  if (outcome.stage !== "done") throw new Error(`${file.name}: ${JSON.stringify(outcome)}`);
  const data = outcome.serverData as ServerData;
  if (!data.ok) throw new Error(`${file.name} was refused: ${data.message}`);
  // The original is gone from the store under its own key; the kept copy has another.
  expect(data.key).not.toBe(outcome.key);
  expect((await fetch(outcome.ufsUrl)).status).toBe(404);
  expectNotStoredAsGiven(file, markers);
  return Buffer.from(await (await fetch(data.url)).arrayBuffer());
}

describe("wrong type by content", () => {
  it("refuses a PDF, programs, a web page, a ZIP and SVG under photo names, saying what each is", async () => {
    expect(await refused("listingPhoto", { name: "scope.png", type: "image/png", bytes: handMadePdf() })).toBe("scope.png is a PDF, not a JPEG, PNG or WebP photo.");
    expect(await refused("readingPhoto", { name: "board.jpg", type: "image/jpeg", bytes: elfHeader() })).toBe("board.jpg is a Linux program, not a JPEG, PNG or WebP photo.");
    expect(await refused("readingPhoto", { name: "board.png", type: "image/png", bytes: peHeader() })).toBe("board.png is a Windows program, not a JPEG, PNG or WebP photo.");
    expect(await refused("listingPhoto", { name: "cover.webp", type: "image/webp", bytes: Buffer.from("<!DOCTYPE html><script>window.__fluxyardUpload=1</script>") })).toBe(
      "cover.webp is an HTML page, not a JPEG, PNG or WebP photo.",
    );
    expect(await refused("readingPhoto", { name: "notes.jpg", type: "image/jpeg", bytes: zipArchive() })).toBe("notes.jpg is a ZIP archive or office document, not a JPEG, PNG or WebP photo.");
    expect(await refused("listingPhoto", { name: "chart.png", type: "image/png", bytes: SVG_WITH_SCRIPT })).toBe("chart.png is an SVG drawing, not a JPEG, PNG or WebP photo.");
  });

  it("refuses SVG declared as SVG before a byte is sent, on every image route", async () => {
    for (const route of ["listingPhoto", "readingPhoto"] as const) {
      const outcome = await uploadOne(app.url, route, { name: "chart.svg", type: "image/svg+xml", bytes: SVG_WITH_SCRIPT }, route === "listingPhoto" ? SELLER : BUILDER);
      expect(outcome).toMatchObject({ stage: "refused", status: 400 });
      expect(messageOf(outcome)).toBe("chart.svg is not a JPEG, PNG or WebP photo.");
    }
    expect(storedBlobs().some((b) => b.bytes.includes("__fluxyardUpload"))).toBe(false);
  });

  it("refuses a ZIP and a photo under document names", async () => {
    expect(await refused("listingDocument", { name: "schematic.pdf", type: "application/pdf", bytes: zipArchive() })).toBe("schematic.pdf is a ZIP archive or office document, not a PDF.");
    expect(await refused("listingDocument", { name: "bom.pdf", type: "application/pdf", bytes: await plainWebp() })).toBe("bom.pdf is a WebP image, not a PDF.");
  });

  it("refuses captures that are not text, and still takes an honest CSV export", async () => {
    const notText = "it holds binary data, not text; export the capture as CSV or tab-separated text";
    expect(await refused("capture", { name: "bus.csv", type: "text/csv", bytes: binaryCapture() })).toBe(`bus.csv was not accepted: ${notText}.`);
    expect(await refused("capture", { name: "bus-utf16.csv", type: "text/csv", bytes: utf16Capture() })).toBe(`bus-utf16.csv was not accepted: ${notText}.`);
    expect(await refused("capture", { name: "scope.dat", type: "application/octet-stream", bytes: elfHeader() })).toBe("scope.dat is a Linux program, not a CSV or text capture.");
    expect(await refused("capture", { name: "trace.csv", type: "text/csv", bytes: await plainPng() })).toBe("trace.csv is a PNG image, not a CSV or text capture.");
    const honest = await uploadOne(app.url, "capture", { name: "bench.csv", type: "text/csv", bytes: Buffer.from(HONEST_CAPTURE) }, BUILDER);
    expect(honest.stage === "done" && (honest.serverData as ServerData).ok).toBe(true);
  });

  it("refuses captures whose cells a spreadsheet would run as formulas (CSV injection)", async () => {
    for (const { what, text } of FORMULA_CAPTURES) {
      const message = await refused("capture", { name: "bus.csv", type: "text/csv", bytes: Buffer.from(text, "latin1") });
      expect(message, what).toBe("bus.csv was not accepted: it contains a spreadsheet formula, which a spreadsheet could run when a reviewer opens the file.");
    }
  });
});

describe("polyglots", () => {
  it("refuses a GIF that is also a script, and images that are also pages", async () => {
    expect(await refused("readingPhoto", { name: "scope.png", type: "image/png", bytes: gifScriptPolyglot() })).toBe("scope.png is a GIF image, not a JPEG, PNG or WebP photo.");
    expect(await refused("readingPhoto", { name: "scope.jpg", type: "image/jpeg", bytes: await jpegHtmlPolyglot() })).toBe(
      "scope.jpg was not accepted: it hides page markup or script inside the image (<html).",
    );
    expect(await refused("listingPhoto", { name: "winding.png", type: "image/png", bytes: await pngWithScriptComment() })).toBe(
      "winding.png was not accepted: it hides page markup or script inside the image (<script).",
    );
  });

  it("keeps an image with an SVG handler in a comment, or a ZIP after its end, only as a re-encoded copy", async () => {
    const svgComment = await jpegWithSvgComment();
    const fromJpeg = await cleaned("readingPhoto", { name: "probe.jpg", type: "image/jpeg", bytes: svgComment }, ["onload", "<svg"]);
    expect((await sharp(fromJpeg).metadata()).format).toBe("jpeg");

    const zipped = await pngWithAppendedZip();
    const fromPng = await cleaned("listingPhoto", { name: "core.png", type: "image/png", bytes: zipped }, [Buffer.from([0x50, 0x4b, 0x03, 0x04]), "payload-after-the-image"]);
    // Re-encoded as a JPEG (no alpha); nothing follows its end-of-image marker (T.81 EOI, FF D9).
    expect((await sharp(fromPng).metadata()).format).toBe("jpeg");
    expect(fromPng.subarray(-2)).toEqual(Buffer.from([0xff, 0xd9]));
  });

  it("refuses documents that are also archives or pages, or that would run something", async () => {
    expect(await refused("listingDocument", { name: "notes.pdf", type: "application/pdf", bytes: pdfWithAppendedZip() })).toBe(
      "notes.pdf was not accepted: it has other data appended after the end of the document.",
    );
    expect(await refused("listingDocument", { name: "notes.pdf", type: "application/pdf", bytes: htmlBeforePdf() })).toBe("notes.pdf is an HTML page, not a PDF.");
    for (const { what, bytes, reason } of pdfsWithActiveContent()) {
      expect(await refused("listingDocument", { name: "bom.pdf", type: "application/pdf", bytes }), what).toBe(`bom.pdf was not accepted: ${reason}.`);
    }
  });
});

describe("oversized files", () => {
  it("refuses each route's oversized files before a byte is sent", async () => {
    const big = (size: number, head: Buffer) => {
      const bytes = new Uint8Array(size);
      bytes.set(head);
      return bytes;
    };
    const cases: [Route, TestFile, string][] = [
      ["readingPhoto", { name: "huge.png", type: "image/png", bytes: big(10.5 * MB, await plainPng()) }, "huge.png is 10.5 MB; reading photos can be at most 10 MB."],
      ["listingDocument", { name: "huge.pdf", type: "application/pdf", bytes: big(21 * MB, handMadePdf()) }, "huge.pdf is 21 MB; listing documents can be at most 20 MB."],
      ["capture", { name: "huge.csv", type: "text/csv", bytes: big(51 * MB, Buffer.from(HONEST_CAPTURE)) }, "huge.csv is 51 MB; captures can be at most 50 MB."],
    ];
    for (const [route, file, message] of cases) {
      const outcome = await uploadOne(app.url, route, file, route === "listingDocument" ? SELLER : BUILDER);
      expect(outcome).toEqual({ stage: "refused", status: 400, message });
    }
  });

  it("refuses a capture body larger than the size signed into its upload URL", async () => {
    const rowsBefore = await uploadRows();
    const csv = Buffer.from(HONEST_CAPTURE.repeat(50));
    const response = await requestUpload(app.url, "capture", [{ name: "short.csv", type: "text/csv", bytes: csv.subarray(0, 100) }], BUILDER);
    expect(response.status).toBe(200);
    const [presigned] = (await response.json()) as Presigned[];
    expect((await putFile(presigned!, { name: "short.csv", type: "text/csv", bytes: csv })).status).toBe(413);
    expect(await uploadRows()).toBe(rowsBefore);
    expectNotStoredAsGiven({ name: "short.csv", type: "text/csv", bytes: csv });
  });

  it("refuses a decompression bomb: a few hundred bytes that claim 1.6 gigapixels", async () => {
    const bomb = pngPixelBomb();
    expect(bomb.length).toBeLessThan(200_000);
    expect(await refused("readingPhoto", { name: "bomb.png", type: "image/png", bytes: bomb })).toBe("bomb.png was not accepted: it is larger than 100 megapixels.");
  });
});

describe("truncated images", () => {
  it("refuses a JPEG, a PNG and a WebP cut short", async () => {
    const cut = (bytes: Buffer) => bytes.subarray(0, Math.floor(bytes.length * 0.6));
    const files: TestFile[] = [
      { name: "cut.jpg", type: "image/jpeg", bytes: cut(await jpegWithCameraMetadata({ width: 800, height: 600 })) },
      { name: "cut.png", type: "image/png", bytes: cut(await plainPng({ width: 800, height: 600 })) },
      { name: "cut.webp", type: "image/webp", bytes: cut(await plainWebp({ width: 800, height: 600 })) },
    ];
    for (const file of files) {
      expect(await refused("readingPhoto", file)).toMatch(new RegExp(`^${file.name.replace(".", "\\.")} was not accepted: it (could not be decoded completely|could not be read as an image)`));
    }
  });
});

describe("photos with a GPS position", () => {
  it("keeps JPEG, PNG and WebP photos only re-encoded, without EXIF, XMP or the position", async () => {
    const jpeg = await sharp(await jpegWithCameraMetadata()).keepExif().withXmp(gpsXmp()).toBuffer();
    const photos: TestFile[] = [
      { name: "bench.jpg", type: "image/jpeg", bytes: jpeg },
      { name: "bench.png", type: "image/png", bytes: await photoWithGps("png") },
      { name: "bench.webp", type: "image/webp", bytes: await photoWithGps("webp") },
    ];
    // Rational 52/1 as EXIF stores it, in either byte order (TIFF 6.0 §2: II or MM).
    const le = Buffer.alloc(8);
    le.writeUInt32LE(52, 0);
    le.writeUInt32LE(1, 4);
    const be = Buffer.alloc(8);
    be.writeUInt32BE(52, 0);
    be.writeUInt32BE(1, 4);
    for (const photo of photos) {
      // The test files really carry the position, in both blocks.
      const before = await sharp(photo.bytes).metadata();
      expect(before.exif, photo.name).toBeDefined();
      expect(before.xmp?.toString("utf8"), photo.name).toContain("GPSLatitude");
      const stored = await cleaned("readingPhoto", photo, ["GPSLatitude", "52,31.2N", "Yardlight", CAMERA.serial]);
      const after = await sharp(stored).metadata();
      expect(after.exif, photo.name).toBeUndefined();
      expect(after.xmp, photo.name).toBeUndefined();
      expect(after.iptc, photo.name).toBeUndefined();
      if (after.format === "jpeg") expect(exifSegment(stored), photo.name).toBeUndefined();
      expect(stored.includes(le) || stored.includes(be), `${photo.name} still has the latitude ${GPS.latitude}`).toBe(false);
    }
  });
});
