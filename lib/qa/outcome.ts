import type { ZodError } from "zod";
import { RateLimitedError } from "@/lib/rate-limit";
import { fieldErrorsFromZod, type FieldErrors } from "@/lib/http/json";

// Every Q&A operation answers with an outcome rather than throwing, so server actions (forms)
// and route handlers (JSON) turn the same result into their own kind of answer.

export type QaStatus = 401 | 403 | 404 | 409 | 422 | 429;

export type QaFailure = { ok: false; status: QaStatus; message: string; fieldErrors?: FieldErrors; retryAfterSeconds?: number };
export type QaOutcome<T extends object = object> = ({ ok: true } & T) | QaFailure;

/** Thrown inside a transaction to roll it back with a domain answer. */
export class QaError extends Error {
  constructor(
    readonly status: QaStatus,
    message: string,
    readonly fieldErrors?: FieldErrors,
  ) {
    super(message);
    this.name = "QaError";
  }
}

/** A refused input: the first problem as the message, every problem under its field. */
export function invalid(error: ZodError): QaError {
  return new QaError(422, error.issues[0]?.message ?? "Some inputs are missing.", fieldErrorsFromZod(error));
}

/** Runs an operation, turning QaError and RateLimitedError into failures; anything else propagates (a 500). */
export async function runQa<T extends object>(operation: () => Promise<T>): Promise<QaOutcome<T>> {
  try {
    return { ok: true, ...(await operation()) };
  } catch (error) {
    if (error instanceof QaError) {
      return { ok: false, status: error.status, message: error.message, ...(error.fieldErrors ? { fieldErrors: error.fieldErrors } : {}) };
    }
    if (error instanceof RateLimitedError) {
      return { ok: false, status: 429, message: error.message, retryAfterSeconds: error.decision.retryAfterSeconds };
    }
    throw error;
  }
}
