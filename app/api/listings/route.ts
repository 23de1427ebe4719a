import { searchListings } from "@/db/queries/catalog";
import { invalidInput, jsonError } from "@/lib/http/json";
import { parseCatalogQuery } from "@/lib/validations/catalog";

export const dynamic = "force-dynamic";

// Public and the same for everyone: a few seconds of shared caching absorbs search-as-you-type
// bursts, and a stale result is at worst a listing that went live a moment ago.
const CACHE_CONTROL = "public, max-age=5, s-maxage=10, stale-while-revalidate=30";

/** GET /api/listings?q=&kind=&subtype=&mains=&minPrice=&maxPrice=&inStock=&seller=&sort=&page= → { items, total, totalCapped, page, pageSize } */
export async function GET(request: Request): Promise<Response> {
  const parsed = parseCatalogQuery(new URL(request.url).searchParams);
  if (!parsed.ok) return invalidInput("Some search parameters are not valid.", parsed.fieldErrors);
  try {
    const result = await searchListings(parsed.query);
    return Response.json(result, { headers: { "Cache-Control": CACHE_CONTROL } });
  } catch (error) {
    console.error("[api/listings] search failed", error);
    return jsonError(500, "internal_error", "Something went wrong on our side. Please try again.");
  }
}
