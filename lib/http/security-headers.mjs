// The response headers every page and route is served with (next.config.mjs `headers()`).
// Plain JavaScript so next.config.mjs can import it; types in security-headers.d.mts.
//
// Next computes `headers()` when it builds, not per request, so the origins come from the build's
// environment. A local build serves `npm start` and every test slot, whose stand-ins listen on
// different loopback ports, so it allows loopback on any port; a build for a public https address
// allows the hosted providers' hosts, or exactly the ones named by the variables below.

/** The local stand-ins (fakes/): uploads, payments' hosted pages, on 127.0.0.1 or localhost at any port. */
export const LOCAL_STAND_INS = ["http://127.0.0.1:*", "http://localhost:*"];

// The hosted providers' public hosts (from their documentation, from memory): files are served
// from the app's own subdomain of the upload store's file host, uploads go to its regional ingest
// hosts, and the payment provider's hosted checkout and payout onboarding have a host each.
const HOSTED_UPLOAD_FILES = "https://*.ufs.sh";
const HOSTED_UPLOAD_INGEST = "https://*.ingest.uploadthing.com";
const HOSTED_PAYMENT_PAGES = ["https://checkout.stripe.com", "https://connect.stripe.com"];

/** @param {string | undefined} value */
function originOf(value) {
  if (!value) return undefined;
  try {
    return new URL(value).origin;
  } catch {
    return undefined;
  }
}

/** The app id inside an upload token (base64 JSON `{ apiKey, appId, regions }`), to name its own file host. */
function uploadAppId(/** @type {string | undefined} */ token) {
  if (!token) return undefined;
  try {
    const appId = JSON.parse(Buffer.from(token, "base64").toString("utf8")).appId;
    return typeof appId === "string" && /^[a-z0-9-]+$/i.test(appId) ? appId : undefined;
  } catch {
    return undefined;
  }
}

/**
 * What the policy allows, read from the build's environment.
 * @param {Record<string, string | undefined>} env
 * @returns {import("./security-headers.d.mts").HeaderOptions}
 */
export function headerOptionsFromEnv(env) {
  const https = (env.APP_URL ?? "").startsWith("https://");
  const uploads = originOf(env.UPLOADS_PUBLIC_ORIGIN);
  const ingest = originOf(env.UPLOADTHING_INGEST_URL);
  const paymentPages = originOf(env.STRIPE_API_URL);
  const appId = uploadAppId(env.UPLOADTHING_TOKEN);
  const hosted = (/** @type {string[]} */ fallback) => (https ? fallback : LOCAL_STAND_INS);
  return {
    development: env.NODE_ENV !== "production",
    https,
    imageOrigins: uploads ? [uploads] : https && appId ? [`https://${appId}.ufs.sh`] : hosted([HOSTED_UPLOAD_FILES]),
    uploadOrigins: ingest ? [ingest] : hosted([HOSTED_UPLOAD_INGEST]),
    // The stand-in serves its hosted pages on the API's own address.
    paymentPageOrigins: paymentPages ? [paymentPages] : hosted(HOSTED_PAYMENT_PAGES),
  };
}

/**
 * The Content-Security-Policy (CSP Level 3). Scripts: Next's inline bootstrap scripts need
 * 'unsafe-inline' because static headers cannot carry per-request nonces; 'unsafe-eval' only for
 * `next dev`, whose fast refresh evaluates code. Styles: React writes style attributes.
 * @param {import("./security-headers.d.mts").HeaderOptions} options
 */
export function contentSecurityPolicy(options) {
  const list = (/** @type {string[]} */ extra) => ["'self'", ...extra].join(" ");
  const directives = [
    "default-src 'self'",
    `script-src 'self' 'unsafe-inline'${options.development ? " 'unsafe-eval'" : ""}`,
    "style-src 'self' 'unsafe-inline'",
    `img-src ${list(options.imageOrigins)}`,
    "font-src 'self'",
    `connect-src ${list(options.uploadOrigins)}`,
    // A form posted before the page is interactive is answered with a redirect to the hosted checkout or onboarding.
    `form-action ${list(options.paymentPageOrigins)}`,
    "frame-src 'none'",
    "frame-ancestors 'none'",
    "object-src 'none'",
    "base-uri 'self'",
    "manifest-src 'self'",
    "worker-src 'self'",
  ];
  if (options.https) directives.push("upgrade-insecure-requests");
  return directives.join("; ");
}

/**
 * @param {import("./security-headers.d.mts").HeaderOptions} options
 * @returns {{ key: string; value: string }[]}
 */
export function securityHeaders(options) {
  const headers = [
    { key: "Content-Security-Policy", value: contentSecurityPolicy(options) },
    // Full URLs (with ids and searches) stay on this site; other sites see only the origin, and nothing over plain http.
    { key: "Referrer-Policy", value: "strict-origin-when-cross-origin" },
    { key: "X-Content-Type-Options", value: "nosniff" },
    // For browsers that predate frame-ancestors.
    { key: "X-Frame-Options", value: "DENY" },
    // Nothing here needs the camera, microphone, location, payment handlers, USB or serial ports.
    { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=(), payment=(), usb=(), serial=(), browsing-topics=()" },
    // The hosted checkout is reached by navigation, never a popup, so no window needs a handle on ours.
    { key: "Cross-Origin-Opener-Policy", value: "same-origin" },
  ];
  if (options.https) headers.push({ key: "Strict-Transport-Security", value: "max-age=31536000" });
  return headers;
}
