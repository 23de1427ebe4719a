import { z } from "zod";
import { addFieldError, fieldErrorsFromZod, type FieldErrors } from "@/lib/http/field-errors";
import { DEFAULT_POINTS, MAX_POINTS, MIN_POINTS, type TimeSpan } from "./window-url";

// The query of GET /api/captures/[id]/window: a time window in seconds, how many points to draw
// and optionally one channel. The route answers 422 on anything else; the viewer builds its URLs
// with ./window-url.ts, which keeps this schema out of the browser.

export { DEFAULT_POINTS, MAX_POINTS, MIN_POINTS, windowUrl, type TimeSpan } from "./window-url";

// "" and "abc" are errors, not 0 or NaN: URLSearchParams gives strings, and Number("") is 0.
const seconds = (what: string) =>
  z
    .string()
    .trim()
    .min(1, { error: `Give ${what} in seconds.` })
    .transform((text, ctx) => {
      const value = Number(text);
      if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(text) || !Number.isFinite(value)) {
        ctx.addIssue({ code: "custom", message: `${what} must be a number of seconds, e.g. 0.00025 or 2.5e-4.` });
        return z.NEVER;
      }
      return value;
    });

const wholeNumber = (what: string, min: number, max: number) =>
  z
    .string()
    .trim()
    .regex(/^\d+$/, { error: `${what} must be a whole number.` })
    .transform(Number)
    .pipe(z.number().int().min(min, { error: `${what} must be at least ${min}.` }).max(max, { error: `${what} must be at most ${max}.` }));

export const windowQuerySchema = z
  .object({
    from: seconds("The window's start").optional(),
    to: seconds("The window's end").optional(),
    points: wholeNumber("points", MIN_POINTS, MAX_POINTS).optional(),
    channel: wholeNumber("channel", 0, 255).optional(),
  })
  .strict()
  .refine((q) => q.from === undefined || q.to === undefined || q.from < q.to, { path: ["to"], error: "The window's end must be after its start." });

export type WindowQuery = { from?: number; to?: number; points: number; channel?: number };

export type ParsedWindowQuery = { ok: true; query: WindowQuery } | { ok: false; fieldErrors: FieldErrors };

const unknownParameter = (issue: z.core.$ZodIssue) =>
  issue.code === "unrecognized_keys" ? `Unknown parameter: ${issue.keys.join(", ")}. Use from, to, points and channel.` : issue.message;

/** Reads the search parameters; each may appear once. */
export function parseWindowQuery(params: URLSearchParams): ParsedWindowQuery {
  // Prototype-free: a parameter named "constructor" or "toString" is just an unknown parameter.
  const raw: Record<string, string> = Object.create(null);
  const repeated: FieldErrors = {};
  for (const [key, value] of params) {
    if (key in raw) addFieldError(repeated, key, `${key} may be given only once.`);
    raw[key] = value;
  }
  if (Object.keys(repeated).length > 0) return { ok: false, fieldErrors: repeated };
  const parsed = windowQuerySchema.safeParse(raw);
  if (!parsed.success) return { ok: false, fieldErrors: fieldErrorsFromZod(parsed.error, unknownParameter) };
  const { from, to, points, channel } = parsed.data;
  return { ok: true, query: { from, to, points: points ?? DEFAULT_POINTS, channel } };
}

/**
 * The asked window clamped to the capture's time span; null when it does not overlap the capture
 * at all. A missing end means the capture's own.
 */
export function clampWindow(query: Pick<WindowQuery, "from" | "to">, capture: TimeSpan): TimeSpan | null {
  const from = Math.max(query.from ?? capture.from, capture.from);
  const to = Math.min(query.to ?? capture.to, capture.to);
  if (!(from < to)) return capture.from === capture.to && from === to ? { from, to } : null;
  return { from, to };
}
