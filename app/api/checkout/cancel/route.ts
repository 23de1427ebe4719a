import { NextResponse } from "next/server";
import { z } from "zod";
import { getSessionUser } from "@/lib/auth/guard";
import { env } from "@/lib/env";
import { revalidateCheckoutListingPages } from "@/lib/listings/listing-pages";
import { cancelCheckout } from "@/lib/payments/checkout";

export const dynamic = "force-dynamic";

const query = z.object({ checkout: z.uuid() });

/**
 * The provider's cancel link ("cancel and go back"): closes the session, gives the held stock back at
 * once, and lands on the cart, which was never changed. Only the buyer's own checkout is touched.
 */
export async function GET(request: Request): Promise<Response> {
  const base = env().APP_URL;
  const parsed = query.safeParse({ checkout: new URL(request.url).searchParams.get("checkout") ?? undefined });
  const user = await getSessionUser();
  if (!parsed.success || !user) return NextResponse.redirect(new URL("/cart", base), 303);
  try {
    const { redirectTo } = await cancelCheckout(parsed.data.checkout, user.id);
    await revalidateCheckoutListingPages(parsed.data.checkout);
    return NextResponse.redirect(new URL(redirectTo, base), 303);
  } catch (error) {
    // The hold still ends at its expiry; the buyer's cart is intact either way.
    console.error("[checkout] cancel failed:", (error as Error).message);
    return NextResponse.redirect(new URL("/cart?cancelled=1", base), 303);
  }
}
