import { z } from "zod";
import { MAX_PIN_BODY } from "./pin-rules";

// The pin form, shared by the reviewer's form and the server action.

const PREFIX: Record<string, number> = { "": 1, m: 1e-3, u: 1e-6, "µ": 1e-6, "μ": 1e-6, n: 1e-9, p: 1e-12 };

/**
 * A time as people type it beside a trace: "12.5 µs", "12.5us", "0.3 ms", "2.5e-5" (seconds when
 * no unit is given), and "−12 µs" as the viewer prints it. A decimal comma is refused, as in the reading form.
 */
export function parseTimeText(text: string): number | null {
  const match = /^([-+]?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?)\s*(?:([munpµμ]?)s)?$/i.exec(text.trim().replace(/\u00a0|\u202f/g, " ").replace(/\u2212/g, "-"));
  if (!match?.[1]) return null;
  const prefix = match[2] ?? "";
  // "M" would be mega; only sub-second prefixes make sense on a capture, and case matters for m.
  const scale = PREFIX[prefix === "U" ? "u" : prefix === "N" ? "n" : prefix];
  if (scale === undefined) return null;
  const value = Number(match[1]) * scale;
  return Number.isFinite(value) ? value : null;
}

export const pinSchema = z.object({
  captureId: z.uuid({ error: "Choose the capture to pin the comment to." }),
  time: z.union([z.string(), z.number()]).transform((raw, ctx) => {
    const value = typeof raw === "number" ? (Number.isFinite(raw) ? raw : null) : parseTimeText(raw);
    if (value === null) {
      ctx.addIssue({ code: "custom", message: "Give the time on the trace, e.g. 12.5 µs, or click the trace to choose it." });
      return z.NEVER;
    }
    return value;
  }),
  channel: z.union([z.literal(""), z.null(), z.coerce.number().int().min(0).max(255)]).transform((v) => (v === "" || v === null ? null : v)),
  body: z
    .string()
    .trim()
    .min(1, { error: "Write the comment." })
    .max(MAX_PIN_BODY, { error: `Keep the comment under ${MAX_PIN_BODY} characters.` }),
});

export type PinInput = z.output<typeof pinSchema>;
