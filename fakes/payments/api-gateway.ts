// The `/v1/…` front door: outage switch, API key, idempotency, decoding, dispatch.
import type { IncomingMessage, ServerResponse } from "node:http";
import { ApiError } from "./api-error";
import { accountLinkRoutes } from "./api/account-links";
import { accountRoutes } from "./api/accounts";
import { chargeRoutes } from "./api/charges";
import { checkoutSessionRoutes } from "./api/checkout-sessions";
import { eventRoutes } from "./api/events";
import { paymentIntentRoutes } from "./api/payment-intents";
import { refundRoutes } from "./api/refunds";
import { transferRoutes } from "./api/transfers";
import type { FakeContext, Origin } from "./context";
import { decodeFormBody, FormDecodeError, type FormObject } from "./form-body";
import { sendRaw } from "./http-util";
import { newId } from "./ids";
import { matchRoute, pathKnown, type Route } from "./router";

const ROUTES: readonly Route[] = [
  ...accountRoutes,
  ...accountLinkRoutes,
  ...checkoutSessionRoutes,
  ...paymentIntentRoutes,
  ...chargeRoutes,
  ...refundRoutes,
  ...transferRoutes,
  ...eventRoutes,
];

const MAX_IDEMPOTENCY_KEY_LENGTH = 255;

interface Reply {
  status: number;
  text: string;
  replayed: boolean;
}

function errorReply(error: ApiError): Reply {
  return { status: error.status, text: JSON.stringify(error.toBody()), replayed: false };
}

/** Accepts `Bearer sk_test_…` and the `Basic` form a curl user would send. */
export function apiKeyFrom(req: IncomingMessage): string | undefined {
  const header = req.headers.authorization;
  if (!header) return undefined;
  const [scheme, value] = header.split(/\s+/, 2);
  if (!scheme || !value) return undefined;
  if (scheme.toLowerCase() === "bearer") return value;
  if (scheme.toLowerCase() === "basic") return Buffer.from(value, "base64").toString("utf8").split(":")[0];
  return undefined;
}

function checkApiKey(req: IncomingMessage): ApiError | undefined {
  const key = apiKeyFrom(req);
  if (!key) {
    return new ApiError(
      401,
      "invalid_request_error",
      "You did not provide an API key. Send it in the Authorization header using Bearer auth (e.g. 'Authorization: Bearer YOUR_SECRET_KEY').",
    );
  }
  if (!key.startsWith("sk_test_") || key.length <= "sk_test_".length) {
    const shown = key.length > 8 ? `${key.slice(0, 8)}****${key.slice(-4)}` : "****";
    return new ApiError(401, "invalid_request_error", `Invalid API Key provided: ${shown}. The local payments fake accepts only test secret keys (sk_test_…).`, "api_key_invalid");
  }
  return undefined;
}

export function handleApi(
  ctx: FakeContext,
  req: IncomingMessage,
  res: ServerResponse,
  url: URL,
  rawBody: string,
  down: boolean,
): void {
  const requestId = newId("req", 14);
  const apiVersion = (req.headers["stripe-version"] as string | undefined) ?? ctx.defaultApiVersion;
  const idempotencyKey = (req.headers["idempotency-key"] as string | undefined) ?? null;
  const reply = respond(ctx, req, url, rawBody, down, { requestId, idempotencyKey, apiVersion });
  const headers: Record<string, string> = {
    "Content-Type": "application/json",
    "Request-Id": requestId,
    "Stripe-Version": apiVersion,
  };
  if (idempotencyKey && req.method === "POST") headers["Idempotency-Key"] = idempotencyKey;
  if (reply.replayed) headers["Idempotent-Replayed"] = "true";
  sendRaw(res, reply.status, reply.text, headers);
}

function respond(ctx: FakeContext, req: IncomingMessage, url: URL, rawBody: string, down: boolean, origin: Origin): Reply {
  if (down) {
    return errorReply(new ApiError(503, "api_error", "The payments service is temporarily unavailable (simulated outage on the local fake)."));
  }
  const authError = checkApiKey(req);
  if (authError) return errorReply(authError);
  const method = req.method ?? "GET";
  const path = url.pathname;
  const matched = matchRoute(ROUTES, method, path);
  if (!matched) {
    const message = pathKnown(ROUTES, path)
      ? `The local payments fake does not support ${method} on ${path}.`
      : `Unrecognized request URL (${method}: ${path}).`;
    return errorReply(new ApiError(404, "invalid_request_error", message));
  }
  const key = origin.idempotencyKey;
  if (method === "POST" && key) {
    if (key.length > MAX_IDEMPOTENCY_KEY_LENGTH) {
      return errorReply(new ApiError(400, "invalid_request_error", `Idempotency-Key is longer than ${MAX_IDEMPOTENCY_KEY_LENGTH} characters.`, "idempotency_key_too_long"));
    }
    const saved = ctx.store.state.idempotency[key];
    if (saved) {
      if (saved.method !== method || saved.path !== path || saved.body !== rawBody) {
        return errorReply(
          new ApiError(
            400,
            "idempotency_error",
            `Keys for idempotent requests can only be used with the same parameters and endpoint they were first used with. Try using a key other than '${key}' if you meant to execute a different request.`,
          ),
        );
      }
      return { status: saved.status, text: saved.response, replayed: true };
    }
  }
  let input: FormObject;
  try {
    input = decodeFormBody(method === "POST" ? rawBody : url.search.slice(1));
  } catch (error) {
    if (error instanceof FormDecodeError) return errorReply(new ApiError(400, "invalid_request_error", error.message));
    throw error;
  }
  const reply = run(ctx, matched.route, matched.params, input, origin);
  // What ran is kept for the key: a success, or a decline after a charge was attempted.
  // Requests refused before anything happened are not, so the caller can fix and retry.
  if (method === "POST" && key && (reply.status === 200 || reply.status === 402)) {
    ctx.store.state.idempotency[key] = { method, path, body: rawBody, status: reply.status, response: reply.text, created: ctx.clock.now() };
    ctx.store.pruneIdempotency(ctx.clock.now());
    ctx.store.changed();
  }
  return reply;
}

function run(ctx: FakeContext, route: Route, params: Record<string, string>, input: FormObject, origin: Origin): Reply {
  try {
    const body = route.handler({ ctx, params, input, origin });
    return { status: 200, text: JSON.stringify(body), replayed: false };
  } catch (error) {
    if (error instanceof ApiError) return errorReply(error);
    ctx.log(`payments fake: ${route.method} ${route.pattern} failed: ${(error as Error).stack ?? String(error)}`);
    return errorReply(new ApiError(500, "api_error", "The local payments fake hit an internal error; see its log."));
  }
}
