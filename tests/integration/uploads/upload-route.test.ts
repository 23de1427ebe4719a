// The upload routes end to end against the uploads fake and a real PostgreSQL: the app's own file
// router (lib/uploads/file-router.ts) mounted with the SDK's createRouteHandler, the test playing
// the browser. What a stored photo carries is read with tests/support/files.ts's EXIF reader
// (CIPA DC-008 Exif 2.32) and with sharp's metadata(); the fake's listing of stored files is
// the proof that a refusal leaves nothing behind.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import pg from "pg";
import sharp from "sharp";
import { UTApi } from "uploadthing/server";
import { afterAll, beforeAll, beforeEach, describe, expect, it } from "vitest";
import { seedDemo } from "@/db/seed";
import { uploadthingEnv, uploadthingToken } from "@/fakes/uploads/env";
import { startUploadsFake, type UploadsFake } from "@/fakes/uploads/server";
import { CAMERA, exifSegment, handMadePdf, jpegWithCameraMetadata, jpegWithComment, plainPng, readExif } from "../../support/files";
import { freshDatabase } from "../../support/test-database";
import { listenApp, putFile, requestUpload, uploadOne, type FetchHandler, type Presigned } from "./route-harness";

const API_KEY = "sk_test_uploads_route";
const APP_ID = "fluxyard-uploads-route";
const SELLER = "demo-seller-magnetics";
const BUILDER = "demo-builder";
const MB = 1024 * 1024;

type ServerData = { ok: true; key: string; url: string; thumbUrl: string | null; width: number | null; height: number | null; name: string; bytes: number } | { ok: false; message: string };

let database: Awaited<ReturnType<typeof freshDatabase>>;
let pool: pg.Pool;
let fake: UploadsFake;
let app: Awaited<ReturnType<typeof listenApp>>;
let storageDir: string;
let utapi: UTApi;
const savedEnv = { ...process.env };

async function storedKeys(): Promise<string[]> {
  const { files } = await utapi.listFiles({ limit: 500 });
  return files.map((f) => f.key).sort();
}

async function uploadRows(): Promise<{ key: string; owner_id: string; purpose: string }[]> {
  const { rows } = await pool.query("select key, owner_id, purpose, content_type, bytes, thumb_key, width, height, original_name from uploads order by created_at");
  return rows;
}

function serverData(outcome: Awaited<ReturnType<typeof uploadOne>>): ServerData {
  if (outcome.stage !== "done") throw new Error(`expected a finished upload, got ${JSON.stringify(outcome)}`);
  return outcome.serverData as ServerData;
}

beforeAll(async () => {
  database = await freshDatabase("uploads_route");
  await seedDemo(database.url);
  pool = new pg.Pool({ connectionString: database.url });
  storageDir = mkdtempSync(path.join(tmpdir(), "fluxyard-uploads-route-"));
  fake = await startUploadsFake({ port: 0, apiKey: API_KEY, appId: APP_ID, storageDir });

  const handlers: Record<string, FetchHandler> = {};
  app = await listenApp(handlers);
  // The app's modules read these on first use, so they are set before the first import.
  Object.assign(
    process.env,
    uploadthingEnv({ fakeUrl: fake.url, apiKey: API_KEY, appId: APP_ID, callbackUrl: `${app.url}/api/uploadthing` }),
    { DATABASE_URL: database.url, APP_URL: app.url, UPLOADTHING_LOG_LEVEL: "Error" },
  );
  const { _resetEnvForTests } = await import("@/lib/env");
  _resetEnvForTests();

  const { createRouteHandler } = await import("uploadthing/server");
  const { buildUploadRouter } = await import("@/lib/uploads/file-router");
  const { uploadHandlerConfig } = await import("@/lib/uploads/handler-config");
  const { getUserWithRoles } = await import("@/db/queries/users");
  const { decideAccess } = await import("@/lib/auth/access");
  // The same decision the app's session guard makes, with the person named by a test header.
  const router = buildUploadRouter({
    authorize: async (request, anyOf) => {
      const id = request.headers.get("x-test-user");
      return decideAccess(id ? await getUserWithRoles(id) : null, anyOf);
    },
  });
  handlers["/api/uploadthing"] = createRouteHandler({ router, config: { ...uploadHandlerConfig(), isDev: false } });
  utapi = new UTApi({ token: uploadthingToken(API_KEY, APP_ID) });
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

describe("listing photos", () => {
  it("stores a GPS-tagged JPEG re-encoded without any EXIF, plus a thumbnail, and records it for the uploader", async () => {
    const original = await jpegWithCameraMetadata({ width: 640, height: 480, orientation: 6 });
    // The test file really carries what must go: a GPS position and the camera's serial.
    const before = readExif(exifSegment(original)!);
    expect(before.gps.get(0x0002)).toBe("52/1 31/1 12/1");
    expect(before.exif.get(0xa431)).toBe(CAMERA.serial);

    const outcome = await uploadOne(app.url, "listingPhoto", { name: "choke-on-bench.jpg", type: "image/jpeg", bytes: original }, SELLER);
    const data = serverData(outcome);
    if (!data.ok) throw new Error(data.message);
    expect(data).toMatchObject({ name: "choke-on-bench.jpg", width: 480, height: 640 });
    expect(data.key).not.toBe(outcome.stage === "done" ? outcome.key : "");

    const stored = Buffer.from(await (await fetch(data.url)).arrayBuffer());
    const meta = await sharp(stored).metadata();
    expect(meta.format).toBe("jpeg");
    expect(meta.exif).toBeUndefined();
    expect(meta.xmp).toBeUndefined();
    expect(exifSegment(stored)).toBeUndefined();
    for (const secret of [CAMERA.serial, CAMERA.make, CAMERA.model]) expect(stored.includes(secret)).toBe(false);
    // The GPS latitude rational 52/1 31/1 12/1 as EXIF writes it (three big- or little-endian pairs) is gone.
    const rationalLE = Buffer.alloc(24);
    [52, 1, 31, 1, 12, 1].forEach((v, i) => rationalLE.writeUInt32LE(v, i * 4));
    const rationalBE = Buffer.alloc(24);
    [52, 1, 31, 1, 12, 1].forEach((v, i) => rationalBE.writeUInt32BE(v, i * 4));
    expect(original.includes(rationalLE) || original.includes(rationalBE)).toBe(true);
    expect(stored.includes(rationalLE) || stored.includes(rationalBE)).toBe(false);

    const thumb = await sharp(Buffer.from(await (await fetch(data.thumbUrl!)).arrayBuffer())).metadata();
    expect(thumb.format).toBe("webp");
    expect(Math.max(thumb.width ?? 0, thumb.height ?? 0)).toBe(480);
    expect(thumb.exif).toBeUndefined();

    // The original, metadata and all, is gone from the store; the cleaned photo and thumbnail remain.
    if (outcome.stage !== "done") throw new Error("unreachable");
    expect((await fetch(outcome.ufsUrl)).status).toBe(404);
    const keys = await storedKeys();
    expect(keys).not.toContain(outcome.key);
    expect(keys).toEqual(expect.arrayContaining([data.key]));

    const rows = await uploadRows();
    expect(rows.find((r) => r.key === data.key)).toMatchObject({
      owner_id: SELLER,
      purpose: "listing-photo",
      content_type: "image/jpeg",
      width: 480,
      height: 640,
      original_name: "choke-on-bench.jpg",
      bytes: stored.length,
    });
  });

  it("keeps a transparent PNG as WebP", async () => {
    const data = serverData(await uploadOne(app.url, "listingPhoto", { name: "winding.png", type: "image/png", bytes: await plainPng({ alpha: true }) }, SELLER));
    expect(data.ok).toBe(true);
    if (!data.ok) return;
    expect((await sharp(Buffer.from(await (await fetch(data.url)).arrayBuffer())).metadata()).format).toBe("webp");
  });
});

describe("refusals leave no row and no stored file", () => {
  let keysBefore: string[];
  let rowsBefore: number;
  beforeEach(async () => {
    keysBefore = await storedKeys();
    rowsBefore = (await uploadRows()).length;
  });
  const expectNothingKept = async () => {
    expect(await storedKeys()).toEqual(keysBefore);
    expect((await uploadRows()).length).toBe(rowsBefore);
  };

  it("a PNG renamed .pdf on the document route", async () => {
    const outcome = await uploadOne(app.url, "listingDocument", { name: "schematic.pdf", type: "application/pdf", bytes: await plainPng() }, SELLER);
    expect(serverData(outcome)).toEqual({ ok: false, message: "schematic.pdf is a PNG image, not a PDF." });
    await expectNothingKept();
  });

  it("an oversized photo, refused by the route before any byte is sent", async () => {
    const bytes = new Uint8Array(11 * MB);
    bytes.set([0xff, 0xd8, 0xff]);
    const outcome = await uploadOne(app.url, "listingPhoto", { name: "huge.jpg", type: "image/jpeg", bytes }, SELLER);
    expect(outcome).toEqual({ stage: "refused", status: 400, message: "huge.jpg is 11 MB; listing photos can be at most 10 MB." });
    await expectNothingKept();
  });

  it("a body larger than the size signed into the upload URL (413 from the store)", async () => {
    const png = await plainPng();
    const response = await requestUpload(app.url, "listingPhoto", [{ name: "small.png", type: "image/png", bytes: png.subarray(0, 1000) }], SELLER);
    expect(response.status).toBe(200);
    const [presigned] = (await response.json()) as Presigned[];
    const put = await putFile(presigned!, { name: "small.png", type: "image/png", bytes: png });
    expect(put.status).toBe(413);
    await expectNothingKept();
  });

  it("a truncated JPEG", async () => {
    const jpeg = await jpegWithCameraMetadata({ width: 800, height: 600 });
    const outcome = await uploadOne(app.url, "listingPhoto", { name: "cut.jpg", type: "image/jpeg", bytes: jpeg.subarray(0, Math.floor(jpeg.length * 0.6)) }, SELLER);
    expect(serverData(outcome)).toEqual({ ok: false, message: "cut.jpg was not accepted: it could not be decoded completely; it may be truncated or damaged." });
    await expectNothingKept();
  });

  it("a JPEG that also carries a script (polyglot)", async () => {
    const bytes = await jpegWithComment("<?php echo shell_exec($_GET['c']); ?>");
    // It is a valid image: sharp decodes it.
    expect((await sharp(bytes).metadata()).format).toBe("jpeg");
    const outcome = await uploadOne(app.url, "readingPhoto", { name: "scope.jpg", type: "image/jpeg", bytes }, BUILDER);
    expect(serverData(outcome)).toEqual({ ok: false, message: "scope.jpg was not accepted: it hides page markup or script inside the image (<?php)." });
    await expectNothingKept();
  });

  it("an HTML page named as a photo", async () => {
    const bytes = new TextEncoder().encode("<!doctype html><script>fetch('/api/admin/users')</script>");
    const outcome = await uploadOne(app.url, "listingPhoto", { name: "cover.jpg", type: "image/jpeg", bytes }, SELLER);
    expect(serverData(outcome)).toEqual({ ok: false, message: "cover.jpg is an HTML page, not a JPEG, PNG or WebP photo." });
    await expectNothingKept();
  });

  it("a PDF with an embedded JavaScript action", async () => {
    const bytes = handMadePdf({ catalogExtra: "/OpenAction << /S /JavaScript /JS (app.launchURL\\('http://x.invalid'\\)) >> " });
    const outcome = await uploadOne(app.url, "listingDocument", { name: "bom.pdf", type: "application/pdf", bytes }, SELLER);
    expect(serverData(outcome)).toEqual({ ok: false, message: "bom.pdf was not accepted: it contains embedded JavaScript." });
    await expectNothingKept();
  });
});

describe("documents and captures are stored as given", () => {
  it("keeps a clean PDF byte for byte under its own key", async () => {
    const bytes = handMadePdf();
    const outcome = await uploadOne(app.url, "listingDocument", { name: "build-notes.pdf", type: "application/pdf", bytes }, SELLER);
    const data = serverData(outcome);
    expect(data).toMatchObject({ ok: true, thumbUrl: null, width: null, name: "build-notes.pdf", bytes: bytes.length });
    if (!data.ok || outcome.stage !== "done") return;
    expect(data.key).toBe(outcome.key);
    expect(Buffer.from(await (await fetch(data.url)).arrayBuffer()).equals(bytes)).toBe(true);
    expect((await uploadRows()).find((r) => r.key === data.key)).toMatchObject({ purpose: "listing-document", content_type: "application/pdf" });
  });

  it("keeps a CSV capture from a member", async () => {
    const bytes = new TextEncoder().encode("time_s,bus_V\n0.000,325.1\n0.010,324.8\n");
    const data = serverData(await uploadOne(app.url, "capture", { name: "bus.csv", type: "text/csv", bytes }, BUILDER));
    expect(data).toMatchObject({ ok: true, bytes: bytes.length });
  });
});

describe("who may upload", () => {
  it("asks a visitor to sign in", async () => {
    const outcome = await uploadOne(app.url, "readingPhoto", { name: "a.png", type: "image/png", bytes: await plainPng() });
    expect(outcome).toEqual({ stage: "refused", status: 403, message: "Sign in to upload files." });
  });

  it("keeps listing routes to sellers, reading photos to any member", async () => {
    const png = await plainPng();
    expect(await uploadOne(app.url, "listingPhoto", { name: "a.png", type: "image/png", bytes: png }, BUILDER)).toEqual({
      stage: "refused",
      status: 403,
      message: "Only sellers can upload listing photos.",
    });
    expect(await uploadOne(app.url, "listingDocument", { name: "a.pdf", type: "application/pdf", bytes: handMadePdf() }, BUILDER)).toMatchObject({
      stage: "refused",
      status: 403,
    });
    expect(serverData(await uploadOne(app.url, "readingPhoto", { name: "a.png", type: "image/png", bytes: png }, BUILDER))).toMatchObject({ ok: true });
  });

  it("refuses more files than the route takes at once", async () => {
    const png = await plainPng({ width: 8, height: 8 });
    const files = Array.from({ length: 9 }, (_, i) => ({ name: `p${i}.png`, type: "image/png", bytes: png }));
    const response = await requestUpload(app.url, "listingPhoto", files, SELLER);
    expect(response.status).toBe(400);
    expect(((await response.json()) as { message: string }).message).toBe("Upload at most 8 listing photos at a time.");
  });
});

describe("upload queries", () => {
  it("uploadsOwnedBy returns only the caller's own keys, and deleteUpload only deletes the owner's", async () => {
    const { uploadsOwnedBy, deleteUpload } = await import("@/db/queries/uploads");
    const rows = await uploadRows();
    const sellers = rows.filter((r) => r.owner_id === SELLER).map((r) => r.key);
    const builders = rows.filter((r) => r.owner_id === BUILDER).map((r) => r.key);
    expect(sellers.length).toBeGreaterThan(0);
    expect(builders.length).toBeGreaterThan(0);

    const mine = await uploadsOwnedBy(SELLER, [...sellers, ...builders, "no-such-key"]);
    expect(mine.map((u) => u.key).sort()).toEqual([...sellers].sort());
    const photos = await uploadsOwnedBy(SELLER, sellers, { purpose: "listing-photo" });
    expect(photos.every((u) => u.purpose === "listing-photo")).toBe(true);
    expect(photos.length).toBeLessThan(sellers.length);

    expect(await deleteUpload({ key: builders[0]!, ownerId: SELLER })).toBeNull();
    expect(await deleteUpload({ key: builders[0]!, ownerId: BUILDER })).toMatchObject({ key: builders[0] });
    expect((await uploadRows()).some((r) => r.key === builders[0])).toBe(false);
  });
});

describe("discardUpload", () => {
  it("removes the owner's photo row, the stored photo and its thumbnail; refuses anyone else", async () => {
    const { discardUpload } = await import("@/lib/uploads/discard");
    const data = serverData(await uploadOne(app.url, "listingPhoto", { name: "spare.png", type: "image/png", bytes: await plainPng() }, SELLER));
    if (!data.ok) throw new Error(data.message);
    const { rows } = await pool.query("select thumb_key from uploads where key = $1", [data.key]);
    const thumbKey = rows[0]?.thumb_key as string;
    expect((await storedKeys())).toEqual(expect.arrayContaining([data.key, thumbKey]));

    expect(await discardUpload({ key: data.key, ownerId: BUILDER })).toBe(false);
    expect((await uploadRows()).some((r) => r.key === data.key)).toBe(true);

    expect(await discardUpload({ key: data.key, ownerId: SELLER })).toBe(true);
    expect((await uploadRows()).some((r) => r.key === data.key)).toBe(false);
    const keys = await storedKeys();
    expect(keys).not.toContain(data.key);
    expect(keys).not.toContain(thumbKey);
  });
});
