import "server-only";
import type { z } from "zod";
import { BenchError } from "@/db/queries/bench";
import { AccessDeniedError } from "@/lib/auth/guard";
import { fieldErrorsFromZod } from "@/lib/http/json";
import type { BenchFormResult } from "@/lib/validations/bench";

// How the bench's server actions answer a refusal: the person's words, beside the field when one is named.

export function invalidForm(error: z.ZodError): BenchFormResult {
  return { ok: false, message: "Some entries need fixing; they are marked beside each field. Nothing was saved.", fieldErrors: fieldErrorsFromZod(error) };
}

export function benchFailure(error: unknown, where: string): BenchFormResult {
  if (error instanceof BenchError) return { ok: false, message: error.message, fieldErrors: error.fieldErrors };
  if (error instanceof AccessDeniedError) return { ok: false, message: error.message, fieldErrors: {} };
  console.error(`[bench/${where}]`, error);
  return { ok: false, message: "Something went wrong on our side and nothing was saved. Your entries are still in the form; try again.", fieldErrors: {} };
}
