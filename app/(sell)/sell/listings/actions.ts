"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { createListingDraft, ListingError, retireListing, submitListing, updateListing } from "@/db/queries/listings";
import { AccessDeniedError, requireUser } from "@/lib/auth/guard";
import { revalidateListingPages } from "@/lib/listings/listing-pages";
import type { SessionUser } from "@/lib/auth/access";
import { fieldErrorsFromZod } from "@/lib/http/json";
import { enforceRateLimit, RateLimitedError } from "@/lib/rate-limit";
import { listingSubmissionLimit, listingSubmissionRefusal } from "@/lib/rate-limit/posting";
import { listingDraftSchema, listingSubmitSchema } from "@/lib/validations/listings";

export type SaveListingResult =
  | { ok: true; message: string; state?: string }
  | { ok: false; message: string; fieldErrors: Record<string, string[]> };

const UNEXPECTED = "Something went wrong on our side and nothing was saved. Your entries are still in the form; try again.";

function actorOf(user: SessionUser) {
  return { kind: "user" as const, id: user.id, roles: user.roles };
}

function failure(error: unknown, savedNote = ""): SaveListingResult {
  if (error instanceof AccessDeniedError) return { ok: false, message: error.message, fieldErrors: {} };
  if (error instanceof RateLimitedError) return { ok: false, message: `${savedNote}${error.message}`, fieldErrors: {} };
  if (error instanceof ListingError) return { ok: false, message: `${savedNote}${error.message}`, fieldErrors: error.fieldErrors };
  console.error("[sell/listings] unexpected error", error);
  return { ok: false, message: savedNote ? `${savedNote}It could not be submitted just now; try again.` : UNEXPECTED, fieldErrors: {} };
}

/**
 * Saves the form (a new draft or an edit) and, with intent "submit", submits it for review. The
 * draft is saved even when the submission is refused, so nothing typed is lost.
 */
export async function saveListing(listingId: string | null, raw: unknown, intent: "draft" | "submit"): Promise<SaveListingResult> {
  let user: SessionUser;
  try {
    user = await requireUser(["seller"]);
  } catch (error) {
    return failure(error);
  }
  const parsed = listingDraftSchema.safeParse(raw);
  if (!parsed.success) {
    return { ok: false, message: "Some entries need fixing; they are marked beside each field. Nothing was saved yet.", fieldErrors: fieldErrorsFromZod(parsed.error) };
  }

  let id = listingId;
  let message = "Draft saved.";
  let state: string | undefined;
  try {
    if (id === null) {
      id = (await createListingDraft(user.id, parsed.data)).id;
    } else {
      const outcome = await updateListing(actorOf(user), id, parsed.data);
      state = outcome.state;
      message = outcome.sentToReview
        ? "Saved. The safety sheet or figures changed, so the listing went back to review; it stays out of the catalog until a moderator approves it again."
        : state === "live" || state === "in_review"
          ? "Changes saved."
          : "Draft saved.";
    }
  } catch (error) {
    return failure(error);
  }
  revalidatePath("/sell");
  revalidatePath(`/sell/listings/${id}`);
  if (listingId !== null) await revalidateListingPages([id]);

  if (intent === "submit") {
    const complete = listingSubmitSchema.safeParse(raw);
    const saved = listingId === null ? "" : "Saved as a draft. ";
    if (!complete.success) {
      if (listingId === null) redirect(`/sell/listings/${id}?notice=not-submitted`);
      return { ok: false, message: `${saved}Before it can be submitted, fix what is marked.`, fieldErrors: fieldErrorsFromZod(complete.error) };
    }
    let refused: SaveListingResult | null = null;
    try {
      await enforceRateLimit(listingSubmissionLimit(user.id), listingSubmissionRefusal);
      await submitListing(actorOf(user), id);
    } catch (error) {
      refused = failure(error, saved);
    }
    if (refused) {
      if (listingId === null) redirect(`/sell/listings/${id}?notice=not-submitted`);
      return refused;
    }
    revalidatePath("/sell");
    await revalidateListingPages([id]);
    redirect(`/sell?submitted=${id}`);
  }
  if (listingId === null) redirect(`/sell/listings/${id}?notice=created`);
  return { ok: true, message, state };
}

export async function retireListingAction(listingId: string): Promise<SaveListingResult> {
  try {
    const user = await requireUser(["seller"]);
    await retireListing(actorOf(user), listingId);
  } catch (error) {
    return failure(error);
  }
  revalidatePath("/sell");
  await revalidateListingPages([listingId]);
  redirect(`/sell?retired=${listingId}`);
}
