import { jsonError } from "@/lib/http/json";

// Moderation bodies are a reason or two; anything larger is not one.
const MAX_BODY_BYTES = 32 * 1024;

/** Reads an optional JSON object body: an empty body is `{}`, so `approve` can be posted bare. */
export async function readOptionalJson(request: Request): Promise<{ ok: true; body: unknown } | { ok: false; response: Response }> {
  const text = await request.text();
  if (new TextEncoder().encode(text).length > MAX_BODY_BYTES) {
    return { ok: false, response: jsonError(413, "payload_too_large", "The request body is too large.") };
  }
  if (text.trim() === "") return { ok: true, body: {} };
  try {
    return { ok: true, body: JSON.parse(text) };
  } catch {
    return { ok: false, response: jsonError(422, "invalid_input", "The request body is not valid JSON.", { "": ["Send a JSON object."] }) };
  }
}
