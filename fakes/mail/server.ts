// Local stand-in for the hosted mail API, spoken to by the real `resend` SDK
// (RESEND_BASE_URL=http://127.0.0.1:4010, no trailing slash). Besides the API it keeps an outbox
// for people (GET /) and for tests (/api/messages).
import type { IncomingMessage, ServerResponse } from "node:http";
import { InvalidJsonError, listen, readJson, requestUrl, sendHtml, sendJson, setCors } from "../http";
import { parseEmailPayload, type MailApiError } from "./email-payload";
import { createMessageStore, type StoredMessage } from "./message-store";
import { OUTBOX_CSP, renderMessage, renderNotFound, renderOutbox } from "./outbox-page";

export type MailFakeOptions = {
  port?: number;
  host?: string;
  /** When set, only this key is accepted; otherwise any non-empty Bearer key is. */
  apiKey?: string;
  /** JSON file that keeps the outbox across restarts. */
  storeFile?: string;
};

export type MailFake = { url: string; close(): Promise<void> };

const MAX_BATCH = 100;

function sendError(res: ServerResponse, error: MailApiError): void {
  sendJson(res, error.statusCode, error);
}

/** The hosted API's shape for GET /emails/:id. */
function toApiEmail(m: StoredMessage) {
  return {
    object: "email" as const,
    id: m.id,
    from: m.from,
    to: m.to,
    cc: m.cc.length ? m.cc : null,
    bcc: m.bcc.length ? m.bcc : null,
    reply_to: m.replyTo.length ? m.replyTo : null,
    subject: m.subject,
    html: m.html,
    text: m.text,
    tags: m.tags,
    created_at: m.createdAt,
    scheduled_at: m.scheduledAt,
    last_event: "delivered" as const,
    message_id: `<${m.id}@outbox.fluxyard.localhost>`,
  };
}

function authError(req: IncomingMessage, apiKey: string | undefined): MailApiError | undefined {
  const header = req.headers.authorization ?? "";
  const match = /^Bearer\s+(\S+)$/i.exec(header.trim());
  if (!match) {
    return {
      statusCode: 401,
      name: "missing_api_key",
      message: "Missing API key in the authorization header. Include the header `Authorization: Bearer YOUR_API_KEY`.",
    };
  }
  if (apiKey !== undefined && match[1] !== apiKey) {
    return { statusCode: 403, name: "invalid_api_key", message: "API key is invalid." };
  }
  return undefined;
}

async function readBodyOrError(req: IncomingMessage): Promise<{ body: unknown } | { error: MailApiError }> {
  try {
    return { body: await readJson(req) };
  } catch (error) {
    if (error instanceof InvalidJsonError) {
      return { error: { statusCode: 422, name: "validation_error", message: "The request body is not valid JSON." } };
    }
    throw error;
  }
}

export async function startMailFake(options: MailFakeOptions = {}): Promise<MailFake> {
  const { port = 4010, host = "127.0.0.1", apiKey, storeFile } = options;
  const store = createMessageStore(storeFile);
  let down = false;
  // A test switch: this many accepted sends are stored, then their connection is cut before the
  // answer, as when a network drops the reply; the sender cannot tell it from a failure.
  let answersToLose = 0;
  // The hosted API replays the first answer for a repeated Idempotency-Key.
  const idempotent = new Map<string, { body: string; answer: unknown }>();

  async function handleApi(req: IncomingMessage, res: ServerResponse, path: string): Promise<boolean> {
    if (path !== "/emails" && !path.startsWith("/emails/")) return false;
    if (down) {
      sendError(res, {
        statusCode: 503,
        name: "application_error",
        message: "The local mail fake is in fail mode (POST /api/fail-mode { down: false } to recover).",
      });
      return true;
    }
    const denied = authError(req, apiKey);
    if (denied) {
      sendError(res, denied);
      return true;
    }

    if (req.method === "POST" && (path === "/emails" || path === "/emails/batch")) {
      const read = await readBodyOrError(req);
      if ("error" in read) {
        sendError(res, read.error);
        return true;
      }
      const key = req.headers["idempotency-key"];
      const senderKey = typeof key === "string" && key !== "" ? key : null;
      const idempotencyKey = senderKey ? `${path} ${senderKey}` : undefined;
      const bodyText = JSON.stringify(read.body);
      if (idempotencyKey) {
        const seen = idempotent.get(idempotencyKey);
        if (seen && seen.body !== bodyText) {
          sendError(res, {
            statusCode: 409,
            name: "invalid_idempotent_request",
            message: "This Idempotency-Key was already used with a different request body.",
          });
          return true;
        }
        if (seen) {
          sendJson(res, 200, seen.answer);
          return true;
        }
      }
      const outcome = path === "/emails" ? sendOne(read.body, senderKey) : sendBatch(req, read.body, senderKey);
      if ("error" in outcome) {
        sendError(res, outcome.error);
        return true;
      }
      if (idempotencyKey) idempotent.set(idempotencyKey, { body: bodyText, answer: outcome.answer });
      if (answersToLose > 0) {
        answersToLose -= 1;
        res.socket?.destroy();
        return true;
      }
      sendJson(res, 200, outcome.answer);
      return true;
    }

    if (req.method === "GET" && path === "/emails") {
      sendJson(res, 200, { object: "list", has_more: false, data: store.list().map(toApiEmail) });
      return true;
    }

    const single = /^\/emails\/([^/]+)$/.exec(path);
    if (req.method === "GET" && single?.[1]) {
      const found = store.get(decodeURIComponent(single[1]));
      if (found) sendJson(res, 200, toApiEmail(found));
      else sendError(res, { statusCode: 404, name: "not_found", message: "Email not found." });
      return true;
    }

    sendError(res, { statusCode: 405, name: "method_not_allowed", message: `${req.method} ${path} is not offered by the local mail fake.` });
    return true;
  }

  type SendOutcome = { answer: unknown } | { error: MailApiError };

  function sendOne(body: unknown, senderKey: string | null): SendOutcome {
    const parsed = parseEmailPayload(body);
    if (!parsed.ok) return { error: parsed.error };
    return { answer: { id: store.add(parsed.message, senderKey).id } };
  }

  function sendBatch(req: IncomingMessage, body: unknown, senderKey: string | null): SendOutcome {
    if (!Array.isArray(body) || body.length === 0) {
      return { error: { statusCode: 422, name: "validation_error", message: "The batch must be a non-empty array of emails." } };
    }
    if (body.length > MAX_BATCH) {
      return { error: { statusCode: 422, name: "validation_error", message: `A batch holds at most ${MAX_BATCH} emails.` } };
    }
    const permissive = req.headers["x-batch-validation"] === "permissive";
    const parsed = body.map(parseEmailPayload);
    const firstBad = parsed.findIndex((p) => !p.ok);
    const firstError = parsed[firstBad];
    if (!permissive && firstError && !firstError.ok) {
      return { error: { ...firstError.error, message: `emails[${firstBad}]: ${firstError.error.message}` } };
    }
    const data: { id: string }[] = [];
    const errors: { index: number; message: string }[] = [];
    parsed.forEach((p, index) => {
      if (p.ok) data.push({ id: store.add(p.message, senderKey).id });
      else errors.push({ index, message: p.error.message });
    });
    return { answer: permissive ? { data, errors } : { data } };
  }

  async function handle(req: IncomingMessage, res: ServerResponse): Promise<void> {
    const url = requestUrl(req);
    const path = url.pathname.replace(/\/+$/, "") || "/";
    setCors(res, { methods: ["GET", "POST", "DELETE", "OPTIONS"], allowHeaders: ["authorization", "content-type", "idempotency-key"] });
    if (req.method === "OPTIONS") {
      res.writeHead(204).end();
      return;
    }

    if (await handleApi(req, res, path)) return;

    if (path === "/api/health" && req.method === "GET") return sendJson(res, 200, { ok: true, service: "mail" });

    if (path === "/api/messages") {
      if (req.method === "GET") return sendJson(res, 200, store.list({ to: url.searchParams.get("to") ?? undefined }));
      if (req.method === "DELETE") {
        store.clear();
        return sendJson(res, 200, { ok: true });
      }
    }

    const apiMessage = /^\/api\/messages\/([^/]+)$/.exec(path);
    if (apiMessage?.[1] && req.method === "GET") {
      const found = store.get(decodeURIComponent(apiMessage[1]));
      return found ? sendJson(res, 200, found) : sendJson(res, 404, { error: "no message with that id" });
    }

    if (path === "/api/fail-mode") {
      if (req.method === "GET") return sendJson(res, 200, { down });
      if (req.method === "POST") {
        const read = await readBodyOrError(req);
        const wanted = "body" in read && typeof read.body === "object" && read.body !== null ? (read.body as { down?: unknown }).down : undefined;
        if (typeof wanted !== "boolean") return sendJson(res, 422, { error: "send { down: true } or { down: false }" });
        down = wanted;
        return sendJson(res, 200, { down });
      }
    }

    if (path === "/api/lose-answers") {
      if (req.method === "GET") return sendJson(res, 200, { loseAnswers: answersToLose });
      if (req.method === "POST") {
        const read = await readBodyOrError(req);
        const wanted = "body" in read && typeof read.body === "object" && read.body !== null ? (read.body as { count?: unknown }).count : undefined;
        if (typeof wanted !== "number" || !Number.isInteger(wanted) || wanted < 0) return sendJson(res, 422, { error: "send { count: N } with a whole number N ≥ 0" });
        answersToLose = wanted;
        return sendJson(res, 200, { loseAnswers: answersToLose });
      }
    }

    const pageHeaders = { "content-security-policy": OUTBOX_CSP, "x-content-type-options": "nosniff" };
    if (path === "/" && req.method === "GET") return sendHtml(res, 200, renderOutbox(store.list()), pageHeaders);
    if (path === "/clear" && req.method === "POST") {
      store.clear();
      res.writeHead(303, { location: "/" }).end();
      return;
    }
    const page = /^\/messages\/([^/]+)$/.exec(path);
    if (page?.[1] && req.method === "GET") {
      const found = store.get(decodeURIComponent(page[1]));
      return found ? sendHtml(res, 200, renderMessage(found), pageHeaders) : sendHtml(res, 404, renderNotFound(), pageHeaders);
    }

    sendJson(res, 404, { statusCode: 404, name: "not_found", message: `Nothing at ${req.method} ${path} in the local mail fake.` });
  }

  const server = await listen(handle, { port, host, name: "mail fake" });
  return { url: server.url, close: () => server.close() };
}
