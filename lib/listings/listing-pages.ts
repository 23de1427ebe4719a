import "server-only";
import { revalidatePath } from "next/cache";
import { slugOfAnswer, slugOfQuestion, slugsOfCheckout, slugsOfListings, slugsOfOrder } from "@/db/queries/listing-pages";

// Listing pages are rendered once and served from Next's cache (app/(shop)/listings/[slug]/page.tsx).
// Whatever changes what a listing page shows calls one of these after its commit, so this instance
// serves the change on the next request. The cache is each instance's own: other instances, and
// changes made outside a request (the worker's checkout sweep and policy grace expiry), show once
// the page's revalidate window has run out. The same window bounds what a page shows of other
// listings (the fit sections name their price and stock).

export const listingPath = (slug: string) => `/listings/${slug}`;

/**
 * The change is committed by now, so a failure here (the slug lookup, or a call outside Next's
 * request scope) is logged and not raised: the page catches up within its revalidate window.
 */
async function revalidateSlugs(what: string, slugs: () => Promise<string[]>): Promise<void> {
  try {
    for (const slug of await slugs()) revalidatePath(listingPath(slug));
  } catch (error) {
    console.error(`[listing-pages] could not revalidate the pages of ${what}:`, (error as Error).message);
  }
}

/** Every listing page, for what all of them show (the safety sheet checked against the policy). */
export function revalidateAllListingPages(): void {
  try {
    revalidatePath("/listings/[slug]", "page");
  } catch (error) {
    console.error("[listing-pages] could not revalidate the listing pages:", (error as Error).message);
  }
}

export const revalidateListingPages = (listingIds: readonly string[]) => revalidateSlugs(`listings ${listingIds.join(", ")}`, () => slugsOfListings(listingIds));
export const revalidateCheckoutListingPages = (checkoutId: string) => revalidateSlugs(`checkout ${checkoutId}`, () => slugsOfCheckout(checkoutId));
export const revalidateOrderListingPages = (orderId: string) => revalidateSlugs(`order ${orderId}`, () => slugsOfOrder(orderId));
/** The page of the listing a question (or an answer's question) is about, whose Q&A panel lists it. */
export const revalidatePostListingPage = (kind: string, postId: string) =>
  revalidateSlugs(`${kind} ${postId}`, () => (kind === "answer" ? slugOfAnswer(postId) : kind === "question" ? slugOfQuestion(postId) : Promise.resolve([])));
