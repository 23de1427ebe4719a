"use server";

import { redirect } from "next/navigation";
import { AccessDeniedError, requireUser } from "@/lib/auth/guard";
import { PaymentsUnavailableError, PayoutSetupError, startPayoutOnboarding } from "@/lib/payments/connect";
import type { FormResult } from "@/lib/validations/auth";

/** "Connect payout account": creates the connected account if needed, then sends the seller to the provider's onboarding page. */
export async function connectPayoutAccount(_previous: FormResult | null, _form: FormData): Promise<FormResult> {
  let url: string;
  try {
    const user = await requireUser(["seller"]);
    url = await startPayoutOnboarding(user);
  } catch (error) {
    if (error instanceof AccessDeniedError || error instanceof PaymentsUnavailableError || error instanceof PayoutSetupError) {
      return { ok: false, message: error.message, fieldErrors: {} };
    }
    console.error("[sell/payouts] could not start onboarding", error);
    return { ok: false, message: "The payout account could not be set up just now; try again in a minute — your drafts are safe.", fieldErrors: {} };
  }
  redirect(url);
}
