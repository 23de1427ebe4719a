// The local uploads fake against the real uploadthing@7.7.4 server SDK: a route handler from
// createRouteHandler signs the presigned URLs and registers route-metadata, the test plays the
// browser (HEAD, then multipart PUT, as uploadthing/client does), and UTApi makes the management
// calls. The SDK is the reference for the protocol; MD5 (RFC 1321) and HMAC-SHA256 (RFC 2104)
// come from node:crypto, independent of the fake's own code.
import { createHash, createHmac, randomBytes } from "node:crypto";
import { mkdtempSync, rmSync } from "node:fs";
import { request as httpRequest } from "node:http";
import { tmpdir } from "node:os";
import path from "node:path";
import { createRouteHandler, createUploadthing, UTApi, UTFile, type FileRouter } from "uploadthing/server";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { uploadthingEnv } from "@/fakes/uploads/env";
import { startUploadsFake, type UploadsFake } from "@/fakes/uploads/server";
import { listenApp } from "./uploads/route-harness";

const API_KEY = "sk_test_uploads_fake_key";
const APP_ID = "fluxyard-test-app";

type Presigned = { url: string; key: string; name: string; customId: string | null };
type PutAnswer = { url: string; appUrl: string; ufsUrl: string; fileHash: string; serverData: unknown };
type Completed = { file: { key: string; name: string; size: number; type: string; ufsUrl: string; fileHash: string }; metadata: unknown };

const md5 = (bytes: Uint8Array) => createHash("md5").update(bytes).digest("hex");
// Buffer.equals instead of toEqual: deep equality over 300 000 array elements takes seconds.
const sameBytes = (a: ArrayBuffer | Uint8Array, b: Uint8Array) => Buffer.from(a instanceof Uint8Array ? a : new Uint8Array(a)).equals(b);

// PNG signature (ISO/IEC 15948 §5.2) followed by filler: the fake only needs the declared type.
function pngLikeBytes(size: number): Uint8Array {
  const bytes = new Uint8Array(randomBytes(size));
  bytes.set([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  return bytes;
}

function putForm(url: string, bytes: Uint8Array, type: string, headers: Record<string, string> = {}) {
  const form = new FormData();
  form.append("file", new Blob([Buffer.from(bytes)], { type }));
  return fetch(url, { method: "PUT", body: form, headers: { range: "bytes=0-", "x-uploadthing-version": "7.7.4", ...headers } });
}

// Signs a URL the way @uploadthing/shared's generateSignedURL does, with node:crypto.
function signByHand(fakeUrl: string, key: string, fields: Record<string, string | number>, expires: number): string {
  const url = new URL(`${fakeUrl}/${key}`);
  url.searchParams.append("expires", String(expires));
  for (const [name, value] of Object.entries(fields)) url.searchParams.append(name, encodeURIComponent(value));
  const signature = `hmac-sha256=${createHmac("sha256", API_KEY).update(url.toString()).digest("hex")}`;
  url.searchParams.append("signature", signature);
  return url.href;
}

describe("uploads fake", () => {
  let fake: UploadsFake;
  let app: Awaited<ReturnType<typeof listenApp>>;
  let storageDir: string;
  const savedEnv = { ...process.env };
  const completed: Completed[] = [];

  const requestUpload = async (route: "prod" | "dev", file: { name: string; size: number; type: string }): Promise<Presigned> => {
    const response = await fetch(`${app.url}/${route}/api/uploadthing?actionType=upload&slug=photo`, {
      method: "POST",
      headers: { "content-type": "application/json", "x-uploadthing-version": "7.7.4", "x-uploadthing-package": "test" },
      body: JSON.stringify({ files: [{ ...file, lastModified: Date.now() }], input: null }),
    });
    expect(response.status).toBe(200);
    const presigned = (await response.json()) as Presigned[];
    expect(presigned).toHaveLength(1);
    return presigned[0] as Presigned;
  };

  beforeAll(async () => {
    storageDir = mkdtempSync(path.join(tmpdir(), "fluxyard-uploads-fake-"));
    fake = await startUploadsFake({ port: 0, apiKey: API_KEY, appId: APP_ID, storageDir });

    const f = createUploadthing();
    const router = {
      photo: f({ image: { maxFileSize: "1MB", maxFileCount: 1 } })
        .middleware(() => ({ uploadedBy: "builder-7" }))
        .onUploadComplete(({ file, metadata }) => {
          completed.push({ file, metadata });
          return { recordedKey: file.key };
        }),
    } satisfies FileRouter;

    // Reserve the app's address first: the handlers need it as their callback URL.
    const handlers: Record<string, (request: Request) => Promise<Response>> = {};
    app = await listenApp(handlers);
    Object.assign(
      process.env,
      uploadthingEnv({ fakeUrl: fake.url, apiKey: API_KEY, appId: APP_ID, callbackUrl: `${app.url}/prod/api/uploadthing` }),
      { UPLOADTHING_LOG_LEVEL: "Error" },
    );
    // Production mode (`next start`): the fake posts the callback to the app itself.
    handlers["/prod/api/uploadthing"] = createRouteHandler({ router, config: { isDev: false } });
    // Development mode (`next dev`): callbacks travel back over the open route-metadata response.
    handlers["/dev/api/uploadthing"] = createRouteHandler({
      router,
      config: { isDev: true, callbackUrl: `${app.url}/dev/api/uploadthing` },
    });
  });

  afterAll(async () => {
    await app?.close();
    await fake?.close();
    for (const name of Object.keys(process.env)) if (!(name in savedEnv)) delete process.env[name];
    Object.assign(process.env, savedEnv);
    rmSync(storageDir, { recursive: true, force: true });
  });

  it("answers health checks", async () => {
    expect(await (await fetch(`${fake.url}/api/health`)).json()).toEqual({ ok: true, service: "uploads" });
  });

  for (const route of ["prod", "dev"] as const) {
    it(`completes a browser-style upload through the route handler (${route} mode)`, async () => {
      const bytes = pngLikeBytes(300 * 1024);
      const presigned = await requestUpload(route, { name: "scope capture.png", size: bytes.length, type: "image/png" });
      expect(presigned.url.startsWith(`${fake.url}/${presigned.key}?`)).toBe(true);

      // The browser first asks where to resume; CORS must let it read the answer.
      const head = await fetch(presigned.url, { method: "HEAD" });
      expect(head.status).toBe(200);
      expect(head.headers.get("x-ut-range-start")).toBe("0");
      expect(head.headers.get("access-control-expose-headers")).toContain("x-ut-range-start");
      const preflight = await fetch(presigned.url, { method: "OPTIONS" });
      expect(preflight.headers.get("access-control-allow-methods")).toContain("PUT");
      expect(preflight.headers.get("access-control-allow-headers")).toContain("traceparent");

      const before = completed.length;
      const put = await putForm(presigned.url, bytes, "image/png");
      expect(put.status).toBe(200);
      const answer = (await put.json()) as PutAnswer;
      expect(answer.ufsUrl).toBe(`${fake.url}/f/${presigned.key}`);
      expect(answer.fileHash).toBe(md5(bytes));
      // serverData is what onUploadComplete returned, so the PUT waited for the app's result.
      expect(answer.serverData).toEqual({ recordedKey: presigned.key });

      expect(completed).toHaveLength(before + 1);
      const call = completed.at(-1);
      expect(call?.metadata).toEqual({ uploadedBy: "builder-7" });
      expect(call?.file).toMatchObject({
        key: presigned.key,
        name: "scope capture.png",
        size: bytes.length,
        type: "image/png",
        ufsUrl: answer.ufsUrl,
        fileHash: md5(bytes),
      });

      const served = await fetch(answer.ufsUrl);
      expect(served.status).toBe(200);
      expect(served.headers.get("content-type")).toBe("image/png");
      expect(sameBytes(await served.arrayBuffer(), bytes)).toBe(true);
      const byApp = await fetch(answer.appUrl);
      expect(sameBytes(await byApp.arrayBuffer(), bytes)).toBe(true);
    });
  }

  it("refuses a presigned URL whose signature or signed fields were tampered with (403)", async () => {
    const bytes = pngLikeBytes(64);
    const presigned = await requestUpload("prod", { name: "board.png", size: bytes.length, type: "image/png" });

    const url = new URL(presigned.url);
    const signature = url.searchParams.get("signature") ?? "";
    const flipped = signature.slice(0, -1) + (signature.endsWith("0") ? "1" : "0");
    url.searchParams.set("signature", flipped);
    expect((await putForm(url.href, bytes, "image/png")).status).toBe(403);

    const bigger = presigned.url.replace(/x-ut-file-size=\d+/, "x-ut-file-size=999999");
    expect((await putForm(bigger, bytes, "image/png")).status).toBe(403);

    const appended = `${presigned.url}&x-ut-acl=public-read`;
    expect((await putForm(appended, bytes, "image/png")).status).toBe(403);

    expect((await fetch(`${fake.url}/f/${presigned.key}`)).status).toBe(404);
  });

  it("refuses an expired URL (403) and accepts the same signing while it is valid", async () => {
    const bytes = new TextEncoder().encode("bring-up log notes");
    const fields = { "x-ut-identifier": APP_ID, "x-ut-file-name": "notes.txt", "x-ut-file-size": bytes.length, "x-ut-file-type": "text/plain" };

    const expired = signByHand(fake.url, "handSignedExpiredKey", fields, Date.now() - 1_000);
    const refused = await putForm(expired, bytes, "text/plain");
    expect(refused.status).toBe(403);
    expect(((await refused.json()) as { error: string }).error).toContain("expired");

    const valid = signByHand(fake.url, "handSignedValidKey", fields, Date.now() + 60_000);
    const accepted = await putForm(valid, bytes, "text/plain");
    expect(accepted.status).toBe(200);
    expect(((await accepted.json()) as PutAnswer).fileHash).toBe(md5(bytes));
  });

  it("refuses a body larger than the size signed into the URL (413) and stores nothing", async () => {
    const signedFor = 10;
    const url = signByHand(
      fake.url,
      "handSignedOversizeKey",
      { "x-ut-identifier": APP_ID, "x-ut-file-name": "big.bin", "x-ut-file-size": signedFor, "x-ut-file-type": "application/octet-stream" },
      Date.now() + 60_000,
    );
    const response = await putForm(url, new Uint8Array(4096), "application/octet-stream");
    expect(response.status).toBe(413);
    expect((await fetch(`${fake.url}/f/handSignedOversizeKey`)).status).toBe(404);
    expect((await fetch(url, { method: "HEAD" })).headers.get("x-ut-range-start")).toBe("0");
  });

  it("resumes an interrupted upload from the offset its HEAD reports", async () => {
    const bytes = pngLikeBytes(200 * 1024);
    const presigned = await requestUpload("prod", { name: "resumed.png", size: bytes.length, type: "image/png" });
    const boundary = "----fluxyard-test-boundary";
    const target = new URL(presigned.url);

    // Send the part header and the first half, then drop the connection as a flaky network would.
    const half = bytes.length / 2;
    await new Promise<void>((resolve) => {
      const req = httpRequest(target, {
        method: "PUT",
        headers: { "content-type": `multipart/form-data; boundary=${boundary}`, "content-length": String(bytes.length + 500) },
      });
      req.on("error", () => resolve());
      req.write(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="blob"\r\nContent-Type: image/png\r\n\r\n`);
      req.write(bytes.subarray(0, half), () => setTimeout(() => req.destroy(), 50));
      req.on("close", () => resolve());
    });

    let offset = 0;
    for (let attempt = 0; attempt < 50 && offset === 0; attempt++) {
      offset = Number((await fetch(presigned.url, { method: "HEAD" })).headers.get("x-ut-range-start"));
      if (offset === 0) await new Promise((r) => setTimeout(r, 20));
    }
    expect(offset).toBeGreaterThan(0);
    expect(offset).toBeLessThanOrEqual(half);

    const rest = bytes.subarray(offset);
    const put = await putForm(presigned.url, rest, "image/png", { range: `bytes=${offset}-` });
    expect(put.status).toBe(200);
    const answer = (await put.json()) as PutAnswer;
    expect(answer.fileHash).toBe(md5(bytes));
    expect(sameBytes(await (await fetch(answer.ufsUrl)).arrayBuffer(), bytes)).toBe(true);
  });

  it("refuses route-metadata without the API key", async () => {
    const response = await fetch(`${fake.url}/route-metadata`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ fileKeys: ["x"], metadata: {}, isDev: false, callbackUrl: app.url, callbackSlug: "photo", awaitServerData: true }),
    });
    expect(response.status).toBe(401);
  });

  it("serves UTApi uploads and answers its management calls", async () => {
    const utapi = new UTApi();
    const text = "Checkpoint 3: bus at 325 V, bleeder fitted.";
    const uploaded = await utapi.uploadFiles(new UTFile([text], "checkpoint-3.txt", { customId: "log-entry-3" }));
    expect(uploaded.error).toBeNull();
    const data = uploaded.data;
    if (!data) throw new Error("upload failed");
    expect(data.ufsUrl).toBe(`${fake.url}/f/${data.key}`);
    expect(await (await fetch(data.ufsUrl)).text()).toBe(text);

    const listed = await utapi.listFiles();
    expect(listed.files.map((f) => f.key)).toContain(data.key);
    expect(listed.files.find((f) => f.key === data.key)).toMatchObject({ name: "checkpoint-3.txt", customId: "log-entry-3", status: "Uploaded" });

    const urls = await utapi.getFileUrls(data.key);
    expect(urls.data).toEqual([{ key: data.key, url: data.ufsUrl }]);

    // generateSignedURL builds the URL from UPLOADTHING_UFS_HOST and the app id in the path.
    const { ufsUrl: signed } = await utapi.generateSignedURL(data.key, { expiresIn: 60 });
    expect(signed.startsWith(`http://localhost:${new URL(fake.url).port}/a/${APP_ID}/${data.key}?`)).toBe(true);
    expect(await (await fetch(signed)).text()).toBe(text);
    const forged = signed.replace(/signature=[^&]+$/, "signature=hmac-sha256%3D00");
    expect((await fetch(forged)).status).toBe(403);

    const access = await utapi.getSignedURL(data.key);
    expect(await (await fetch(access.ufsUrl)).text()).toBe(text);

    const deleted = await utapi.deleteFiles("log-entry-3", { keyType: "customId" });
    expect(deleted).toMatchObject({ success: true, deletedCount: 1 });
    expect((await fetch(data.ufsUrl)).status).toBe(404);
  });

  it("keeps private files behind a signed URL", async () => {
    const utapi = new UTApi();
    const uploaded = await utapi.uploadFiles(new UTFile(["schematic"], "schematic.pdf"), { acl: "private" });
    const data = uploaded.data;
    if (!data) throw new Error("upload failed");
    expect((await fetch(data.ufsUrl)).status).toBe(403);
    const { ufsUrl } = await utapi.generateSignedURL(data.key);
    const served = await fetch(ufsUrl);
    expect(served.status).toBe(200);
    expect(served.headers.get("content-type")).toBe("application/pdf");
  });
});
