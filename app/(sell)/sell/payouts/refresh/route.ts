// The provider sends the seller here when an onboarding link has expired or was used: make a fresh one.
import { NextResponse } from "next/server";
import { getSessionUser } from "@/lib/auth/guard";
import { hasRole } from "@/lib/auth/access";
import { env } from "@/lib/env";
import { PaymentsUnavailableError, startPayoutOnboarding } from "@/lib/payments/connect";

export async function GET(): Promise<Response> {
  const base = env().APP_URL;
  const user = await getSessionUser();
  if (!user || !hasRole(user, "seller")) return NextResponse.redirect(`${base}/sign-in?next=${encodeURIComponent("/sell")}`, 303);
  try {
    return NextResponse.redirect(await startPayoutOnboarding(user), 303);
  } catch (error) {
    if (!(error instanceof PaymentsUnavailableError)) console.error("[sell/payouts/refresh]", error);
    return NextResponse.redirect(`${base}/sell?payout=unavailable`, 303);
  }
}
