// The provider sends the reviewer here when an onboarding link has expired or was used: make a fresh one.
import { NextResponse } from "next/server";
import { getSessionUser } from "@/lib/auth/guard";
import { hasRole } from "@/lib/auth/access";
import { env } from "@/lib/env";
import { startReviewerPayoutOnboarding } from "@/lib/reviews/payouts";

export async function GET(): Promise<Response> {
  const base = env().APP_URL;
  const user = await getSessionUser();
  if (!user || !hasRole(user, "reviewer")) return NextResponse.redirect(`${base}/sign-in?next=${encodeURIComponent("/reviews")}`, 303);
  try {
    return NextResponse.redirect(await startReviewerPayoutOnboarding(user), 303);
  } catch (error) {
    console.error("[reviews/payouts/refresh]", (error as Error).message);
    return NextResponse.redirect(`${base}/reviews?payout=unavailable`, 303);
  }
}
