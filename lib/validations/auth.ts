import { z } from "zod";
import { safeNextPath } from "@/lib/http/safe-path";
import { NUL_ERROR, NUL_FREE } from "./text";

export const signInSchema = z.object({
  email: z
    .string({ message: "Enter your e-mail address." })
    .regex(NUL_FREE, NUL_ERROR)
    .trim()
    .min(1, "Enter your e-mail address.")
    .max(254, "That address is too long.")
    .pipe(z.email({ message: "That does not look like an e-mail address — check for a missing @ or a typo." })),
  // Only paths on this site, so a crafted link cannot send someone elsewhere after sign-in.
  next: z
    .string()
    .regex(NUL_FREE, NUL_ERROR)
    .optional()
    .transform((v) => safeNextPath(v)),
});

export type FormResult<Fields extends string = string> =
  | { ok: true; message?: string }
  | { ok: false; message: string; fieldErrors: Partial<Record<Fields, string[]>>; values?: Partial<Record<Fields, string>> };
