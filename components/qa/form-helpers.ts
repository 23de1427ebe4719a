import type { FormResult } from "@/lib/validations/auth";

export type QaFormAction = (previous: FormResult | null, formData: FormData) => Promise<FormResult>;

export const fieldError = (state: FormResult | null, key: string): string[] | undefined =>
  state && !state.ok ? (state.fieldErrors as Record<string, string[] | undefined>)[key] : undefined;

export const MARKDOWN_HINT =
  "Markdown works: **bold**, lists, `code`, links. Say what you measured, with which instrument, and at which stage of the bring-up.";
