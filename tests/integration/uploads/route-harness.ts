// Serves a fetch-style handler over node:http (the uploads fake must be able to call it back) and
// plays the browser's side of an uploadthing upload the way uploadthing/client does: the upload
// action, a HEAD for the resume offset, then a multipart PUT to the presigned URL.
import { createServer, type Server } from "node:http";
import type { Socket } from "node:net";

export type FetchHandler = (request: Request) => Promise<Response>;

export async function listenApp(handlers: Record<string, FetchHandler>) {
  const sockets = new Set<Socket>();
  const server: Server = createServer(async (req, res) => {
    const chunks: Buffer[] = [];
    for await (const chunk of req) chunks.push(chunk as Buffer);
    const url = new URL(req.url ?? "/", `http://${req.headers.host}`);
    const handler = handlers[url.pathname];
    if (!handler) return void res.writeHead(404).end();
    const headers = new Headers();
    for (const [name, value] of Object.entries(req.headers)) {
      if (typeof value === "string") headers.set(name, value);
      else for (const v of value ?? []) headers.append(name, v);
    }
    const hasBody = req.method !== "GET" && req.method !== "HEAD";
    const response = await handler(new Request(url, { method: req.method, headers, body: hasBody ? Buffer.concat(chunks) : undefined }));
    res.writeHead(response.status, Object.fromEntries(response.headers));
    res.end(Buffer.from(await response.arrayBuffer()));
  });
  server.on("connection", (socket) => {
    sockets.add(socket);
    socket.on("close", () => sockets.delete(socket));
  });
  await new Promise<void>((resolve) => server.listen(0, "127.0.0.1", resolve));
  const address = server.address();
  const port = typeof address === "object" && address ? address.port : 0;
  return {
    url: `http://127.0.0.1:${port}`,
    close: () =>
      new Promise<void>((resolve) => {
        server.close(() => resolve());
        for (const socket of sockets) socket.destroy();
      }),
  };
}

export type TestFile = { name: string; type: string; bytes: Uint8Array; declaredSize?: number };
export type Presigned = { url: string; key: string; name: string };

export type UploadOutcome =
  | { stage: "refused"; status: number; message: string }
  | { stage: "put-failed"; status: number; key: string; error: string }
  | { stage: "done"; key: string; ufsUrl: string; serverData: unknown };

export async function requestUpload(appUrl: string, slug: string, files: TestFile[], userId?: string) {
  return fetch(`${appUrl}/api/uploadthing?actionType=upload&slug=${slug}`, {
    method: "POST",
    headers: {
      "content-type": "application/json",
      "x-uploadthing-version": "7.7.4",
      "x-uploadthing-package": "test",
      ...(userId ? { "x-test-user": userId } : {}),
    },
    body: JSON.stringify({
      files: files.map((f) => ({ name: f.name, size: f.declaredSize ?? f.bytes.length, type: f.type, lastModified: Date.now() })),
      input: null,
    }),
  });
}

export async function putFile(presigned: Presigned, file: TestFile): Promise<Response> {
  await fetch(presigned.url, { method: "HEAD" });
  const form = new FormData();
  form.append("file", new Blob([Buffer.from(file.bytes)], { type: file.type }), file.name);
  return fetch(presigned.url, { method: "PUT", body: form, headers: { range: "bytes=0-", "x-uploadthing-version": "7.7.4" } });
}

/** One file through the whole protocol; stops at the first refusal. */
export async function uploadOne(appUrl: string, slug: string, file: TestFile, userId?: string): Promise<UploadOutcome> {
  const response = await requestUpload(appUrl, slug, [file], userId);
  if (response.status !== 200) {
    const body = (await response.json()) as { message?: string };
    return { stage: "refused", status: response.status, message: body.message ?? "" };
  }
  const [presigned] = (await response.json()) as Presigned[];
  if (!presigned) throw new Error("the route presigned no URL");
  const put = await putFile(presigned, file);
  const answer = (await put.json()) as { ufsUrl?: string; serverData?: unknown; error?: string };
  if (put.status !== 200) return { stage: "put-failed", status: put.status, key: presigned.key, error: answer.error ?? "" };
  return { stage: "done", key: presigned.key, ufsUrl: answer.ufsUrl ?? "", serverData: answer.serverData };
}
