import { addToCart, listCartLines, removeFromCart, setCartQuantity, type CartChange } from "@/db/queries/cart";
import { getSessionUser } from "@/lib/auth/guard";
import { summariseCart } from "@/lib/checkout/cart-summary";
import { cartOwnerForWrite, currentCartOwner } from "@/lib/checkout/cart-owner";
import { jsonError, parseJsonBody } from "@/lib/http/json";
import { addToCartSchema, removeFromCartSchema, setCartQuantitySchema } from "@/lib/validations/cart";

// The cart as JSON for client code: the same queries and rules as the cart page's server actions.
// Visitors have carts too, so there is no role check; the owner is the member or the cart cookie.

export const dynamic = "force-dynamic";

async function cartBody() {
  const owner = await currentCartOwner(await getSessionUser());
  const lines = owner ? await listCartLines(owner) : [];
  return { lines, summary: summariseCart(lines) };
}

function refused(change: Extract<CartChange, { ok: false }>): Response {
  if (change.reason === "not-in-cart") return jsonError(404, "not_found", "That item is not in your cart.");
  return jsonError(409, change.reason === "out-of-stock" ? "out_of_stock" : "not_for_sale", change.reason === "out-of-stock" ? "This item is out of stock." : "This item is no longer for sale.");
}

/** `GET /api/cart` → `{ lines, summary }` with today's prices and stock. */
export async function GET(): Promise<Response> {
  return Response.json(await cartBody(), { headers: { "Cache-Control": "no-store" } });
}

/** `POST /api/cart { listingId, quantity }` adds to a line, capped by stock. */
export async function POST(request: Request): Promise<Response> {
  const parsed = await parseJsonBody(request, addToCartSchema);
  if (!parsed.ok) return parsed.response;
  const change = await addToCart(await cartOwnerForWrite(await getSessionUser()), parsed.data);
  if (!change.ok) return refused(change);
  return Response.json({ ...change, ...(await cartBody()) });
}

/** `PATCH /api/cart { listingId, quantity }` sets a line's quantity (0 removes it). */
export async function PATCH(request: Request): Promise<Response> {
  const parsed = await parseJsonBody(request, setCartQuantitySchema);
  if (!parsed.ok) return parsed.response;
  const owner = await currentCartOwner(await getSessionUser());
  if (!owner) return jsonError(404, "not_found", "Your cart is empty.");
  const change = await setCartQuantity(owner, parsed.data);
  if (!change.ok) return refused(change);
  return Response.json({ ...change, ...(await cartBody()) });
}

/** `DELETE /api/cart { listingId }` removes a line. */
export async function DELETE(request: Request): Promise<Response> {
  const parsed = await parseJsonBody(request, removeFromCartSchema);
  if (!parsed.ok) return parsed.response;
  const owner = await currentCartOwner(await getSessionUser());
  if (owner) await removeFromCart(owner, parsed.data.listingId);
  return Response.json(await cartBody());
}
