import "server-only";
import type { z } from "zod";
import type { ListingState } from "@/db/schema";
import { transitionListing, TransitionError } from "@/db/queries/listing-transitions";
import type { SessionUser } from "@/lib/auth/access";
import { fieldErrorsFromZod, type FieldErrors } from "@/lib/http/json";
import type { SafetyFinding } from "@/lib/policy";
import { approveListingSchema, holdListingSchema, restoreListingSchema, sendBackListingSchema } from "@/lib/validations/moderation";
import { isUuid } from "./ids";
import { revalidateListingPages } from "@/lib/listings/listing-pages";

// The one path from a moderator's request (form or JSON) to a listing's state change. Server actions
// and route handlers both call moderateListing after their own session guard; transitionListing then
// checks the role again against the listing (nobody moderates their own) and the state.

export const MODERATOR_ACTIONS = ["approve", "send_back", "hold", "restore"] as const;
export type ModeratorAction = (typeof MODERATOR_ACTIONS)[number];

export type ModerationOutcome =
  | { ok: true; from: ListingState; to: ListingState }
  | { ok: false; status: 403 | 404 | 409 | 422; message: string; fieldErrors?: FieldErrors; findings?: SafetyFinding[] };

const SCHEMAS = {
  approve: approveListingSchema,
  send_back: sendBackListingSchema,
  hold: holdListingSchema,
  restore: restoreListingSchema,
} as const satisfies Record<ModeratorAction, z.ZodType>;

export async function moderateListing(user: SessionUser, listingId: string, action: ModeratorAction, body: unknown): Promise<ModerationOutcome> {
  if (!isUuid(listingId)) return { ok: false, status: 404, message: "No such listing." };
  const parsed = SCHEMAS[action].safeParse(body ?? {});
  if (!parsed.success) {
    const fieldErrors = fieldErrorsFromZod(parsed.error);
    const first = parsed.error.issues[0]?.message ?? "Some inputs are missing.";
    return { ok: false, status: 422, message: first, fieldErrors };
  }
  const data = parsed.data as { note?: string; reason?: string; reasons?: { topic: string; text: string }[] };
  try {
    const result = await transitionListing({
      listingId,
      action,
      actor: { kind: "user", id: user.id, roles: user.roles },
      ...(data.reasons ? { reasons: data.reasons } : {}),
      ...(data.reason !== undefined ? { note: data.reason } : data.note !== undefined ? { note: data.note } : {}),
    });
    // Its own cached page first: a held listing is not offered for sale from the next request on.
    await revalidateListingPages([listingId]);
    return { ok: true, ...result };
  } catch (error) {
    if (error instanceof TransitionError) {
      return { ok: false, status: error.status, message: error.message, ...(error.check ? { findings: error.check.findings } : {}) };
    }
    throw error;
  }
}

const CODES: Record<number, string> = { 403: "forbidden", 404: "not_found", 409: "conflict", 422: "invalid_input" };

/** The JSON answer of a moderation route for an outcome. */
export function outcomeResponse(outcome: ModerationOutcome): Response {
  if (outcome.ok) return Response.json({ ok: true, from: outcome.from, to: outcome.to });
  const { status, message, fieldErrors, findings } = outcome;
  return Response.json(
    { error: CODES[status] ?? "error", message, ...(fieldErrors ? { fieldErrors } : {}), ...(findings ? { findings } : {}) },
    { status },
  );
}
