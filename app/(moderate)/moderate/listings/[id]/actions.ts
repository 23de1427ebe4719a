"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { AccessDeniedError, requireUser } from "@/lib/auth/guard";
import { moderateListing, type ModeratorAction } from "@/lib/moderation/listing-actions";
import type { FormResult } from "@/lib/validations/auth";
import { reasonsFromForm } from "@/lib/validations/moderation";

// The review page's four decisions. Each: the session guard, then moderateListing (zod, then
// transitionListing, which checks the role against the listing and the state), then revalidate and redirect.

const text = (formData: FormData, key: string) => {
  const v = formData.get(key);
  return typeof v === "string" ? v : undefined;
};

/** `values` go back to the form, which React resets after the action: what was typed is not lost. */
async function decide(listingId: string, action: ModeratorAction, body: unknown, values: Record<string, string> = {}): Promise<FormResult> {
  let user;
  try {
    user = await requireUser(["moderator"]);
  } catch (error) {
    if (error instanceof AccessDeniedError) return { ok: false, message: error.message, fieldErrors: {}, values };
    throw error;
  }
  const outcome = await moderateListing(user, listingId, action, body);
  if (!outcome.ok) return { ok: false, message: outcome.message, fieldErrors: outcome.fieldErrors ?? {}, values };
  revalidatePath("/moderate");
  revalidatePath(`/moderate/listings/${listingId}`);
  // Approve, hold and restore change what the catalog shows.
  if (action !== "send_back") revalidatePath("/", "layout");
  redirect(`/moderate/listings/${listingId}?done=${action}`);
}

export async function approveListingAction(listingId: string, _previous: FormResult | null, formData: FormData): Promise<FormResult> {
  return decide(listingId, "approve", { note: text(formData, "note") }, { note: text(formData, "note") ?? "" });
}

export async function sendBackListingAction(listingId: string, _previous: FormResult | null, formData: FormData): Promise<FormResult> {
  return decide(listingId, "send_back", { reasons: reasonsFromForm(formData) });
}

export async function holdListingAction(listingId: string, _previous: FormResult | null, formData: FormData): Promise<FormResult> {
  return decide(listingId, "hold", { reason: text(formData, "reason") ?? "" }, { reason: text(formData, "reason") ?? "" });
}

export async function restoreListingAction(listingId: string, _previous: FormResult | null, formData: FormData): Promise<FormResult> {
  return decide(listingId, "restore", { note: text(formData, "note") }, { note: text(formData, "note") ?? "" });
}
