// Where the provider's onboarding page sends the seller back: read the account's status and store it.
import { NextResponse } from "next/server";
import { getSessionUser } from "@/lib/auth/guard";
import { hasRole } from "@/lib/auth/access";
import { env } from "@/lib/env";
import { PaymentsUnavailableError, refreshPayoutStatus } from "@/lib/payments/connect";

export async function GET(): Promise<Response> {
  const base = env().APP_URL;
  const user = await getSessionUser();
  if (!user || !hasRole(user, "seller")) return NextResponse.redirect(`${base}/sign-in?next=${encodeURIComponent("/sell")}`, 303);
  let outcome: "enabled" | "incomplete" | "unavailable";
  try {
    const status = await refreshPayoutStatus(user.id);
    outcome = status.chargesEnabled && status.payoutsEnabled ? "enabled" : "incomplete";
  } catch (error) {
    if (!(error instanceof PaymentsUnavailableError)) console.error("[sell/payouts/return]", error);
    outcome = "unavailable";
  }
  return NextResponse.redirect(`${base}/sell?payout=${outcome}`, 303);
}
