/**
 * Shared schemas for the moderator's actions on listings, seller applications and policy revisions.
 * The same schemas parse the review page's forms (server actions) and the JSON bodies of
 * POST /api/moderation/listings/[id]/{approve,send-back,hold,restore}:
 *   approve    { note?: string }
 *   send-back  { reasons: [{ topic: <safety topic key> | "general", text }] }   (at least one)
 *   hold       { reason: string }
 *   restore    { note?: string }
 */
import { z } from "zod";
import { NUL_ERROR, NUL_FREE } from "./text";
import { SAFETY_TOPIC_KEYS } from "@/lib/policy/topics";

/** A reason is filed under a safety topic, or under "general" for what is not about the sheet (photos, title, figures). */
export const REASON_TOPICS = [...SAFETY_TOPIC_KEYS, "general"] as const;
export type ReasonTopic = (typeof REASON_TOPICS)[number];

export const reasonTopicSchema = z.enum(REASON_TOPICS, { error: "Pick the topic the reason is about." });

const optionalNote = z
  .string()
  .regex(NUL_FREE, NUL_ERROR)
  .trim()
  .max(2000, { error: "Keep the note under 2000 characters." })
  .optional()
  .transform((v) => (v ? v : undefined));

export const approveListingSchema = z.object({ note: optionalNote });
export const restoreListingSchema = z.object({ note: optionalNote });

export const sendBackReasonSchema = z.object({
  topic: reasonTopicSchema,
  text: z
    .string({ error: "Say what the seller must change." })
    .regex(NUL_FREE, NUL_ERROR)
    .trim()
    .min(3, { error: "Say what the seller must change (a few words at least)." })
    .max(2000, { error: "Keep a reason under 2000 characters." }),
});

export const sendBackListingSchema = z.object({
  reasons: z
    .array(sendBackReasonSchema)
    .min(1, { error: "Give at least one reason, naming the topic and what the seller must change." })
    .max(REASON_TOPICS.length, { error: "One reason per topic is enough." })
    .refine((reasons) => new Set(reasons.map((r) => r.topic)).size === reasons.length, {
      error: "Each topic once: put everything about one topic in its one reason.",
    }),
});

export const holdListingSchema = z.object({
  reason: z
    .string({ error: "Say why the listing is held; the seller reads this." })
    .regex(NUL_FREE, NUL_ERROR)
    .trim()
    .min(3, { error: "Say why the listing is held; the seller reads this." })
    .max(2000, { error: "Keep the reason under 2000 characters." }),
});

export type SendBackInput = z.output<typeof sendBackListingSchema>;

export const declineApplicationSchema = z.object({
  reason: z
    .string({ error: "Say why the application is declined; the applicant reads this." })
    .regex(NUL_FREE, NUL_ERROR)
    .trim()
    .min(3, { error: "Say why the application is declined; the applicant reads this." })
    .max(2000, { error: "Keep the reason under 2000 characters." }),
});

const wholeNumber = (label: string, min: number, max: number) =>
  z.coerce
    .number({ error: `${label} must be a number.` })
    .int({ error: `${label} must be a whole number.` })
    .min(min, { error: `${label} must be at least ${min}.` })
    .max(max, { error: `${label} must be at most ${max}.` });

const decimal = (label: string, min: number, max: number, minInclusive = true) =>
  z.coerce
    .number({ error: `${label} must be a number.` })
    .refine((v) => Number.isFinite(v) && (minInclusive ? v >= min : v > min), {
      error: `${label} must be ${minInclusive ? "at least" : "more than"} ${min}.`,
    })
    .refine((v) => v <= max, { error: `${label} must be at most ${max}.` });

/** "" (a field left blank) means "no override". */
const optionalWholeNumber = (label: string, min: number, max: number) =>
  z.preprocess((v) => (v === "" || v === null || v === undefined ? undefined : v), wholeNumber(label, min, max).optional());

/**
 * The admin's form for a new policy revision, in the units a person types: the stored-charge
 * threshold in µC, the grace period in days. lib/moderation/publish-policy.ts turns it into a
 * PolicyRevision and validates that with policyRevisionSchema.
 */
export const publishPolicySchema = z.object({
  summary: z
    .string({ error: "Say what changes in this revision; sellers read it." })
    .regex(NUL_FREE, NUL_ERROR)
    .trim()
    .min(10, { error: "Say what changes in this revision in a sentence; sellers read it." })
    .max(1000, { error: "Keep the summary under 1000 characters." }),
  minWords: wholeNumber("Minimum words per note", 1, 1000),
  topicMinWords: z.object(
    Object.fromEntries(SAFETY_TOPIC_KEYS.map((k) => [k, optionalWholeNumber("Minimum words for this topic", 1, 1000)])) as Record<
      (typeof SAFETY_TOPIC_KEYS)[number],
      ReturnType<typeof optionalWholeNumber>
    >,
  ),
  safeVoltageV: decimal("Safe voltage", 1, 1000),
  storedChargeThresholdMicroC: decimal("Stored-charge threshold", 0, 1e6, false),
  waitMarginFactor: decimal("Wait margin factor", 1, 100),
  graceDays: wholeNumber("Grace period", 1, 365),
});

export type PublishPolicyInput = z.output<typeof publishPolicySchema>;
export type PublishPolicyField = "summary" | "minWords" | "safeVoltageV" | "storedChargeThresholdMicroC" | "waitMarginFactor" | "graceDays" | `topicMinWords.${(typeof SAFETY_TOPIC_KEYS)[number]}`;

/**
 * Reads the send-back form: one topic select and one text per reason row (`reasonTopic`, `reasonText`).
 * Rows are kept as they are, blank ones included, so field errors ("reasons.1.text") line up with the rows on screen.
 */
export function reasonsFromForm(formData: FormData): { topic: string; text: string }[] {
  const topics = formData.getAll("reasonTopic").map(String);
  const texts = formData.getAll("reasonText").map(String);
  return topics.map((topic, i) => ({ topic, text: texts[i] ?? "" }));
}

/** Reads the policy form; field names match publishPolicySchema, per-topic fields are `topicMinWords.<topic>`. */
export function policyFormValues(formData: FormData): Record<string, unknown> {
  const get = (k: string) => {
    const v = formData.get(k);
    return typeof v === "string" ? v : undefined;
  };
  return {
    summary: get("summary"),
    minWords: get("minWords"),
    topicMinWords: Object.fromEntries(SAFETY_TOPIC_KEYS.map((k) => [k, get(`topicMinWords.${k}`) ?? ""])),
    safeVoltageV: get("safeVoltageV"),
    storedChargeThresholdMicroC: get("storedChargeThresholdMicroC"),
    waitMarginFactor: get("waitMarginFactor"),
    graceDays: get("graceDays"),
  };
}
