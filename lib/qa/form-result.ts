import "server-only";
import { AccessDeniedError, requireUser } from "@/lib/auth/guard";
import type { SessionUser } from "@/lib/auth/access";
import type { Role } from "@/db/schema/users";
import type { FormResult } from "@/lib/validations/auth";
import type { QaFailure } from "./outcome";

// The two ends of every Q&A server action: the session guard before, the form's result after.

/** The signed-in person, or the form result that says why not (the form shows it beside the button). */
export async function memberOrRefusal(values: Record<string, string> = {}, roles?: readonly Role[]): Promise<SessionUser | FormResult> {
  try {
    return await requireUser(roles);
  } catch (error) {
    if (error instanceof AccessDeniedError) return { ok: false, message: error.message, fieldErrors: {}, values };
    throw error;
  }
}

export function isRefusal(value: SessionUser | FormResult): value is FormResult {
  return "ok" in value;
}

/** A failed outcome as a form result; `values` go back so what was typed survives React's form reset. */
export function failedForm(outcome: QaFailure, values: Record<string, string> = {}): FormResult {
  return { ok: false, message: outcome.message, fieldErrors: outcome.fieldErrors ?? {}, values };
}

export const formText = (formData: FormData, key: string): string => {
  const v = formData.get(key);
  return typeof v === "string" ? v : "";
};
