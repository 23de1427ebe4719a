/**
 * Shared schemas of the bench forms (start a log, add a checkpoint, record a reading, share),
 * used by the client forms and again by the server actions before anything is written. Numbers
 * arrive as the text a builder typed and are parsed here, so "" is an error rather than 0.
 */
import { z } from "zod";
import { NUL_ERROR, NUL_FREE } from "./text";
import { BRING_UP_STAGES } from "@/db/schema/listings";
import { LOG_VISIBILITIES } from "@/db/schema/bench";
import { UPLOAD_ROUTES } from "@/lib/uploads/limits";

export const MAX_READING_PHOTOS = UPLOAD_ROUTES.readingPhoto.maxFiles;

/**
 * "41000", "41 000", "0.29", "-15.2", "4.7e-6" → a number; a decimal comma is refused rather than
 * guessed at ("1,500" is one and a half in much of Europe and fifteen hundred in the UK).
 */
export function parseReadingNumber(text: string): number | null {
  const compact = text.trim().replace(/[\s\u00a0\u202f]+/g, "");
  if (!/^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(compact)) return null;
  const value = Number(compact);
  return Number.isFinite(value) ? value : null;
}

const numberText = (what: string) =>
  z
    .union([z.string().regex(NUL_FREE, NUL_ERROR), z.number()])
    .transform((raw, ctx) => {
      const value = typeof raw === "number" ? (Number.isFinite(raw) ? raw : null) : parseReadingNumber(raw);
      if (value === null) {
        const empty = typeof raw === "string" && raw.trim() === "";
        ctx.addIssue({ code: "custom", message: empty ? `Enter ${what}.` : `Enter ${what} as a number with a point for decimals, e.g. 0.29.` });
        return z.NEVER;
      }
      return value;
    });

const unitText = z.string().regex(NUL_FREE, NUL_ERROR).trim().min(1, { error: "Give the unit, e.g. V, A or kHz." }).max(12, { error: "A unit is at most 12 characters." });

export const createLogSchema = z
  .object({
    /** a kit listing's id, or "" for a build of the builder's own */
    kitListingId: z.union([z.uuid({ error: "Choose a kit from the list." }), z.literal("")]),
    title: z.string().regex(NUL_FREE, NUL_ERROR).trim().max(120, { error: "Keep the title under 120 characters." }),
  })
  .refine((v) => v.kitListingId !== "" || v.title.length >= 3, { path: ["title"], error: "Give your build a title of at least 3 characters." });
export type CreateLogInput = z.output<typeof createLogSchema>;

export const builderCheckpointSchema = z
  .object({
    stage: z.enum(BRING_UP_STAGES, { error: "Choose the bring-up stage." }),
    name: z.string().regex(NUL_FREE, NUL_ERROR).trim().min(2, { error: "Name the checkpoint." }).max(120, { error: "Keep the name under 120 characters." }),
    measure: z.string().regex(NUL_FREE, NUL_ERROR).trim().min(2, { error: "Say what to measure and where." }).max(300, { error: "Keep this under 300 characters." }),
    unit: unitText,
    expectedMin: numberText("the lowest expected reading"),
    expectedMax: numberText("the highest expected reading"),
  })
  .refine((c) => c.expectedMin <= c.expectedMax, { path: ["expectedMax"], error: "The highest expected reading must not be below the lowest." });
export type BuilderCheckpointInput = z.output<typeof builderCheckpointSchema>;

export const readingPhotoSchema = z.object({
  key: z.string().regex(NUL_FREE, NUL_ERROR).min(1).max(200),
  alt: z.string().regex(NUL_FREE, NUL_ERROR).trim().max(200, { error: "Keep the description under 200 characters." }).default(""),
});

export const readingSchema = z.object({
  checkpointId: z.uuid({ error: "Choose the checkpoint this reading is for." }),
  value: numberText("the reading"),
  unit: unitText,
  instrument: z.string().regex(NUL_FREE, NUL_ERROR).trim().max(120, { error: "Keep the instrument under 120 characters." }).default(""),
  note: z.string().regex(NUL_FREE, NUL_ERROR).trim().max(2000, { error: "Keep the note under 2000 characters." }).default(""),
  photos: z
    .array(readingPhotoSchema)
    .max(MAX_READING_PHOTOS, { error: `At most ${MAX_READING_PHOTOS} photos per reading.` })
    .default([]),
});
export type ReadingInput = z.output<typeof readingSchema>;

export const visibilitySchema = z.enum(LOG_VISIBILITIES, { error: "Choose private or public." });

/** What the bench's server actions answer; field errors are keyed by the form's field names. */
export type BenchFormResult =
  | { ok: true; message: string; /** a reading recorded outside its range: said plainly, not as a success */ outsideRange?: boolean }
  | { ok: false; message: string; fieldErrors: Record<string, string[]> };
