import { describe, expect, it } from "vitest";
import { contentSecurityPolicy, headerOptionsFromEnv, LOCAL_STAND_INS, securityHeaders } from "@/lib/http/security-headers.mjs";

// The policy next.config.mjs builds, for the environments it is built in. Directive names and
// source expressions from Content Security Policy Level 3 (W3C); the header set from the OWASP
// Secure Headers Project's recommendations (common practice).

const directives = (csp: string) => Object.fromEntries(csp.split(";").map((d) => d.trim().split(/\s+/)).map(([name, ...v]) => [name!, v]));

describe("headerOptionsFromEnv", () => {
  it("a local production build (npm start, npm test): the stand-ins on loopback at any port, no eval", () => {
    const o = headerOptionsFromEnv({ NODE_ENV: "production" });
    expect(o).toEqual({ development: false, https: false, imageOrigins: LOCAL_STAND_INS, uploadOrigins: LOCAL_STAND_INS, paymentPageOrigins: LOCAL_STAND_INS });
    expect(directives(contentSecurityPolicy(o))["script-src"]).toEqual(["'self'", "'unsafe-inline'"]);
  });

  it("next dev allows eval for fast refresh, and only there", () => {
    expect(directives(contentSecurityPolicy(headerOptionsFromEnv({ NODE_ENV: "development" })))["script-src"]).toContain("'unsafe-eval'");
  });

  it("a build for a public https address names the hosted providers, the app's own file host when the token says it", () => {
    const token = Buffer.from(JSON.stringify({ apiKey: "sk_live_x", appId: "fluxyard42", regions: ["fra1"] })).toString("base64");
    const o = headerOptionsFromEnv({ NODE_ENV: "production", APP_URL: "https://fluxyard.example", UPLOADTHING_TOKEN: token });
    expect(o.https).toBe(true);
    expect(o.imageOrigins).toEqual(["https://fluxyard42.ufs.sh"]);
    expect(o.uploadOrigins).toEqual(["https://*.ingest.uploadthing.com"]);
    expect(o.paymentPageOrigins.every((p) => p.startsWith("https://"))).toBe(true);
    expect(o.imageOrigins.concat(o.uploadOrigins, o.paymentPageOrigins).some((s) => s.includes("127.0.0.1") || s.includes("localhost"))).toBe(false);
  });

  it("explicit addresses win, reduced to their origins", () => {
    const o = headerOptionsFromEnv({
      NODE_ENV: "production",
      APP_URL: "https://fluxyard.example",
      UPLOADS_PUBLIC_ORIGIN: "https://files.fluxyard.example/some/path",
      UPLOADTHING_INGEST_URL: "https://ingest.fluxyard.example/",
      STRIPE_API_URL: "https://pay.fluxyard.example:8443/v1",
    });
    expect(o.imageOrigins).toEqual(["https://files.fluxyard.example"]);
    expect(o.uploadOrigins).toEqual(["https://ingest.fluxyard.example"]);
    expect(o.paymentPageOrigins).toEqual(["https://pay.fluxyard.example:8443"]);
  });
});

describe("contentSecurityPolicy", () => {
  const o = { development: false, https: true, imageOrigins: ["https://img.example"], uploadOrigins: ["https://up.example"], paymentPageOrigins: ["https://pay.example"] };
  const d = directives(contentSecurityPolicy(o));

  it("closes what an injected script would reach for first", () => {
    expect(d["default-src"]).toEqual(["'self'"]);
    expect(d["object-src"]).toEqual(["'none'"]);
    expect(d["base-uri"]).toEqual(["'self'"]);
    expect(d["frame-ancestors"]).toEqual(["'none'"]);
    expect(d["frame-src"]).toEqual(["'none'"]);
    expect(d["script-src"]).not.toContain("'unsafe-eval'");
    expect(Object.values(d).flat()).not.toContain("*");
  });

  it("allows exactly the configured origins where they are used", () => {
    expect(d["img-src"]).toEqual(["'self'", "https://img.example"]);
    expect(d["connect-src"]).toEqual(["'self'", "https://up.example"]);
    expect(d["form-action"]).toEqual(["'self'", "https://pay.example"]);
    expect(d["upgrade-insecure-requests"]).toEqual([]);
  });

  it("on plain http does not upgrade requests or pin https", () => {
    const local = { ...o, https: false };
    expect(directives(contentSecurityPolicy(local))["upgrade-insecure-requests"]).toBeUndefined();
    expect(securityHeaders(local).map((h) => h.key)).not.toContain("Strict-Transport-Security");
    expect(securityHeaders(o).find((h) => h.key === "Strict-Transport-Security")?.value).toMatch(/^max-age=\d{7,}/);
  });

  it("comes with the referrer, sniffing, framing and permissions headers", () => {
    const h = Object.fromEntries(securityHeaders(o).map(({ key, value }) => [key, value]));
    expect(h["Referrer-Policy"]).toBe("strict-origin-when-cross-origin");
    expect(h["X-Content-Type-Options"]).toBe("nosniff");
    expect(h["X-Frame-Options"]).toBe("DENY");
    expect(h["Permissions-Policy"]).toMatch(/camera=\(\)/);
  });
});
