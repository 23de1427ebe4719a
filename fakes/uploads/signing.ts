// uploadthing's signature scheme: "hmac-sha256=" + hex(HMAC-SHA256(apiKey, message)). Presigned
// URLs sign the whole URL up to "&signature="; callbacks sign the raw JSON body.
import { createHmac, timingSafeEqual } from "node:crypto";

const PREFIX = "hmac-sha256=";

export function signPayload(payload: string, apiKey: string): string {
  return PREFIX + createHmac("sha256", apiKey).update(payload).digest("hex");
}

export function signatureMatches(payload: string, signature: string | null | undefined, apiKey: string): boolean {
  if (!signature?.startsWith(PREFIX)) return false;
  const given = Buffer.from(signature.slice(PREFIX.length), "hex");
  const expected = createHmac("sha256", apiKey).update(payload).digest();
  return given.length === expected.length && timingSafeEqual(given, expected);
}

/** Appends expires (ms since epoch) and the signature, the way the SDK's generateSignedURL does. */
export function signUrl(url: string, apiKey: string, ttlSeconds: number, now = Date.now()): string {
  const parsed = new URL(url);
  parsed.searchParams.append("expires", String(now + ttlSeconds * 1000));
  parsed.searchParams.append("signature", signPayload(parsed.toString(), apiKey));
  return parsed.href;
}

export type SignedRequest =
  | { ok: true; params: URLSearchParams; expires: number }
  | { ok: false; reason: string };

/**
 * Checks a signed path+query as received, against each origin the signer may have used (the
 * fake's own address, or the Host header the client sent). Nothing may follow the signature.
 */
export function verifySignedPath(
  rawPath: string,
  origins: string[],
  apiKey: string,
  now = Date.now(),
): SignedRequest {
  const at = rawPath.lastIndexOf("&signature=");
  if (at < 0) return { ok: false, reason: "the URL carries no signature" };
  const tail = new URLSearchParams(rawPath.slice(at + 1));
  const signature = tail.get("signature");
  if ([...tail.keys()].length !== 1) return { ok: false, reason: "parameters after the signature are not signed" };
  const unsigned = rawPath.slice(0, at);
  if (!origins.some((origin) => signatureMatches(origin + unsigned, signature, apiKey))) {
    return { ok: false, reason: "invalid signature" };
  }
  const params = new URL(unsigned, "http://signed.invalid").searchParams;
  const expires = Number(params.get("expires"));
  if (!Number.isFinite(expires)) return { ok: false, reason: "the URL carries no expiry" };
  if (now > expires) return { ok: false, reason: "the URL has expired" };
  return { ok: true, params, expires };
}

/** The SDK encodes each x-ut-* value with encodeURIComponent before URLSearchParams encodes it again. */
export function signedValue(params: URLSearchParams, name: string): string | null {
  const value = params.get(name);
  if (value === null) return null;
  try {
    return decodeURIComponent(value);
  } catch {
    return value;
  }
}
