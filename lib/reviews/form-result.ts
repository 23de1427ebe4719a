import "server-only";
import type { z } from "zod";
import { ReviewError } from "@/db/queries/reviews";
import { AccessDeniedError } from "@/lib/auth/guard";
import { fieldErrorsFromZod } from "@/lib/http/json";
import { PaymentsUnavailableError } from "@/lib/payments/connect";
import type { FormResult } from "@/lib/validations/auth";

// How the review forms' server actions answer: a refusal in the person's words (beside its field when
// it names one); anything unexpected is logged and answered with a generic message.

export type ReviewFormResult = FormResult & { values?: Record<string, string> };

export function invalidReviewForm(error: z.ZodError, values?: Record<string, string>): ReviewFormResult {
  return { ok: false, message: "Some entries need fixing; they are marked beside each field. Nothing was saved.", fieldErrors: fieldErrorsFromZod(error), ...(values ? { values } : {}) };
}

export function reviewFailure(error: unknown, where: string, values?: Record<string, string>): ReviewFormResult {
  const withValues = values ? { values } : {};
  if (error instanceof ReviewError) return { ok: false, message: error.message, fieldErrors: error.fieldErrors, ...withValues };
  if (error instanceof AccessDeniedError || error instanceof PaymentsUnavailableError) return { ok: false, message: error.message, fieldErrors: {}, ...withValues };
  console.error(`[reviews/${where}]`, error);
  return { ok: false, message: "Something went wrong on our side and nothing was changed. Reload the page to see where things stand, then try again.", fieldErrors: {}, ...withValues };
}
