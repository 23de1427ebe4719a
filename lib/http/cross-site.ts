import { env } from "@/lib/env";
import { jsonError } from "./json-error";

// A browser that posts from another site still sends this site's cookies when they allow it (and
// SameSite=Lax still lets same-site pages — a sibling subdomain — do so). What it cannot forge is
// where the request came from: `Sec-Fetch-Site` (Fetch Metadata, W3C) and `Origin` (RFC 6454 §7,
// sent on every cross-origin request and on every POST by current browsers). A request that names
// another origin is refused before its body is read. Requests with neither header come from
// programs, not browsers, and carry only the credentials their author gave them.

const REFUSAL = "This request came from another site and was refused. Use the form on Fluxyard itself.";

/** The first value of a possibly comma-joined header, as proxies write it. */
function firstValue(value: string | null): string | null {
  const first = value?.split(",")[0]?.trim();
  return first ? first : null;
}

function hostOf(origin: string): string | null {
  try {
    return new URL(origin).host;
  } catch {
    return null;
  }
}

/** The hosts this app answers as: the one the request was addressed to (behind a proxy, the forwarded one) and the public address. */
function ownHosts(request: Request): Set<string> {
  const hosts = new Set<string>();
  const forwarded = firstValue(request.headers.get("x-forwarded-host"));
  const host = request.headers.get("host");
  if (forwarded) hosts.add(forwarded);
  if (host) hosts.add(host);
  const publicHost = hostOf(env().APP_URL);
  if (publicHost) hosts.add(publicHost);
  return hosts;
}

/** Why the request is cross-site, or null when it is same-origin (or from a program that sends neither header). */
export function crossSiteReason(request: Request): string | null {
  const site = request.headers.get("sec-fetch-site");
  // "same-site" is another origin of the same registrable domain: not this app either.
  if (site === "cross-site" || site === "same-site") return `Sec-Fetch-Site is ${site}`;
  const origin = request.headers.get("origin");
  if (origin === null) return null;
  // Sandboxed frames, data: and file: documents send the opaque origin "null".
  if (origin === "null") return "the Origin is opaque (null)";
  const host = hostOf(origin);
  if (host === null) return "the Origin is not a URL";
  return ownHosts(request).has(host) ? null : `the Origin ${origin} is another site`;
}

/** 403 for a request another site made the browser send; null when it may go on. */
export function crossSiteRefusal(request: Request): Response | null {
  const reason = crossSiteReason(request);
  if (reason === null) return null;
  return jsonError(403, "cross_site", REFUSAL, { "": [REFUSAL] });
}
