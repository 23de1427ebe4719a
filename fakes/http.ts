// Small helpers shared by the local fakes. Plain node:http, no framework, so the fakes start in
// milliseconds under tsx and vitest and close without leaving sockets behind.
import { createServer, type IncomingMessage, type ServerResponse } from "node:http";
import type { Socket } from "node:net";

export type RequestHandler = (req: IncomingMessage, res: ServerResponse) => Promise<void> | void;

export type RunningServer = { url: string; port: number; close(): Promise<void> };

export class BodyTooLargeError extends Error {
  constructor(readonly limitBytes: number) {
    super(`request body is larger than ${limitBytes} bytes`);
  }
}

export class InvalidJsonError extends Error {}

export async function readBody(req: IncomingMessage, limitBytes = 10 * 1024 * 1024): Promise<Buffer> {
  const chunks: Buffer[] = [];
  let total = 0;
  for await (const chunk of req) {
    const buf = Buffer.isBuffer(chunk) ? chunk : Buffer.from(chunk as string);
    total += buf.length;
    // Keep draining so the client sees our answer instead of a reset connection.
    if (total <= limitBytes) chunks.push(buf);
  }
  if (total > limitBytes) throw new BodyTooLargeError(limitBytes);
  return Buffer.concat(chunks);
}

export async function readJson(req: IncomingMessage, limitBytes?: number): Promise<unknown> {
  const raw = (await readBody(req, limitBytes)).toString("utf8");
  if (raw.trim() === "") return undefined;
  try {
    return JSON.parse(raw) as unknown;
  } catch {
    throw new InvalidJsonError("request body is not valid JSON");
  }
}

export function sendJson(
  res: ServerResponse,
  status: number,
  body: unknown,
  headers: Record<string, string> = {},
): void {
  const text = JSON.stringify(body);
  res.writeHead(status, {
    "content-type": "application/json; charset=utf-8",
    "content-length": Buffer.byteLength(text),
    "cache-control": "no-store",
    ...headers,
  });
  res.end(text);
}

export function sendHtml(
  res: ServerResponse,
  status: number,
  html: string,
  headers: Record<string, string> = {},
): void {
  res.writeHead(status, {
    "content-type": "text/html; charset=utf-8",
    "content-length": Buffer.byteLength(html),
    "cache-control": "no-store",
    ...headers,
  });
  res.end(html);
}

export type CorsOptions = { methods?: string[]; allowHeaders?: string[]; exposeHeaders?: string[] };

// The fakes carry no cookies, so a wildcard origin is enough for browser uploads and fetches.
export function setCors(res: ServerResponse, options: CorsOptions = {}): void {
  res.setHeader("access-control-allow-origin", "*");
  res.setHeader("access-control-allow-methods", (options.methods ?? ["GET", "POST", "OPTIONS"]).join(", "));
  res.setHeader("access-control-allow-headers", (options.allowHeaders ?? ["content-type"]).join(", "));
  if (options.exposeHeaders?.length) res.setHeader("access-control-expose-headers", options.exposeHeaders.join(", "));
  res.setHeader("access-control-max-age", "600");
}

export function requestUrl(req: IncomingMessage): URL {
  return new URL(req.url ?? "/", "http://fake.invalid");
}

export function formatHostForUrl(host: string): string {
  return host.includes(":") && !host.startsWith("[") ? `[${host}]` : host;
}

export type ListenOptions = { port: number; host: string; name: string };

/**
 * Starts a server and returns a close() that ends every socket at once, including streaming
 * responses that would otherwise keep the process (and a test run) alive.
 * A taken port fails with "port N (name) is already in use" and keeps code EADDRINUSE.
 */
export function listen(handler: RequestHandler, options: ListenOptions): Promise<RunningServer> {
  const sockets = new Set<Socket>();
  const server = createServer((req, res) => {
    Promise.resolve()
      .then(() => handler(req, res))
      .catch((error: unknown) => {
        console.error(`[${options.name}] ${req.method} ${req.url} failed:`, error);
        if (!res.headersSent) sendJson(res, 500, { error: "internal error in the local fake" });
        else res.destroy();
      });
  });
  server.on("connection", (socket) => {
    sockets.add(socket);
    socket.on("close", () => sockets.delete(socket));
  });

  return new Promise((resolve, reject) => {
    const onError = (error: NodeJS.ErrnoException) => {
      if (error.code === "EADDRINUSE") {
        reject(Object.assign(new Error(`port ${options.port} (${options.name}) is already in use`), { code: "EADDRINUSE" }));
      } else {
        reject(error);
      }
    };
    server.once("error", onError);
    server.listen(options.port, options.host, () => {
      server.off("error", onError);
      const address = server.address();
      const port = typeof address === "object" && address ? address.port : options.port;
      let closing: Promise<void> | undefined;
      resolve({
        url: `http://${formatHostForUrl(options.host)}:${port}`,
        port,
        close() {
          closing ??= new Promise<void>((done) => {
            server.close(() => done());
            server.closeAllConnections();
            for (const socket of sockets) socket.destroy();
          });
          return closing;
        },
      });
    });
  });
}
