import "server-only";
import { randomBytes } from "node:crypto";
import { cookies } from "next/headers";
import { mergeVisitorCart, type CartOwner } from "@/db/queries/cart";
import type { SessionUser } from "@/lib/auth/access";
import { env } from "@/lib/env";

// A visitor's cart is found by a random token in a cookie: 32 bytes, httpOnly so no script reads it,
// SameSite=Lax so it rides along when a visitor follows a link here but not on cross-site posts.

export const CART_COOKIE = "fluxyard_cart";
const TOKEN = /^[A-Za-z0-9_-]{43}$/;
const THIRTY_DAYS_S = 30 * 24 * 60 * 60;

export async function readCartToken(): Promise<string | null> {
  const value = (await cookies()).get(CART_COOKIE)?.value;
  return value && TOKEN.test(value) ? value : null;
}

/** The cart a request reads: the member's, else the visitor's (null when a visitor has none yet). */
export async function currentCartOwner(user: SessionUser | null): Promise<CartOwner | null> {
  if (user) return { userId: user.id };
  const token = await readCartToken();
  return token ? { token } : null;
}

/** For server actions and route handlers (which may set cookies): starts a visitor's cart token when missing. */
export async function cartOwnerForWrite(user: SessionUser | null): Promise<CartOwner> {
  const owner = await currentCartOwner(user);
  if (owner) return owner;
  const token = randomBytes(32).toString("base64url");
  (await cookies()).set(CART_COOKIE, token, {
    httpOnly: true,
    sameSite: "lax",
    secure: env().APP_URL.startsWith("https:"),
    path: "/",
    maxAge: THIRTY_DAYS_S,
  });
  return { token };
}

/**
 * Auth.js `events.signIn`: the visitor's cart joins the member's. Runs in the sign-in callback, where
 * the cookie of the browser that followed the link is readable. A failure never blocks the sign-in.
 */
export async function mergeCartAtSignIn(userId: string): Promise<void> {
  try {
    const token = await readCartToken();
    if (!token) return;
    await mergeVisitorCart(token, userId);
    (await cookies()).delete(CART_COOKIE);
  } catch (error) {
    console.error("[cart] could not merge the visitor's cart at sign-in:", (error as Error).message);
  }
}
