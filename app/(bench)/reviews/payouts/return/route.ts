// Where the provider's onboarding page sends the reviewer back: read the account's status and store it.
import { NextResponse } from "next/server";
import { getSessionUser } from "@/lib/auth/guard";
import { hasRole } from "@/lib/auth/access";
import { env } from "@/lib/env";
import { refreshReviewerPayoutStatus } from "@/lib/reviews/payouts";

export async function GET(): Promise<Response> {
  const base = env().APP_URL;
  const user = await getSessionUser();
  if (!user || !hasRole(user, "reviewer")) return NextResponse.redirect(`${base}/sign-in?next=${encodeURIComponent("/reviews")}`, 303);
  let outcome: "enabled" | "incomplete" | "unavailable";
  try {
    outcome = (await refreshReviewerPayoutStatus(user.id)).payoutsEnabled ? "enabled" : "incomplete";
  } catch (error) {
    console.error("[reviews/payouts/return]", (error as Error).message);
    outcome = "unavailable";
  }
  return NextResponse.redirect(`${base}/reviews?payout=${outcome}`, 303);
}
