// Where a sign-in may send someone afterwards: a path on this site and nothing else. "Starts with
// one slash" is not enough: the WHATWG URL parser reads "\" as "/" in http(s) URLs and drops tabs
// and newlines, so "/\evil.example" and "/\t/evil.example" are both "//evil.example" — another
// host — to a browser following a Location header (an open redirect, OWASP's "Unvalidated
// Redirects and Forwards"). So the path is resolved the way the browser will resolve it.

const PROBE_ORIGIN = "http://fluxyard.invalid";

/** The path itself when it stays on this site once a browser has parsed it; otherwise `fallback`. */
export function safeNextPath(value: string | null | undefined, fallback = "/account"): string {
  if (!value || !value.startsWith("/")) return fallback;
  // Backslashes and control characters have no business in our own links; refuse rather than repair.
  if (/[\\\u0000-\u001f\u007f]/.test(value)) return fallback;
  let resolved: URL;
  try {
    resolved = new URL(value, PROBE_ORIGIN);
  } catch {
    return fallback;
  }
  if (resolved.origin !== PROBE_ORIGIN || value.startsWith("//")) return fallback;
  return value;
}
