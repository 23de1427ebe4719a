import type { IncomingMessage, ServerResponse } from "node:http";

export class BodyTooLargeError extends Error {}

const MAX_BODY_BYTES = 1024 * 1024;

export function readBody(req: IncomingMessage): Promise<string> {
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    req.on("data", (chunk: Buffer) => {
      size += chunk.length;
      if (size > MAX_BODY_BYTES) {
        reject(new BodyTooLargeError("Request body larger than 1 MiB."));
        req.destroy();
        return;
      }
      chunks.push(chunk);
    });
    req.on("end", () => resolve(Buffer.concat(chunks).toString("utf8")));
    req.on("error", reject);
  });
}

export function sendJson(res: ServerResponse, status: number, body: unknown, headers: Record<string, string> = {}): void {
  sendRaw(res, status, JSON.stringify(body), { "Content-Type": "application/json", ...headers });
}

export function sendRaw(res: ServerResponse, status: number, text: string, headers: Record<string, string>): void {
  const payload = Buffer.from(text, "utf8");
  res.writeHead(status, { ...headers, "Content-Length": String(payload.length), "Cache-Control": "no-store" });
  res.end(payload);
}

export function sendHtml(res: ServerResponse, status: number, html: string): void {
  sendRaw(res, status, html, { "Content-Type": "text/html; charset=utf-8" });
}

/** 303 so the browser follows a form POST with a GET. */
export function redirect(res: ServerResponse, location: string): void {
  res.writeHead(303, { Location: location, "Content-Length": "0", "Cache-Control": "no-store" });
  res.end();
}

export function parseJsonObject(text: string): Record<string, unknown> | undefined {
  if (text.trim() === "") return {};
  try {
    const value: unknown = JSON.parse(text);
    return typeof value === "object" && value !== null && !Array.isArray(value) ? (value as Record<string, unknown>) : undefined;
  } catch {
    return undefined;
  }
}
