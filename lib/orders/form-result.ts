import type { FormResult } from "@/lib/validations/auth";
import type { z } from "zod";
import { OrderError } from "./errors";

// How the order forms' server actions answer: a refusal becomes a message (beside its field when it
// names one); anything unexpected is logged and answered with a generic message.

export function zodFormResult<F extends string>(error: z.ZodError): FormResult<F> {
  const fieldErrors: Partial<Record<F, string[]>> = {};
  for (const issue of error.issues) {
    const key = String(issue.path[0] ?? "") as F;
    (fieldErrors[key] ??= []).push(issue.message);
  }
  return { ok: false, message: error.issues[0]?.message ?? "Check the form and try again.", fieldErrors };
}

export function errorFormResult<F extends string>(error: unknown, where: string): FormResult<F> {
  if (error instanceof OrderError) {
    const fieldErrors = (error.field ? { [error.field]: [error.message] } : {}) as Partial<Record<F, string[]>>;
    return { ok: false, message: error.message, fieldErrors };
  }
  // The guard's AccessDeniedError (401/403) carries a message meant for the person.
  if (error instanceof Error && error.name === "AccessDeniedError") return { ok: false, message: error.message, fieldErrors: {} };
  console.error(`[orders/${where}]`, error);
  return { ok: false, message: "Something went wrong on our side. Reload the page to see where the order stands, then try again.", fieldErrors: {} };
}
