// The fake's form-body decoder against the encoder it must understand: the SDK's own
// (stripe@23.1.0 utils.js stringifyRequestData, "compatible with the qs library's indexed
// array format"), reached through `stripe.rawRequest`, plus the WHATWG
// application/x-www-form-urlencoded rules for `+` and percent-escapes.
import http from "node:http";
import fc from "fast-check";
import Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { decodeFormBody, FormDecodeError, type FormValue } from "@/fakes/payments/form-body";

let capture: http.Server;
let stripe: Stripe;
const bodies: string[] = [];

beforeAll(async () => {
  capture = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => chunks.push(c));
    req.on("end", () => {
      bodies.push(Buffer.concat(chunks).toString("utf8"));
      res.writeHead(200, { "Content-Type": "application/json" });
      res.end("{}");
    });
  });
  await new Promise<void>((resolve) => capture.listen(0, "127.0.0.1", resolve));
  const port = (capture.address() as { port: number }).port;
  stripe = new Stripe("sk_test_form_body", { host: "127.0.0.1", port, protocol: "http", maxNetworkRetries: 0 });
});

afterAll(async () => {
  capture.closeAllConnections();
  await new Promise<void>((resolve) => capture.close(() => resolve()));
});

/** What the SDK puts on the wire for `params`. */
async function encodedBySdk(params: Record<string, unknown>): Promise<string> {
  await stripe.rawRequest("POST", "/v1/echo", params);
  const body = bodies.at(-1);
  if (body === undefined) throw new Error("nothing captured");
  return body;
}

// Values arrive as strings: the wire format has no other type.
function asWire(value: unknown): FormValue {
  if (Array.isArray(value)) return value.map(asWire);
  if (value !== null && typeof value === "object") {
    return Object.fromEntries(Object.entries(value).map(([k, v]) => [k, asWire(v)]));
  }
  return String(value);
}

describe("decodeFormBody", () => {
  it("reads the SDK's encoding of a checkout session back into the same structure", async () => {
    const params = {
      mode: "payment",
      line_items: [
        { price_data: { currency: "eur", unit_amount: 4850, product_data: { name: "Choke 40 µH & 30 A [gapped]" } }, quantity: 2 },
        { price_data: { currency: "eur", unit_amount: 1200, product_data: { name: "CT 1:100 = 50%+" } }, quantity: 1 },
      ],
      metadata: { orderId: "order_1001", "0": "numeric key stays a key" },
      expand: ["payment_intent", "line_items"],
      payment_intent_data: { capture_method: "manual", metadata: { note: "a=b&c=d" } },
    };
    const wire = await encodedBySdk(params);
    expect(wire).toContain("line_items[0][price_data][unit_amount]=4850");
    expect(decodeFormBody(wire)).toEqual(asWire(params));
  });

  it("accepts the list forms a[]=x and a[0]=x alike, and encoded brackets", () => {
    expect(decodeFormBody("expand[]=a&expand[]=b")).toEqual({ expand: ["a", "b"] });
    expect(decodeFormBody("expand[0]=a&expand[1]=b")).toEqual({ expand: ["a", "b"] });
    expect(decodeFormBody("expand%5B0%5D=a")).toEqual({ expand: ["a"] });
    expect(decodeFormBody("items[1][q]=2&items[0][q]=1")).toEqual({ items: [{ q: "1" }, { q: "2" }] });
  });

  it("decodes + as a space and percent-escapes as UTF-8 (WHATWG urlencoded parser)", () => {
    expect(decodeFormBody("name=Bench+supply%20%C2%B5H")).toEqual({ name: "Bench supply µH" });
    expect(decodeFormBody("empty=&flag")).toEqual({ empty: "", flag: "" });
  });

  it("rejects malformed escapes and prototype keys", () => {
    expect(() => decodeFormBody("a=%zz")).toThrow(FormDecodeError);
    expect(() => decodeFormBody("__proto__[polluted]=1")).toThrow(FormDecodeError);
    expect(() => decodeFormBody("a[constructor][x]=1")).toThrow(FormDecodeError);
    expect(({} as Record<string, unknown>).polluted).toBeUndefined();
    expect(() => decodeFormBody("a[5000]=x")).toThrow(FormDecodeError);
  });

  it("round-trips arbitrary nested params through the SDK's encoder", async () => {
    const key = fc.stringMatching(/^[a-z][a-z_]{0,7}$/);
    const text = fc.string({ maxLength: 12, unit: fc.constantFrom("a", "Z", " ", "&", "=", "[", "]", "%", "+", "µ", "€", "/", "?", "#", "0") });
    const leaf = fc.oneof(text, fc.integer({ min: -1e6, max: 1e6 }), fc.boolean());
    const tree = fc.letrec<{ node: unknown }>((tie) => ({
      node: fc.oneof(
        { depthSize: "small", withCrossShrink: true },
        leaf,
        fc.array(tie("node"), { minLength: 1, maxLength: 3 }),
        fc.dictionary(key, tie("node"), { minKeys: 1, maxKeys: 3 }),
      ),
    })).node;
    // Empty containers put nothing on the wire, so they cannot round-trip; leave them out.
    const hasEmpty = (v: unknown): boolean =>
      Array.isArray(v) ? v.length === 0 || v.some(hasEmpty) : v !== null && typeof v === "object" ? Object.keys(v).length === 0 || Object.values(v).some(hasEmpty) : false;
    const params = fc.dictionary(key, tree, { minKeys: 1, maxKeys: 4 }).filter((p) => !hasEmpty(p));
    await fc.assert(
      fc.asyncProperty(params, async (p) => {
        expect(decodeFormBody(await encodedBySdk(p))).toEqual(asWire(p));
      }),
      { numRuns: 60 },
    );
  });
});
