/**
 * Shared schemas of the Q&A, for the forms (server actions) and the JSON bodies of
 *   POST /api/questions                       { title, bodyMd, listingId?, logId?, photos? }
 *   POST /api/questions/[id]/answers          { bodyMd, photos? }
 *   POST /api/questions/[id]/accept           { answerId: uuid | null }
 *   POST /api/posts/answer/[id]/vote          { value: 1 | -1 | 0 }   (0 takes the vote back)
 *   POST /api/posts/[kind]/[id]/flag          { reason }
 *   POST /api/posts/[kind]/[id]/remove        { reason }
 *   POST /api/posts/[kind]/[id]/{approve,restore}  {}
 */
import { z } from "zod";
import { MAX_POST_PHOTOS, POST_BODY_MAX, QUESTION_TITLE_MAX } from "./qa-limits";
import { NUL_ERROR, NUL_FREE } from "./text";

export { MAX_POST_PHOTOS, POST_BODY_MAX, QUESTION_TITLE_MAX } from "./qa-limits";

const blankToUndefined = (v: unknown) => (v === "" || v === null ? undefined : v);

const optionalId = (what: string) =>
  z.preprocess(blankToUndefined, z.guid({ error: `That ${what} does not exist.` }).optional());

export const postPhotoSchema = z.object({
  key: z.string({ error: "A photo is missing its key." }).regex(NUL_FREE, NUL_ERROR).min(1).max(200),
  alt: z.string().regex(NUL_FREE, NUL_ERROR).trim().max(200, { error: "Keep a photo description under 200 characters." }).default(""),
});
export type PostPhotoRef = z.output<typeof postPhotoSchema>;

const photos = z
  .array(postPhotoSchema)
  .max(MAX_POST_PHOTOS, { error: `At most ${MAX_POST_PHOTOS} photos.` })
  .refine((list) => new Set(list.map((p) => p.key)).size === list.length, { error: "The same photo is in the list twice." })
  .default([]);

const body = (what: string) =>
  z
    .string({ error: `Write your ${what}.` })
    .regex(NUL_FREE, NUL_ERROR)
    .trim()
    .min(20, { error: `Write your ${what} in a sentence or two (20 characters at least).` })
    .max(POST_BODY_MAX, { error: `Keep your ${what} under ${POST_BODY_MAX.toLocaleString("en")} characters.` });

export const askQuestionSchema = z.object({
  title: z
    .string({ error: "Give your question a title." })
    .regex(NUL_FREE, NUL_ERROR)
    .trim()
    .min(10, { error: "Give your question a title of a few words (10 characters at least)." })
    .max(QUESTION_TITLE_MAX, { error: `Keep the title under ${QUESTION_TITLE_MAX} characters.` }),
  bodyMd: body("question"),
  listingId: optionalId("listing"),
  logId: optionalId("bring-up log"),
  photos,
});
export type AskQuestionInput = z.output<typeof askQuestionSchema>;

export const answerSchema = z.object({ bodyMd: body("answer"), photos });
export type AnswerInput = z.output<typeof answerSchema>;

export const flagPostSchema = z.object({
  reason: z
    .string({ error: "Say what is wrong with the post." })
    .regex(NUL_FREE, NUL_ERROR)
    .trim()
    .min(3, { error: "Say what is wrong with the post (a few words at least)." })
    .max(500, { error: "Keep the reason under 500 characters." }),
});

export const removePostSchema = z.object({
  reason: z
    .string({ error: "Say why the post is removed; its author reads this." })
    .regex(NUL_FREE, NUL_ERROR)
    .trim()
    .min(3, { error: "Say why the post is removed; its author reads this." })
    .max(2000, { error: "Keep the reason under 2000 characters." }),
});

// Approve and restore take no input; unknown keys are ignored so a bare POST works.
export const approvePostSchema = z.object({});
export const restorePostSchema = z.object({});

const VOTE_MESSAGE = "A vote is 1 (up), -1 (down) or 0 (take it back).";

export const voteSchema = z.object({
  // Forms send strings; an empty one is no vote at all, not 0.
  value: z.preprocess(
    (v) => (typeof v === "string" && v.trim() !== "" ? Number(v) : v),
    z.union([z.literal(1), z.literal(-1), z.literal(0)], { error: VOTE_MESSAGE }),
  ),
});

export const acceptAnswerSchema = z.object({
  answerId: z.preprocess(blankToUndefined, z.guid({ error: "That answer does not exist." }).nullable().default(null)),
});

/** The list's filters live in the URL; anything unreadable falls back to the default. */
export const questionFiltersSchema = z.object({
  listing: z.guid().optional().catch(undefined),
  show: z.enum(["newest", "unanswered"]).catch("newest").default("newest"),
  page: z.coerce.number().int().min(1).max(10_000).catch(1).default(1),
});
export type QuestionFilters = z.output<typeof questionFiltersSchema>;

/** The photo uploader submits its value as JSON in one hidden input; a broken value is no photos. */
export function photosFromForm(formData: FormData, name = "photos"): unknown {
  const raw = formData.get(name);
  if (typeof raw !== "string" || raw.trim() === "") return [];
  try {
    return JSON.parse(raw);
  } catch {
    return [];
  }
}
