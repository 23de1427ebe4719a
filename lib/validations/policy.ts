/**
 * Shared schemas for the safety sheet: the seller's declaration, the notes, a policy check
 * request (POST /api/policy/check) and a policy revision (for revisions an admin publishes).
 *
 * POST /api/policy/check { declaration, notes, revision? (number; the current one by default) }
 *   → { status: "clear" | "incomplete" | "blocked", findings [{ topic, code, message }],
 *       profile { busPeakV, storedEnergyJ, storedChargeC, dischargeS | null, ocvLimitV | null,
 *                 requiredTopics, … }, revision }
 */
import { z } from "zod";
import { NUL_ERROR, NUL_FREE } from "./text";
import type { PolicyRevision } from "@/lib/policy/revisions";
import { TOPIC_CONDITIONS } from "@/lib/policy/revisions";
import type { SafetyDeclaration } from "@/lib/policy/hazard-profile";
import type { SafetyNote } from "@/lib/policy/check-safety-sheet";
import { SAFETY_TOPIC_KEYS } from "@/lib/policy/topics";
import { quantity } from "./calc";

export const safetyTopicSchema = z.enum(SAFETY_TOPIC_KEYS, { error: "Unknown safety topic." });

export const safetyDeclarationSchema = z
  .object({
    mainsConnected: z.boolean({ error: "Say whether the item is mains-connected." }),
    mainsVrms: quantity("Mains voltage", { min: 1, max: 1000 }).optional(),
    mainsTolerance: quantity("Mains tolerance", { min: 0, max: 0.5 }).optional(),
    busCapacitanceF: quantity("Bus capacitance", { min: 0, max: 1 }).optional(),
    bleederOhm: quantity("Bleeder resistance", { min: 0, max: 1e9 }).optional(),
    liveHeatsinks: z.boolean({ error: "Say whether any heatsink sits at bus potential." }),
    weldingSource: z.boolean({ error: "Say whether the item is (part of) a welding power source." }),
    openCircuitV: quantity("Open-circuit voltage", { min: 0, max: 1000 }).optional(),
    ocvKind: z.enum(["dc", "ac"], { error: "ocvKind must be dc or ac." }).optional(),
    environment: z.enum(["normal", "increased-hazard"], { error: "environment must be normal or increased-hazard." }).optional(),
  })
  .refine((d) => !d.mainsConnected || d.mainsVrms !== undefined, {
    path: ["mainsVrms"],
    error: "State the nominal mains voltage of a mains-connected item.",
    // Run even when other fields fail, so a live form shows every problem at once.
    when: (payload) => {
      const value = payload.value as { mainsConnected?: unknown } | null;
      return typeof value === "object" && value !== null && value.mainsConnected === true;
    },
  }) satisfies z.ZodType<SafetyDeclaration>;

export const safetyNoteSchema = z.object({
  topic: safetyTopicSchema,
  text: z.string({ error: "A note needs text." }).regex(NUL_FREE, NUL_ERROR).max(20_000, { error: "Keep a note under 20 000 characters." }),
  waitSeconds: quantity("Wait", { min: 0, max: 86_400 }).optional(),
}) satisfies z.ZodType<SafetyNote>;

export const safetyNotesSchema = z.array(safetyNoteSchema).max(50, { error: "At most 50 notes." });

export const policyCheckRequestSchema = z.object({
  declaration: safetyDeclarationSchema,
  notes: safetyNotesSchema.default([]),
  revision: z.number({ error: "revision must be a number." }).int().positive().optional(),
});
export type PolicyCheckRequest = z.output<typeof policyCheckRequestSchema>;

export const policyRevisionSchema = z.object({
  revision: z.number().int().positive(),
  publishedAt: z.iso.datetime(),
  summary: z.string().regex(NUL_FREE, NUL_ERROR).min(1),
  minWords: z.number().int().min(1).max(1000),
  storedChargeThresholdC: z.number().positive(),
  safeVoltageV: z.number().positive().max(1000),
  waitMarginFactor: z.number().min(1).max(100),
  topicRules: z.array(
    z.object({
      topic: safetyTopicSchema,
      when: z.enum(TOPIC_CONDITIONS),
      minWords: z.number().int().min(1).max(1000).optional(),
    }),
  ),
  handDischarge: z.object({
    actions: z.array(z.string().regex(NUL_FREE, NUL_ERROR).min(2)).min(1),
    means: z.array(z.string().regex(NUL_FREE, NUL_ERROR).min(2)).min(1),
  }),
}) satisfies z.ZodType<PolicyRevision>;
