// PATCH { stock } → { stock }: the seller desk's inline stock edit. 404 for a listing that is not the caller's.
import { ListingError, setStock } from "@/db/queries/listings";
import { guardRoute } from "@/lib/auth/guard";
import { jsonError, parseJsonBody } from "@/lib/http/json";
import { revalidateListingPages } from "@/lib/listings/listing-pages";
import { stockUpdateSchema } from "@/lib/validations/listings";

export const PATCH = guardRoute<{ id: string }>(["seller"], async (request, user, { params }) => {
  const { id } = await params;
  const parsed = await parseJsonBody(request, stockUpdateSchema);
  if (!parsed.ok) return parsed.response;
  try {
    const result = await setStock(user.id, id, parsed.data.stock);
    await revalidateListingPages([id]);
    return Response.json(result);
  } catch (error) {
    if (error instanceof ListingError) {
      const code = error.status === 404 ? "not_found" : error.status === 409 ? "conflict" : "invalid_input";
      return jsonError(error.status, code, error.message, Object.keys(error.fieldErrors).length ? error.fieldErrors : undefined);
    }
    console.error("[api/sell/listings/stock] unexpected error", error);
    return jsonError(500, "internal_error", "Something went wrong on our side. Please try again.");
  }
});
