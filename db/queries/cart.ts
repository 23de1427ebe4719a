import "server-only";
import { and, asc, eq, inArray, isNull, sql } from "drizzle-orm";
import { db, type Executor } from "@/db/client";
import { cartItems, carts, listings, sellerProfiles, users } from "@/db/schema";
import type { CartLine } from "@/lib/checkout/cart-summary";

/** Whose cart: a member's, or a visitor's by the random token in their cookie. */
export type CartOwner = { userId: string } | { token: string };

function ownerCondition(owner: CartOwner) {
  return "userId" in owner ? eq(carts.userId, owner.userId) : and(eq(carts.token, owner.token), isNull(carts.userId));
}

export async function findCartId(owner: CartOwner, executor: Executor = db): Promise<string | null> {
  const [row] = await executor.select({ id: carts.id }).from(carts).where(ownerCondition(owner));
  return row?.id ?? null;
}

async function ensureCart(executor: Executor, owner: CartOwner): Promise<string> {
  const values = "userId" in owner ? { userId: owner.userId } : { token: owner.token };
  const target = "userId" in owner ? carts.userId : carts.token;
  const [row] = await executor
    .insert(carts)
    .values(values)
    .onConflictDoUpdate({ target, set: { updatedAt: sql`now()` } })
    .returning({ id: carts.id });
  return row!.id;
}

/** The cart's lines with today's price, stock and state of each listing (never what the cart stored). */
export async function listCartLines(owner: CartOwner, executor: Executor = db): Promise<CartLine[]> {
  const rows = await executor
    .select({
      listingId: listings.id,
      slug: listings.slug,
      title: listings.title,
      kind: listings.kind,
      magneticSubtype: listings.magneticSubtype,
      sellerId: listings.sellerId,
      shopName: sql<string>`coalesce(${sellerProfiles.shopName}, ${users.name}, 'A Fluxyard seller')`,
      priceMinor: listings.priceMinor,
      currency: listings.currency,
      quantity: cartItems.quantity,
      stock: listings.stock,
      state: listings.state,
      mainsConnected: listings.mainsConnected,
    })
    .from(cartItems)
    .innerJoin(carts, eq(carts.id, cartItems.cartId))
    .innerJoin(listings, eq(listings.id, cartItems.listingId))
    .innerJoin(users, eq(users.id, listings.sellerId))
    .leftJoin(sellerProfiles, eq(sellerProfiles.userId, listings.sellerId))
    .where(ownerCondition(owner))
    .orderBy(asc(cartItems.addedAt), asc(listings.id));
  return rows.map(({ state, mainsConnected, ...row }) => ({ ...row, live: state === "live", mainsConnected: mainsConnected === true }));
}

export async function cartItemCount(owner: CartOwner): Promise<number> {
  const [row] = await db
    .select({ n: sql<number>`coalesce(sum(${cartItems.quantity}), 0)::int` })
    .from(cartItems)
    .innerJoin(carts, eq(carts.id, cartItems.cartId))
    .where(ownerCondition(owner));
  return row?.n ?? 0;
}

export type CartChange =
  | { ok: true; quantity: number; capped: boolean }
  | { ok: false; reason: "not-for-sale" | "out-of-stock" | "not-in-cart" };

async function listingAvailability(executor: Executor, listingId: string) {
  const [row] = await executor.select({ state: listings.state, stock: listings.stock }).from(listings).where(eq(listings.id, listingId));
  return row;
}

/**
 * Adds to the line (or starts it), never past the stock on hand. One statement, so two tabs adding
 * at once both count and neither reads a quantity the other is about to change.
 */
export async function addToCart(owner: CartOwner, input: { listingId: string; quantity: number }): Promise<CartChange> {
  return db.transaction(async (tx) => {
    const listing = await listingAvailability(tx, input.listingId);
    if (!listing || listing.state !== "live") return { ok: false, reason: "not-for-sale" };
    if (listing.stock <= 0) return { ok: false, reason: "out-of-stock" };
    const cartId = await ensureCart(tx, owner);
    const [existing] = await tx
      .select({ quantity: cartItems.quantity })
      .from(cartItems)
      .where(and(eq(cartItems.cartId, cartId), eq(cartItems.listingId, input.listingId)));
    const { rows } = await tx.execute<{ quantity: number }>(sql`
      insert into cart_items (cart_id, listing_id, quantity)
      select ${cartId}, l.id, least(${input.quantity}, l.stock) from listings l
      where l.id = ${input.listingId} and l.state = 'live' and l.stock > 0
      on conflict (cart_id, listing_id) do update
        set quantity = greatest(1, least(cart_items.quantity + excluded.quantity, (select stock from listings where id = excluded.listing_id)))
      returning quantity`);
    const row = rows[0];
    if (!row) return { ok: false, reason: "out-of-stock" };
    return { ok: true, quantity: row.quantity, capped: row.quantity < (existing?.quantity ?? 0) + input.quantity };
  });
}

/** Sets a line's quantity, capped by stock; 0 removes it. */
export async function setCartQuantity(owner: CartOwner, input: { listingId: string; quantity: number }): Promise<CartChange> {
  if (input.quantity === 0) {
    await removeFromCart(owner, input.listingId);
    return { ok: true, quantity: 0, capped: false };
  }
  const cartId = await findCartId(owner);
  if (!cartId) return { ok: false, reason: "not-in-cart" };
  const { rows } = await db.execute<{ quantity: number; stock: number }>(sql`
    update cart_items ci
      set quantity = greatest(1, least(${input.quantity}, l.stock))
      from listings l
      where ci.cart_id = ${cartId} and ci.listing_id = ${input.listingId} and l.id = ci.listing_id
      returning ci.quantity, l.stock`);
  const row = rows[0];
  if (!row) return { ok: false, reason: "not-in-cart" };
  return { ok: true, quantity: row.quantity, capped: row.quantity < input.quantity };
}

export async function removeFromCart(owner: CartOwner, listingId: string): Promise<void> {
  const cartId = await findCartId(owner);
  if (!cartId) return;
  await db.delete(cartItems).where(and(eq(cartItems.cartId, cartId), eq(cartItems.listingId, listingId)));
}

/**
 * At sign-in: the visitor's lines join the member's cart. Quantities of the same item add up, capped
 * by stock; items no longer for sale are dropped; the visitor's cart is then gone. Returns how many
 * lines were carried over.
 */
export async function mergeVisitorCart(token: string, userId: string): Promise<number> {
  return db.transaction(async (tx) => {
    const visitorCartId = await findCartId({ token }, tx);
    if (!visitorCartId) return 0;
    const memberCartId = await ensureCart(tx, { userId });
    const { rowCount } = await tx.execute(sql`
      insert into cart_items (cart_id, listing_id, quantity, added_at)
      select ${memberCartId}, ci.listing_id, least(ci.quantity, l.stock), ci.added_at
      from cart_items ci join listings l on l.id = ci.listing_id
      where ci.cart_id = ${visitorCartId} and l.state = 'live' and l.stock > 0
      on conflict (cart_id, listing_id) do update
        set quantity = greatest(1, least(cart_items.quantity + excluded.quantity, (select stock from listings where id = excluded.listing_id)))`);
    await tx.delete(carts).where(eq(carts.id, visitorCartId));
    return rowCount ?? 0;
  });
}

/** After payment: the items bought leave the buyer's cart (in the payment's transaction). */
export async function removePurchasedItems(executor: Executor, userId: string, listingIds: string[]): Promise<void> {
  if (listingIds.length === 0) return;
  const cartId = await findCartId({ userId }, executor);
  if (!cartId) return;
  await executor.delete(cartItems).where(and(eq(cartItems.cartId, cartId), inArray(cartItems.listingId, listingIds)));
}
