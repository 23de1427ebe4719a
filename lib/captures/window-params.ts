import { z } from "zod";

// The query of GET /api/captures/[id]/window: a time window in seconds, how many points to draw
// and optionally one channel. Shared by the route (422 on anything else) and the viewer.

/** Enough for a plot a few thousand pixels wide; LTTB needs at least the two end points. */
export const MIN_POINTS = 2;
export const MAX_POINTS = 5000;
export const DEFAULT_POINTS = 1200;

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

export type ParsedWindowQuery = { ok: true; query: WindowQuery } | { ok: false; fieldErrors: Record<string, string[]> };

/** Reads the search parameters; each may appear once. */
export function parseWindowQuery(params: URLSearchParams): ParsedWindowQuery {
  // Prototype-free records: a parameter named "constructor" or "toString" is just an unknown parameter.
  const raw: Record<string, string> = Object.create(null);
  const fieldErrors: Record<string, string[]> = Object.create(null);
  for (const [key, value] of params) {
    if (key in raw) (fieldErrors[key] ??= []).push(`${key} may be given only once.`);
    raw[key] = value;
  }
  if (Object.keys(fieldErrors).length > 0) return { ok: false, fieldErrors };
  const parsed = windowQuerySchema.safeParse(raw);
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const key = issue.code === "unrecognized_keys" ? issue.keys.join(",") : issue.path.map(String).join(".");
      const message = issue.code === "unrecognized_keys" ? `Unknown parameter: ${issue.keys.join(", ")}. Use from, to, points and channel.` : issue.message;
      (fieldErrors[key] ??= []).push(message);
    }
    return { ok: false, fieldErrors };
  }
  const { from, to, points, channel } = parsed.data;
  return { ok: true, query: { from, to, points: points ?? DEFAULT_POINTS, channel } };
}

export type TimeSpan = { from: number; to: number };

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

/** The URL the viewer asks for a window. */
export function windowUrl(captureId: string, window: TimeSpan, points: number, channel?: number): string {
  const params = new URLSearchParams({ from: String(window.from), to: String(window.to), points: String(points) });
  if (channel !== undefined) params.set("channel", String(channel));
  return `/api/captures/${encodeURIComponent(captureId)}/window?${params.toString()}`;
}
