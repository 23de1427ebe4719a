"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { AccessDeniedError, requireUser } from "@/lib/auth/guard";
import { revalidateAllListingPages } from "@/lib/listings/listing-pages";
import { publishPolicyRevision } from "@/lib/moderation/publish-policy";
import type { FormResult } from "@/lib/validations/auth";
import { policyFormValues } from "@/lib/validations/moderation";

export async function publishPolicyAction(_previous: FormResult | null, formData: FormData): Promise<FormResult> {
  let user;
  try {
    user = await requireUser(["admin"]);
  } catch (error) {
    if (error instanceof AccessDeniedError) return { ok: false, message: error.message, fieldErrors: {} };
    throw error;
  }
  const outcome = await publishPolicyRevision(user, policyFormValues(formData));
  if (!outcome.ok) {
    // Echo every field back: React resets the form after the action, and nobody should retype a revision.
    const values = Object.fromEntries([...formData.entries()].filter(([k, v]) => !k.startsWith("$") && typeof v === "string")) as Record<string, string>;
    return { ok: false, message: outcome.message, fieldErrors: outcome.fieldErrors, values };
  }
  revalidatePath("/admin/policy");
  revalidatePath("/moderate");
  // Every listing page shows its safety sheet checked against the current revision.
  revalidateAllListingPages();
  redirect(`/admin/policy?published=${outcome.revision}`);
}
