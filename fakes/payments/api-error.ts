// Errors in the payments API's own shape, so the SDK raises the matching error class
// (400/404 → StripeInvalidRequestError, 401 → StripeAuthenticationError, 402 → StripeCardError).

export type ApiErrorType = "invalid_request_error" | "api_error" | "card_error" | "idempotency_error";

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly type: ApiErrorType,
    message: string,
    readonly code?: string,
    readonly param?: string,
    readonly extra: Record<string, unknown> = {},
  ) {
    super(message);
  }

  toBody(): { error: Record<string, unknown> } {
    return {
      error: { type: this.type, message: this.message, code: this.code, param: this.param, ...this.extra },
    };
  }
}

export function invalidParam(param: string, message: string, code = "parameter_invalid"): ApiError {
  return new ApiError(400, "invalid_request_error", message, code, param);
}

export function missingParam(param: string): ApiError {
  return new ApiError(400, "invalid_request_error", `Missing required param: ${param}.`, "parameter_missing", param);
}

export function noSuch(kind: string, id: string, param = "id"): ApiError {
  return new ApiError(404, "invalid_request_error", `No such ${kind}: '${id}'`, "resource_missing", param);
}

export function unexpectedState(kind: string, message: string, param?: string): ApiError {
  return new ApiError(400, "invalid_request_error", message, `${kind}_unexpected_state`, param);
}
