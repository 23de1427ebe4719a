import { describe, expect, it } from "vitest";
import { z } from "zod";
import { crossSiteReason } from "@/lib/http/cross-site";
import { parseJsonBody, readOptionalJson } from "@/lib/http/json";

// Requests as browsers send them: Origin (RFC 6454 §7; Fetch standard, "append a request Origin
// header": every request except same-origin GET/HEAD) and Sec-Fetch-Site (W3C Fetch Metadata).
// The app's own address in the tests is lib/env.ts's local default, http://localhost:3000.

const post = (headers: Record<string, string>, body = '{"quantity":1}') => new Request("http://localhost:3000/api/cart", { method: "POST", headers, body });

describe("crossSiteReason", () => {
  it("lets the app's own pages through", () => {
    expect(crossSiteReason(post({ host: "localhost:3000", origin: "http://localhost:3000", "sec-fetch-site": "same-origin" }))).toBeNull();
  });

  it("lets programs through: no Origin and no Fetch Metadata (curl, server-to-server)", () => {
    expect(crossSiteReason(post({ host: "localhost:3000" }))).toBeNull();
  });

  it("takes the host a proxy forwarded, and the public address, as the app's own", () => {
    expect(crossSiteReason(post({ host: "10.0.0.7:3000", "x-forwarded-host": "shop.fluxyard.example, 10.0.0.7", origin: "https://shop.fluxyard.example" }))).toBeNull();
    expect(crossSiteReason(post({ host: "10.0.0.7:3000", origin: "http://localhost:3000" }))).toBeNull();
  });

  it("refuses another origin, an opaque origin and a garbled one", () => {
    expect(crossSiteReason(post({ host: "localhost:3000", origin: "http://evil.example" }))).toMatch(/another site/);
    expect(crossSiteReason(post({ host: "localhost:3000", origin: "http://localhost:4010" }))).toMatch(/another site/);
    expect(crossSiteReason(post({ host: "localhost:3000", origin: "null" }))).toMatch(/opaque/);
    expect(crossSiteReason(post({ host: "localhost:3000", origin: "not a url" }))).toMatch(/not a URL/);
  });

  it("refuses what Fetch Metadata calls cross-site or same-site, whatever else is sent", () => {
    expect(crossSiteReason(post({ host: "localhost:3000", "sec-fetch-site": "cross-site" }))).toMatch(/cross-site/);
    expect(crossSiteReason(post({ host: "localhost:3000", origin: "http://localhost:3000", "sec-fetch-site": "same-site" }))).toMatch(/same-site/);
  });
});

describe("the JSON body readers", () => {
  const schema = z.object({ quantity: z.number() });

  it("refuse a foreign Origin with 403 before reading", async () => {
    const parsed = await parseJsonBody(post({ host: "localhost:3000", origin: "http://evil.example", "content-type": "application/json" }), schema);
    expect(parsed.ok).toBe(false);
    if (!parsed.ok) {
      expect(parsed.response.status).toBe(403);
      expect(await parsed.response.json()).toMatchObject({ error: "cross_site", fieldErrors: { "": [expect.any(String)] } });
    }
    const optional = await readOptionalJson(post({ host: "localhost:3000", origin: "http://evil.example" }, ""));
    expect(optional.ok ? 0 : optional.response.status).toBe(403);
  });

  it("refuse valid JSON that is not labelled JSON (what a form on another site can send unasked) with 415", async () => {
    for (const type of ["text/plain", "text/plain;charset=UTF-8", "application/x-www-form-urlencoded", "multipart/form-data; boundary=x"]) {
      const parsed = await parseJsonBody(post({ "content-type": type }), schema);
      expect(parsed.ok ? 0 : parsed.response.status, type).toBe(415);
      const optional = await readOptionalJson(post({ "content-type": type }));
      expect(optional.ok ? 0 : optional.response.status, type).toBe(415);
    }
  });

  it("accept JSON labelled so, with parameters and in any case, and a bare POST with no body", async () => {
    expect(await parseJsonBody(post({ "content-type": "Application/JSON; charset=utf-8" }), schema)).toEqual({ ok: true, data: { quantity: 1 } });
    expect(await readOptionalJson(post({ origin: "http://localhost:3000" }, ""))).toEqual({ ok: true, body: {} });
  });
});
