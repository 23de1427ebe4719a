// Where the payment page sends the builder back. The session is read from the provider with our own
// key (the URL only names it), and a held payment becomes the booking if the provider's event has
// not made it so already.
import { NextResponse } from "next/server";
import { getSessionUser } from "@/lib/auth/guard";
import { env } from "@/lib/env";
import { completeBookingFromReturn } from "@/lib/reviews/payments";

export const dynamic = "force-dynamic";

export async function GET(request: Request): Promise<Response> {
  const base = env().APP_URL;
  const checkoutSessionId = new URL(request.url).searchParams.get("session") ?? "";
  const user = await getSessionUser();
  if (!user) return NextResponse.redirect(`${base}/sign-in?next=${encodeURIComponent(`/reviews/booked?session=${checkoutSessionId}`)}`, 303);
  const result = await completeBookingFromReturn(checkoutSessionId, user.id);
  switch (result.kind) {
    case "booked":
      return NextResponse.redirect(`${base}/reviews/${result.sessionId}?booked=1`, 303);
    case "refused":
      return NextResponse.redirect(`${base}/reviews/new?refused=${encodeURIComponent(result.message)}`, 303);
    case "pending":
      return NextResponse.redirect(`${base}/reviews?payment=pending`, 303);
    case "not-ours":
      return NextResponse.redirect(`${base}/reviews`, 303);
  }
}
