import "server-only";
import { cancelOrder } from "@/db/queries/orders";
import { revalidateOrderListingPages } from "@/lib/listings/listing-pages";

/**
 * A seller cancels an order: the query puts the stock back and refunds the lines, then the pages of
 * the order's listings are refreshed, since they show that stock. The one entry for the seller's
 * cancel action and `POST /api/orders/[id]/cancel`.
 */
export async function cancelOrderAndRefresh(input: { orderId: string; actorId: string }): Promise<Awaited<ReturnType<typeof cancelOrder>>> {
  const result = await cancelOrder(input);
  await revalidateOrderListingPages(input.orderId);
  return result;
}
