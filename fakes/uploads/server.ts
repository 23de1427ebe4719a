// Local stand-in for the uploadthing ingest and API, as uploadthing@7.7.4 expects them (read from
// uploadthing/dist/upload-builder-*.js, uploadthing/client and @uploadthing/shared):
//
//   POST /route-metadata   the app's route handler announces the file keys it presigned, with its
//                          middleware metadata and callback URL. Production mode: answer { ok: true }.
//                          Dev mode (isDev): keep the answer open and stream one JSON line
//                          { payload, signature, hook } per finished file; the SDK forwards it to
//                          its own route handler.
//   HEAD /:key?…signature  resume probe: x-ut-range-start is how many bytes are already here.
//   PUT  /:key?…signature  multipart field "file". Signature and expiry are checked (403), the size
//                          signed into the URL is enforced (413), the bytes are stored, then the app
//                          is called back (POST callbackUrl?slug=…, headers uploadthing-hook and
//                          x-uploadthing-signature) and the PUT is answered with
//                          { url, appUrl, ufsUrl, fileHash, serverData } once the app has posted
//                          POST /callback-result { fileKey, callbackData }.
//   POST /v6/…             UTApi management calls (see management-api.ts).
//   GET  /f/:key, /a/:appId/:key   the stored files, with their content type.
//
// Which UPLOADTHING_* variables point the SDK here: see env.ts.
import { createReadStream } from "node:fs";
import type { IncomingMessage, ServerResponse } from "node:http";
import { InvalidJsonError, listen, readBody, readJson, requestUrl, sendJson, setCors } from "../http";
import { createFileStore, isSafeKey, type StoredFile } from "./file-store";
import { fileUrls, handleManagementCall } from "./management-api";
import { boundaryOf, createMultipartReader, type PartInfo } from "./multipart-stream";
import { signedValue, signPayload, verifySignedPath } from "./signing";
import { createUploadRegistry, type CallbackOutcome, type Registration } from "./upload-registry";

export type UploadsFakeOptions = {
  port?: number;
  host?: string;
  /** Must start with "sk_": the SDK's token schema rejects anything else. */
  apiKey: string;
  appId: string;
  /** Where the bytes go; in practice the git-ignored .data/uploads. */
  storageDir: string;
  /** Origin used in the file URLs handed to the app; defaults to the listening address. */
  publicUrl?: string;
  /** How long a PUT waits for the app's onUploadComplete result. */
  callbackTimeoutMs?: number;
};

export type UploadsFake = { url: string; close(): Promise<void> };

const INGEST_CORS = {
  methods: ["GET", "HEAD", "PUT", "POST", "OPTIONS"],
  allowHeaders: ["b3", "traceparent", "x-uploadthing-version", "range", "content-type"],
  exposeHeaders: ["x-ut-range-start"],
};

// How long a PUT that belongs to a route-handler upload waits for its route-metadata (dev mode
// registers in the background while the browser is already uploading).
const REGISTRATION_GRACE_MS = 5_000;

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === "object" && value !== null && !Array.isArray(value);
}

function contentDisposition(kind: string, name: string): string {
  const fallback = name.replace(/[^\x20-\x7e]|["\\]/g, "_");
  return `${kind}; filename="${fallback}"; filename*=UTF-8''${encodeURIComponent(name)}`;
}

function parseRangeStart(header: string | undefined): number | null {
  if (!header) return 0;
  const match = /^bytes=(\d+)-$/.exec(header.trim());
  return match?.[1] === undefined ? null : Number(match[1]);
}

async function drain(req: IncomingMessage): Promise<void> {
  if (req.readableEnded) return;
  try {
    for await (const chunk of req) void chunk;
  } catch {
    // The client went away; nothing to answer.
  }
}

export async function startUploadsFake(options: UploadsFakeOptions): Promise<UploadsFake> {
  const { port = 4030, host = "127.0.0.1", apiKey, appId, storageDir, callbackTimeoutMs = 20_000 } = options;
  if (!apiKey) throw new Error("startUploadsFake needs an apiKey");
  if (!appId) throw new Error("startUploadsFake needs an appId");
  const files = createFileStore(storageDir);
  const registry = createUploadRegistry();
  const shutdown = new AbortController();
  let ownUrl = "";
  let publicUrl = options.publicUrl?.replace(/\/$/, "") ?? "";

  const originsFor = (req: IncomingMessage) =>
    [...new Set([ownUrl, publicUrl, req.headers.host ? `http://${req.headers.host}` : ""])].filter(Boolean);

  const apiKeyOk = (req: IncomingMessage) => req.headers["x-uploadthing-api-key"] === apiKey;

  /** Delivers a hook to the app: over the dev stream when one is open, else by POST. */
  async function notifyApp(registration: Registration, hook: "callback" | "error", body: unknown): Promise<CallbackOutcome> {
    const payload = JSON.stringify(body);
    const signature = signPayload(payload, apiKey);
    const stream = registration.stream;
    if (registration.isDev && stream && !stream.writableEnded) {
      stream.write(`${JSON.stringify({ payload, signature, hook })}\n`);
      return { ok: true, callbackData: null };
    }
    const target = new URL(registration.callbackUrl);
    target.searchParams.set("slug", registration.callbackSlug);
    try {
      const response = await fetch(target, {
        method: "POST",
        headers: { "content-type": "application/json", "uploadthing-hook": hook, "x-uploadthing-signature": signature },
        body: payload,
        signal: AbortSignal.any([shutdown.signal, AbortSignal.timeout(callbackTimeoutMs)]),
      });
      const text = await response.text();
      if (!response.ok) return { ok: false, error: `the app answered ${response.status} to the ${hook} hook: ${text.slice(0, 300)}` };
      return { ok: true, callbackData: null };
    } catch (error) {
      return { ok: false, error: `could not deliver the ${hook} hook to ${target.href}: ${error instanceof Error ? error.message : String(error)}` };
    }
  }

  async function reportFailure(key: string, slug: string | null, error: string): Promise<void> {
    if (!slug) return;
    const registration = await registry.waitForRegistration(key, 0);
    if (!registration) return;
    registry.finish(key);
    const sent = await notifyApp(registration, "error", { fileKey: key, error });
    if (!sent.ok) console.warn(`[uploads fake] ${sent.error}`);
  }

  async function answerUploaded(res: ServerResponse, stored: StoredFile): Promise<void> {
    const urls = fileUrls(publicUrl, appId, stored.key);
    const answer = { ...urls, fileHash: stored.fileHash };
    // Server-side uploads (UTApi.uploadFiles) sign no slug and expect no callback.
    if (!stored.slug) return sendJson(res, 200, { ...answer, serverData: null });

    const registration = await registry.waitForRegistration(stored.key, REGISTRATION_GRACE_MS);
    if (!registration) {
      return sendJson(res, 502, {
        error: `the uploads fake never received route-metadata for ${stored.key}; is the app's UPLOADTHING_INGEST_URL this fake?`,
      });
    }
    const result = registration.awaitServerData ? registry.expectResult(stored.key, callbackTimeoutMs) : undefined;
    const sent = await notifyApp(registration, "callback", {
      status: "uploaded",
      file: { name: stored.name, size: stored.size, type: stored.type, customId: stored.customId, key: stored.key, ...answer },
      origin: ownUrl,
      metadata: registration.metadata,
    });
    registry.finish(stored.key);
    if (!sent.ok) {
      registry.deliverResult(stored.key, sent);
      return sendJson(res, 502, { error: sent.error });
    }
    if (!result) return sendJson(res, 200, { ...answer, serverData: null });
    const outcome = await result;
    if (!outcome.ok) return sendJson(res, 502, { error: outcome.error });
    sendJson(res, 200, { ...answer, serverData: outcome.callbackData });
  }

  async function handlePut(req: IncomingMessage, res: ServerResponse, key: string): Promise<void> {
    const signed = verifySignedPath(req.url ?? "", originsFor(req), apiKey);
    const refuse = async (status: number, error: string) => {
      await drain(req);
      sendJson(res, status, { error }, { connection: "close" });
    };
    if (!signed.ok) return refuse(403, signed.reason);
    const params = signed.params;
    if (signedValue(params, "x-ut-identifier") !== appId) return refuse(403, "the URL was signed for another app");
    const declaredSize = Number(signedValue(params, "x-ut-file-size"));
    if (!Number.isInteger(declaredSize) || declaredSize < 0) return refuse(400, "the URL carries no valid x-ut-file-size");
    const rangeStart = parseRangeStart(req.headers.range);
    if (rangeStart === null) return refuse(416, "only a Range of the form bytes=N- is understood");
    if (rangeStart > 0 && rangeStart !== files.partialSize(key)) {
      return refuse(416, `cannot resume at byte ${rangeStart}: ${files.partialSize(key)} bytes are here`);
    }
    const boundary = boundaryOf(req.headers["content-type"]);
    if (!boundary) return refuse(400, "expected a multipart/form-data body with a file field");

    const slug = signedValue(params, "x-ut-slug");
    let received = 0;
    let oversize = false;
    let sawFile = false;
    let inFile = false;
    let part: PartInfo | undefined;
    let writer: ReturnType<typeof files.openPart> | undefined;
    let malformed: string | undefined;
    const reader = createMultipartReader(boundary, {
      start(info) {
        inFile = info.name === "file" && !sawFile;
        if (!inFile) return;
        sawFile = true;
        part = info;
        writer = files.openPart(key, rangeStart);
      },
      data(chunk) {
        if (!inFile || oversize) return;
        received += chunk.length;
        if (rangeStart + received > declaredSize) oversize = true;
        else writer?.write(chunk);
      },
      end() {
        if (inFile) writer?.close();
        writer = undefined;
        inFile = false;
      },
    });

    try {
      for await (const chunk of req) {
        if (malformed) continue;
        try {
          reader.push(chunk as Buffer);
        } catch (error) {
          malformed = error instanceof Error ? error.message : String(error);
        }
      }
    } catch {
      // The client went away mid-upload: keep what arrived so a HEAD can offer to resume.
      writer?.close();
      return;
    }
    writer?.close();

    if (oversize) {
      files.discardPart(key);
      const error = `the file is larger than the ${declaredSize} bytes signed into the upload URL`;
      void reportFailure(key, slug, error);
      return sendJson(res, 413, { error });
    }
    if (malformed) {
      files.discardPart(key);
      return sendJson(res, 400, { error: malformed });
    }
    if (!sawFile) return sendJson(res, 400, { error: "the multipart body has no file field" });
    if (!reader.complete) return sendJson(res, 400, { error: "the multipart body ended before its closing boundary" });
    if (rangeStart + received !== declaredSize) {
      files.discardPart(key);
      return sendJson(res, 400, { error: `received ${rangeStart + received} bytes, but the upload URL was signed for ${declaredSize}` });
    }

    const disposition = signedValue(params, "x-ut-content-disposition") === "attachment" ? "attachment" : "inline";
    const stored = files.commit(key, {
      name: signedValue(params, "x-ut-file-name") ?? part?.filename ?? key,
      size: declaredSize,
      type: signedValue(params, "x-ut-file-type") || part?.contentType || "application/octet-stream",
      customId: signedValue(params, "x-ut-custom-id"),
      acl: signedValue(params, "x-ut-acl") === "private" ? "private" : "public-read",
      contentDisposition: disposition,
      slug,
    });
    await answerUploaded(res, stored);
  }

  function handleHead(req: IncomingMessage, res: ServerResponse, key: string): void {
    const signed = verifySignedPath(req.url ?? "", originsFor(req), apiKey);
    if (!signed.ok) return sendJson(res, 403, { error: signed.reason });
    res.writeHead(200, { "x-ut-range-start": String(files.partialSize(key)), "content-length": "0" }).end();
  }

  function serveFile(req: IncomingMessage, res: ServerResponse, key: string): void {
    const file = files.get(key);
    if (!file) return sendJson(res, 404, { error: "no such file" });
    const url = requestUrl(req);
    if (url.searchParams.has("signature")) {
      const signed = verifySignedPath(req.url ?? "", originsFor(req), apiKey);
      if (!signed.ok) return sendJson(res, 403, { error: signed.reason });
    } else if (file.acl === "private") {
      return sendJson(res, 403, { error: "this file is private; ask the app for a signed URL" });
    }
    res.writeHead(200, {
      "content-type": file.type,
      "content-length": String(file.size),
      "content-disposition": contentDisposition(file.contentDisposition, file.name),
      "cache-control": "no-cache",
      "x-content-type-options": "nosniff",
      // An uploaded HTML or SVG file must not run script on this origin.
      "content-security-policy": "default-src 'none'; img-src 'self' data:; style-src 'unsafe-inline'; sandbox",
    });
    if (req.method === "HEAD") return void res.end();
    createReadStream(files.bytesPath(key)).on("error", () => res.destroy()).pipe(res);
  }

  async function handleRouteMetadata(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const body = await readJson(req);
    if (!isRecord(body)) return sendJson(res, 400, { error: "expected a JSON object" });
    const keys = Array.isArray(body.fileKeys) ? body.fileKeys.filter((k): k is string => typeof k === "string") : [];
    if (keys.length === 0 || !keys.every(isSafeKey)) return sendJson(res, 400, { error: "fileKeys must be a non-empty list of file keys" });
    if (typeof body.callbackUrl !== "string" || !URL.canParse(body.callbackUrl)) {
      return sendJson(res, 400, { error: "callbackUrl must be an absolute URL" });
    }
    if (typeof body.callbackSlug !== "string") return sendJson(res, 400, { error: "callbackSlug is missing" });
    const registration = {
      keys,
      metadata: isRecord(body.metadata) ? body.metadata : {},
      isDev: body.isDev === true,
      callbackUrl: body.callbackUrl,
      callbackSlug: body.callbackSlug,
      awaitServerData: body.awaitServerData !== false,
    };
    if (!registration.isDev) {
      registry.register(registration);
      return sendJson(res, 200, { ok: true });
    }
    res.writeHead(200, { "content-type": "application/x-ndjson", "cache-control": "no-store" });
    res.flushHeaders();
    registry.register(registration, res);
  }

  async function handleCallbackResult(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const body = await readJson(req);
    if (!isRecord(body) || typeof body.fileKey !== "string") return sendJson(res, 400, { error: "expected { fileKey, callbackData }" });
    registry.deliverResult(
      body.fileKey,
      typeof body.error === "string" ? { ok: false, error: body.error } : { ok: true, callbackData: body.callbackData ?? null },
    );
    sendJson(res, 200, { ok: true });
  }

  async function handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const url = requestUrl(req);
    const path = url.pathname;
    const method = req.method ?? "GET";
    setCors(res, INGEST_CORS);
    if (method === "OPTIONS") return void res.writeHead(204).end();

    if (path === "/api/health" && method === "GET") return sendJson(res, 200, { ok: true, service: "uploads" });

    const isApiCall = path === "/route-metadata" || path === "/callback-result" || path.startsWith("/v6/");
    if (isApiCall) {
      if (method !== "POST") return sendJson(res, 405, { error: `${path} takes POST` });
      if (!apiKeyOk(req)) {
        await readBody(req).catch(() => undefined);
        return sendJson(res, 401, { error: "missing or wrong x-uploadthing-api-key" });
      }
      try {
        if (path === "/route-metadata") return await handleRouteMetadata(req, res);
        if (path === "/callback-result") return await handleCallbackResult(req, res);
        const answer = handleManagementCall(path, await readJson(req), { files, apiKey, appId, publicUrl });
        return sendJson(res, answer.status, answer.body);
      } catch (error) {
        if (error instanceof InvalidJsonError) return sendJson(res, 400, { error: error.message });
        throw error;
      }
    }

    const byKey = /^\/f\/([^/]+)$/.exec(path);
    const byApp = /^\/a\/([^/]+)\/([^/]+)$/.exec(path);
    if ((method === "GET" || method === "HEAD") && (byKey?.[1] || byApp?.[2])) {
      if (byApp && decodeURIComponent(byApp[1] ?? "") !== appId) return sendJson(res, 404, { error: "no such app" });
      return serveFile(req, res, decodeURIComponent((byKey?.[1] ?? byApp?.[2]) as string));
    }

    const ingest = /^\/([^/]+)$/.exec(path);
    const key = ingest?.[1] ? decodeURIComponent(ingest[1]) : undefined;
    if (key && isSafeKey(key)) {
      if (method === "PUT") return handlePut(req, res, key);
      if (method === "HEAD") return handleHead(req, res, key);
    }

    sendJson(res, 404, { error: `nothing at ${method} ${path} in the local uploads fake` });
  }

  const server = await listen(handle, { port, host, name: "uploads fake" });
  ownUrl = server.url;
  if (!publicUrl) publicUrl = server.url;
  return {
    url: server.url,
    async close() {
      shutdown.abort();
      registry.closeAll();
      await server.close();
    },
  };
}
