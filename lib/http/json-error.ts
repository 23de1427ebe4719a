// The JSON error shape every route answers with: a code for programs, a sentence for people, and
// the field errors a form shows beside its inputs.

import type { FieldErrors } from "./field-errors";

export type { FieldErrors } from "./field-errors";

export interface JsonErrorBody {
  error: string;
  message: string;
  fieldErrors?: FieldErrors;
}

export function jsonError(status: number, code: string, message: string, fieldErrors?: FieldErrors): Response {
  const body: JsonErrorBody = fieldErrors ? { error: code, message, fieldErrors } : { error: code, message };
  return Response.json(body, { status });
}

export function invalidInput(message: string, fieldErrors: FieldErrors = {}): Response {
  return jsonError(422, "invalid_input", message, fieldErrors);
}
