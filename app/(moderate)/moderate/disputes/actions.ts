"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { settleDispute } from "@/db/queries/reviews";
import { requireUser } from "@/lib/auth/guard";
import { invalidReviewForm, reviewFailure } from "@/lib/reviews/form-result";
import type { FormResult } from "@/lib/validations/auth";
import { settleDisputeSchema } from "@/lib/validations/reviews";

export async function settleDisputeAction(sessionId: string, _previous: FormResult | null, form: FormData): Promise<FormResult> {
  try {
    const user = await requireUser(["moderator"]);
    const parsed = settleDisputeSchema.safeParse({ outcome: String(form.get("outcome") ?? ""), amount: String(form.get("amount") ?? ""), note: String(form.get("note") ?? "") });
    if (!parsed.success) return invalidReviewForm(parsed.error);
    await settleDispute({ actor: user, sessionId, decision: parsed.data });
  } catch (error) {
    return reviewFailure(error, "settle");
  }
  revalidatePath("/moderate", "layout");
  revalidatePath(`/reviews/${sessionId}`);
  redirect("/moderate/disputes?done=settled");
}
