import type { QaOutcome } from "./outcome";

const CODES: Record<number, string> = {
  401: "not_signed_in",
  403: "forbidden",
  404: "not_found",
  409: "conflict",
  422: "invalid_input",
  429: "rate_limited",
};

/** The JSON answer for an outcome: the result with `successStatus`, or the failure with its status (429 with Retry-After). */
export function outcomeJson<T extends object>(outcome: QaOutcome<T>, successStatus = 200): Response {
  if (outcome.ok) return Response.json(outcome, { status: successStatus });
  const { status, message, fieldErrors, retryAfterSeconds } = outcome;
  const headers: Record<string, string> = retryAfterSeconds ? { "retry-after": String(retryAfterSeconds) } : {};
  return Response.json(
    { error: CODES[status] ?? "error", message, ...(fieldErrors ? { fieldErrors } : {}), ...(retryAfterSeconds ? { retryAfterSeconds } : {}) },
    { status, headers },
  );
}
