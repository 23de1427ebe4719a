/**
 * Shared schemas for reviewers and review sessions, used by the forms' server actions:
 *   reviewer application { expertise: key[], profileMd, trackRecordMd, price: "45.00" }   (price in major units)
 *   booking              { logId, reviewerId, stages: stage[], message? }
 *   report               { verdicts: [{ checkpointId, verdict, comment }], summaryMd }
 *   dispute              { reason }
 *   settle dispute       { outcome, amount? ("12.50", only for a partial refund), note }
 */
import { z } from "zod";
import { NUL_ERROR, NUL_FREE } from "./text";
import { BRING_UP_STAGES } from "@/db/schema/listings";
import { CHECKPOINT_VERDICTS } from "@/db/schema/reviews";
import { minorDigits } from "@/lib/format/money";
import { parseMajorUnits } from "@/lib/orders/amount-input";

/** Areas a reviewer knows well, in the trade's own words; stored by key. */
export const EXPERTISE_AREAS = [
  { key: "welding-inverters", label: "Welding inverters" },
  { key: "bench-supplies", label: "Bench supplies" },
  { key: "induction-heaters", label: "Induction heaters" },
  { key: "chargers", label: "Battery chargers" },
  { key: "magnetics", label: "Magnetics and winding" },
  { key: "gate-drive", label: "Gate drive" },
  { key: "mains-input", label: "Mains input, inrush and filtering" },
  { key: "thermal", label: "Heatsinks and thermal design" },
  { key: "control-loops", label: "Current control and feedback loops" },
] as const;
export type ExpertiseKey = (typeof EXPERTISE_AREAS)[number]["key"];
const EXPERTISE_KEYS = EXPERTISE_AREAS.map((a) => a.key) as [ExpertiseKey, ...ExpertiseKey[]];

export function expertiseLabel(key: string): string {
  return EXPERTISE_AREAS.find((a) => a.key === key)?.label ?? key;
}

/** Reviews are priced in the platform's currency. */
export const REVIEW_CURRENCY = "EUR";
/** Lower bound: below this the payment provider's own fees eat the review; upper: a sanity cap. */
export const MIN_REVIEW_PRICE_MINOR = 500;
export const MAX_REVIEW_PRICE_MINOR = 100_000;

function text(what: string, min: number, max: number) {
  return z
    .string({ error: `Write ${what}.` })
    .regex(NUL_FREE, NUL_ERROR)
    .trim()
    .min(min, { error: `Write ${what} (${min} characters at least).` })
    .max(max, { error: `Keep it under ${max} characters.` });
}

export const reviewPriceSchema = z.string({ error: "Enter your price per review." }).regex(NUL_FREE, NUL_ERROR).transform((raw, ctx) => {
  const parsed = parseMajorUnits(raw, minorDigits(REVIEW_CURRENCY));
  if (!parsed.ok) {
    ctx.addIssue({ code: "custom", message: parsed.message });
    return z.NEVER;
  }
  if (parsed.minor < MIN_REVIEW_PRICE_MINOR || parsed.minor > MAX_REVIEW_PRICE_MINOR) {
    ctx.addIssue({ code: "custom", message: "Set a price between 5.00 and 1000.00 per review." });
    return z.NEVER;
  }
  return parsed.minor;
});

export const reviewerApplicationSchema = z.object({
  expertise: z
    .array(z.enum(EXPERTISE_KEYS, { error: "Pick areas from the list." }), { error: "Pick at least one area you know well." })
    .min(1, { error: "Pick at least one area you know well." })
    .refine((keys) => new Set(keys).size === keys.length, { error: "Each area once." }),
  profileMd: text("a profile builders will read before booking you", 40, 4000),
  trackRecordMd: text("your track record: builds you brought up, what you measured, what went wrong", 80, 6000),
  price: reviewPriceSchema,
}).transform(({ price, ...rest }) => ({ ...rest, priceMinor: price }));
export type ReviewerApplicationInput = z.output<typeof reviewerApplicationSchema>;
export type ReviewerApplicationField = "expertise" | "profileMd" | "trackRecordMd" | "price";

export const declineReviewerSchema = z.object({ reason: text("why the application is declined; the applicant reads this", 3, 2000) });

export const bookingSchema = z.object({
  logId: z.uuid({ error: "Pick one of your bring-up logs." }),
  reviewerId: z.string({ error: "Pick a reviewer." }).regex(NUL_FREE, NUL_ERROR).trim().min(1, { error: "Pick a reviewer." }).max(200),
  stages: z
    .array(z.enum(BRING_UP_STAGES, { error: "Pick stages from the list." }), { error: "Pick at least one stage to review." })
    .min(1, { error: "Pick at least one stage to review." })
    .transform((stages) => BRING_UP_STAGES.filter((s) => stages.includes(s))),
  // Travels with the payment session's metadata until the payment is authorised, hence the provider's 500-character limit.
  message: z.string().regex(NUL_FREE, NUL_ERROR).trim().max(500, { error: "Keep the note to the reviewer under 500 characters." }).default(""),
});
export type BookingInput = z.output<typeof bookingSchema>;
export type BookingField = "logId" | "reviewerId" | "stages" | "message";

export const declineReviewSchema = z.object({
  reason: z.string().regex(NUL_FREE, NUL_ERROR).trim().max(1000, { error: "Keep the note under 1000 characters." }).default(""),
});

/** A "needs attention" or "stop" verdict must say what to look at; "fine" may stand alone. */
export const verdictSchema = z
  .object({
    checkpointId: z.uuid(),
    verdict: z.enum(CHECKPOINT_VERDICTS, { error: "Give every checkpoint a verdict." }),
    comment: z.string().regex(NUL_FREE, NUL_ERROR).trim().max(2000, { error: "Keep a comment under 2000 characters." }).default(""),
  })
  .superRefine((v, ctx) => {
    if (v.verdict !== "fine" && v.comment.length < 10) {
      ctx.addIssue({ code: "custom", path: ["comment"], message: "Say what the builder must look at or fix (10 characters at least)." });
    }
  });

export const reportSchema = z.object({
  verdicts: z.array(verdictSchema).min(1, { error: "Give a verdict for each checkpoint in scope." }),
  summaryMd: text("a summary of the review", 40, 10_000),
});
export type ReportInput = z.output<typeof reportSchema>;

export const disputeSchema = z.object({ reason: text("what is wrong with the report; a moderator reads this", 20, 2000) });

export const SETTLE_OUTCOMES = ["payment_stands", "refund_full", "refund_partial"] as const;
export type SettleOutcome = (typeof SETTLE_OUTCOMES)[number];

export const settleDisputeSchema = z
  .object({
    outcome: z.enum(SETTLE_OUTCOMES, { error: "Choose how the dispute ends." }),
    amount: z.string().regex(NUL_FREE, NUL_ERROR).trim().default(""),
    note: text("the decision; both the builder and the reviewer read it", 10, 2000),
  })
  .transform((value, ctx): SettleDisputeInput => {
    if (value.outcome !== "refund_partial") return { outcome: value.outcome, note: value.note };
    const parsed = parseMajorUnits(value.amount, minorDigits(REVIEW_CURRENCY));
    if (!parsed.ok || parsed.minor <= 0) {
      ctx.addIssue({ code: "custom", path: ["amount"], message: parsed.ok ? "The refund must be more than zero." : parsed.message });
      return z.NEVER;
    }
    return { outcome: value.outcome, note: value.note, refundMinor: parsed.minor };
  });
/** A part refund carries its amount in minor units; the other outcomes carry none. */
export type SettleDisputeInput = { outcome: SettleOutcome; note: string; refundMinor?: number };
