// Validates a send request the way the hosted mail API does, so the app meets the same
// 422s locally. Field names are the wire names the resend SDK sends (snake_case).
import type { MailTag, OutgoingMessage } from "./message-store";

export type MailApiError = { statusCode: number; name: string; message: string };

export type ParsedEmail = { ok: true; message: OutgoingMessage } | { ok: false; error: MailApiError };

const MAX_RECIPIENTS = 50;
const BARE_ADDRESS = /^[^\s@<>]+@[^\s@<>]+\.[^\s@<>]+$/;
const NAMED_ADDRESS = /^[^<>]*<\s*([^\s@<>]+@[^\s@<>]+\.[^\s@<>]+)\s*>$/;
const TAG_PART = /^[A-Za-z0-9_-]{1,256}$/;

const invalid = (message: string): ParsedEmail => ({
  ok: false,
  error: { statusCode: 422, name: "validation_error", message },
});
const missing = (field: string): ParsedEmail => ({
  ok: false,
  error: { statusCode: 422, name: "missing_required_field", message: `Missing \`${field}\` field.` },
});

function isAddress(value: string): boolean {
  const trimmed = value.trim();
  return BARE_ADDRESS.test(trimmed) || NAMED_ADDRESS.test(trimmed);
}

function addressError(field: string): ParsedEmail {
  return invalid(
    `Invalid \`${field}\` field. The email address needs to follow the \`email@example.com\` or \`Name <email@example.com>\` format.`,
  );
}

/** Returns the list, or undefined when the field has the wrong shape. */
function addressList(value: unknown): string[] | undefined {
  if (value === undefined || value === null) return [];
  const list = typeof value === "string" ? [value] : value;
  if (!Array.isArray(list) || !list.every((a): a is string => typeof a === "string")) return undefined;
  return list.every(isAddress) ? list.map((a) => a.trim()) : undefined;
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === "object" && value !== null && !Array.isArray(value);
}

export function parseEmailPayload(body: unknown): ParsedEmail {
  if (!isRecord(body)) return invalid("The request body must be a JSON object.");

  if (body.from === undefined || body.from === null || body.from === "") return missing("from");
  if (typeof body.from !== "string" || !isAddress(body.from)) return addressError("from");

  const rawTo = body.to;
  if (rawTo === undefined || rawTo === null || rawTo === "" || (Array.isArray(rawTo) && rawTo.length === 0)) {
    return missing("to");
  }
  const to = addressList(rawTo);
  if (!to) return addressError("to");
  if (to.length > MAX_RECIPIENTS) return invalid(`Too many recipients in \`to\`: the limit is ${MAX_RECIPIENTS}.`);

  const cc = addressList(body.cc);
  if (!cc) return addressError("cc");
  const bcc = addressList(body.bcc);
  if (!bcc) return addressError("bcc");
  const replyTo = addressList(body.reply_to);
  if (!replyTo) return addressError("reply_to");

  if (body.subject === undefined || body.subject === null || body.subject === "") return missing("subject");
  if (typeof body.subject !== "string") return invalid("The `subject` field must be a string.");

  const html = body.html ?? null;
  const text = body.text ?? null;
  if (html !== null && typeof html !== "string") return invalid("The `html` field must be a string.");
  if (text !== null && typeof text !== "string") return invalid("The `text` field must be a string.");
  // A stored template is rendered by the hosted service; the fake keeps the request without a body.
  if (html === null && text === null && !isRecord(body.template)) return invalid("Missing `html` or `text` field.");

  const headers: Record<string, string> = {};
  if (body.headers !== undefined && body.headers !== null) {
    if (!isRecord(body.headers)) return invalid("The `headers` field must be an object of strings.");
    for (const [key, value] of Object.entries(body.headers)) {
      if (typeof value !== "string") return invalid(`The \`headers.${key}\` value must be a string.`);
      headers[key] = value;
    }
  }

  const tags: MailTag[] = [];
  if (body.tags !== undefined && body.tags !== null) {
    if (!Array.isArray(body.tags)) return invalid("The `tags` field must be an array.");
    for (const tag of body.tags as unknown[]) {
      if (!isRecord(tag) || typeof tag.name !== "string" || typeof tag.value !== "string") {
        return invalid("Each tag needs a string `name` and `value`.");
      }
      if (!TAG_PART.test(tag.name) || !TAG_PART.test(tag.value)) {
        return invalid("Tags may only contain ASCII letters, numbers, underscores or dashes, at most 256 characters.");
      }
      tags.push({ name: tag.name, value: tag.value });
    }
  }

  const attachments = Array.isArray(body.attachments)
    ? (body.attachments as unknown[]).filter(isRecord).map((a) => ({
        filename: typeof a.filename === "string" ? a.filename : null,
        contentType: typeof a.content_type === "string" ? a.content_type : null,
      }))
    : [];

  return {
    ok: true,
    message: {
      from: body.from.trim(),
      to,
      cc,
      bcc,
      replyTo,
      subject: body.subject,
      html,
      text,
      headers,
      tags,
      scheduledAt: typeof body.scheduled_at === "string" ? body.scheduled_at : null,
      attachments,
    },
  };
}
