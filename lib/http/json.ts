import type { z } from "zod";
import { EngineeringInputError } from "@/lib/engineering/errors";
import { crossSiteRefusal } from "./cross-site";
import { fieldErrorsFromZod } from "./field-errors";
import { invalidInput, jsonError } from "./json-error";

export { fieldErrorsFromZod, type FieldErrors } from "./field-errors";
export { invalidInput, jsonError, type JsonErrorBody } from "./json-error";

// Calculator and policy bodies are a few hundred bytes; anything this large is not a form.
const MAX_BODY_BYTES = 64 * 1024;

export type ParsedBody<T> = { ok: true; data: T } | { ok: false; response: Response };

const NOT_JSON = "Send the body as JSON, with the header Content-Type: application/json.";

/**
 * A form on another site can post text/plain, urlencoded or multipart bodies without the browser
 * asking first (a CORS "simple request", Fetch standard §3.2.3); `application/json` cannot be sent
 * that way. So a JSON route that insists on it cannot be driven by another site's form.
 */
function isJsonContentType(request: Request): boolean {
  const mediaType = request.headers.get("content-type")?.split(";")[0]?.trim().toLowerCase();
  return mediaType === "application/json";
}

function notJson(): Response {
  return jsonError(415, "unsupported_media_type", NOT_JSON, { "": [NOT_JSON] });
}

/** Reads a JSON body and validates it; on failure `response` is the 403/413/415/422 to send back. */
export async function parseJsonBody<S extends z.ZodType>(
  request: Request,
  schema: S,
): Promise<ParsedBody<z.output<S>>> {
  const crossSite = crossSiteRefusal(request);
  if (crossSite) return { ok: false, response: crossSite };
  const text = await request.text();
  if (new TextEncoder().encode(text).length > MAX_BODY_BYTES) {
    return { ok: false, response: jsonError(413, "payload_too_large", "The request body is too large.") };
  }
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    return { ok: false, response: invalidInput("The request body is not valid JSON.", { "": ["Send a JSON object."] }) };
  }
  // Checked after the syntax, so broken text is a 422 whatever it was labelled; valid JSON sent as a simple request is refused.
  if (!isJsonContentType(request)) return { ok: false, response: notJson() };
  const result = schema.safeParse(raw);
  if (!result.success) {
    return { ok: false, response: invalidInput("Some inputs are missing or out of range.", fieldErrorsFromZod(result.error)) };
  }
  return { ok: true, data: result.data };
}

/**
 * The whole life of a public JSON POST: parse, compute, answer. An EngineeringInputError
 * becomes a 422 on its field (`fieldPrefix` maps it into the body's shape); anything else is
 * logged and answered with a generic 500.
 */
export async function handleJsonPost<S extends z.ZodType>(
  request: Request,
  schema: S,
  /** returns the body to send as JSON, or a ready Response (e.g. a domain 404/422) */
  compute: (input: z.output<S>) => unknown,
  options: { route: string; fieldPrefix?: string } = { route: "api" },
): Promise<Response> {
  const parsed = await parseJsonBody(request, schema);
  if (!parsed.ok) return parsed.response;
  try {
    const result = compute(parsed.data);
    return result instanceof Response ? result : Response.json(result);
  } catch (error) {
    if (error instanceof EngineeringInputError) {
      const field = options.fieldPrefix ? `${options.fieldPrefix}${error.field}` : error.field;
      return invalidInput(error.message, { [field]: [error.message] });
    }
    console.error(`[${options.route}] unexpected error`, error);
    return jsonError(500, "internal_error", "Something went wrong on our side. Please try again.");
  }
}


// Action bodies (a reason or two) are small; anything larger is not one.
const MAX_ACTION_BODY_BYTES = 32 * 1024;

/**
 * Reads an optional JSON object body: an empty body is `{}`, so `approve` can be posted bare. A
 * bare POST still has to come from this site; a body has to be declared JSON.
 */
export async function readOptionalJson(
  request: Request,
  { maxBytes = MAX_ACTION_BODY_BYTES }: { maxBytes?: number } = {},
): Promise<{ ok: true; body: unknown } | { ok: false; response: Response }> {
  const crossSite = crossSiteRefusal(request);
  if (crossSite) return { ok: false, response: crossSite };
  const text = await request.text();
  if (new TextEncoder().encode(text).length > maxBytes) {
    return { ok: false, response: jsonError(413, "payload_too_large", "The request body is too large.") };
  }
  if (text.trim() === "") return { ok: true, body: {} };
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    return { ok: false, response: jsonError(422, "invalid_input", "The request body is not valid JSON.", { "": ["Send a JSON object."] }) };
  }
  if (!isJsonContentType(request)) return { ok: false, response: notJson() };
  return { ok: true, body };
}
