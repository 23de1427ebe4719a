import type { RateLimitRule } from "./window";

// How often a sign-in link may be asked for. Per address, so nobody can fill a stranger's inbox;
// per client address, so one machine cannot spray links at many inboxes. Fixed windows of a
// quarter of an hour; a person who mistyped or lost a mail a few times is never near either.

export const LINKS_PER_ADDRESS = 10;
export const LINKS_PER_CLIENT = 30;
export const SIGN_IN_WINDOW_SECONDS = 15 * 60;

export const signInAddressLimit = (email: string): RateLimitRule => ({
  key: `sign-in:address:${email.trim().toLowerCase()}`,
  limit: LINKS_PER_ADDRESS,
  windowSeconds: SIGN_IN_WINDOW_SECONDS,
});

export const signInClientLimit = (client: string): RateLimitRule => ({
  key: `sign-in:client:${client}`,
  limit: LINKS_PER_CLIENT,
  windowSeconds: SIGN_IN_WINDOW_SECONDS,
});

export const addressRefusal = (retry: string) =>
  `This address has been sent ${LINKS_PER_ADDRESS} sign-in links in this quarter of an hour, the most we send. Use the newest link in your inbox (each works for 30 minutes), or ask for another ${retry}.`;

export const clientRefusal = (retry: string) =>
  `Your network has asked for ${LINKS_PER_CLIENT} sign-in links in this quarter of an hour, the most we take from one network. You can ask again ${retry}.`;

/**
 * The client's address as the nearest proxy saw it: the last entry of X-Forwarded-For (each proxy
 * appends the address it received the request from; `next start` alone fills the header in from
 * the socket when it is missing). Loopback and missing addresses give null: the caller is this
 * machine — a local run, or a proxy that forwards nothing — and counting them would put every
 * visitor into one window.
 */
export function clientAddress(forwardedFor: string | null, realIp: string | null = null): string | null {
  const entries = (forwardedFor ?? "").split(",").map((e) => e.trim()).filter(Boolean);
  const raw = entries.at(-1) ?? realIp?.trim() ?? "";
  const address = raw.replace(/^::ffff:/i, "").toLowerCase();
  if (address === "" || address === "unknown") return null;
  if (address === "::1" || address.startsWith("127.")) return null;
  return address;
}
