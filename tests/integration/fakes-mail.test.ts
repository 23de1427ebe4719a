// The local mail fake, driven by the real resend SDK (6.38.0) the app uses. The SDK is the
// reference for the wire format: what it sends, and which answers it turns into { data } or
// { error }. Error names and messages follow the hosted API's documented error shape
// { statusCode, name, message } (names such as missing_required_field from memory).
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { Resend } from "resend";
import { afterAll, afterEach, beforeAll, describe, expect, it } from "vitest";
import { startMailFake, type MailFake } from "@/fakes/mail/server";

const FROM = "Fluxyard <no-reply@fluxyard.test>";

type ListedMessage = { id: string; to: string[]; subject: string; html: string | null; text: string | null; createdAt: string };

// Decodes the five character references the HTML spec needs for quoted attributes and text.
function decodeHtml(value: string): string {
  return value
    .replace(/&quot;/g, '"')
    .replace(/&#39;/g, "'")
    .replace(/&lt;/g, "<")
    .replace(/&gt;/g, ">")
    .replace(/&amp;/g, "&");
}

describe("mail fake", () => {
  let fake: MailFake;
  let resend: Resend;
  let dir: string;

  const messages = async (query = ""): Promise<ListedMessage[]> => {
    const response = await fetch(`${fake.url}/api/messages${query}`);
    expect(response.status).toBe(200);
    return (await response.json()) as ListedMessage[];
  };

  beforeAll(async () => {
    dir = mkdtempSync(path.join(tmpdir(), "fluxyard-mail-fake-"));
    fake = await startMailFake({ port: 0, storeFile: path.join(dir, "outbox.json") });
    resend = new Resend("re_test_key", { baseUrl: fake.url });
  });

  afterEach(async () => {
    await fetch(`${fake.url}/api/fail-mode`, { method: "POST", body: JSON.stringify({ down: false }) });
    await fetch(`${fake.url}/api/messages`, { method: "DELETE" });
  });

  afterAll(async () => {
    await fake.close();
    rmSync(dir, { recursive: true, force: true });
  });

  it("answers health checks", async () => {
    const response = await fetch(`${fake.url}/api/health`);
    expect(await response.json()).toEqual({ ok: true, service: "mail" });
  });

  it("accepts SDK sends and lists them newest first with recipients as arrays", async () => {
    const first = await resend.emails.send({
      from: FROM,
      to: "buyer@fluxyard.test",
      subject: "Your order is paid",
      html: "<p>Paid.</p>",
      text: "Paid.",
      replyTo: "seller@fluxyard.test",
      tags: [{ name: "kind", value: "order-paid" }],
    });
    const second = await resend.emails.send({
      from: FROM,
      to: ["seller@fluxyard.test", "Second Seller <other-seller@fluxyard.test>"],
      subject: "New order",
      text: "Someone bought your kit.",
    });
    expect(first.error).toBeNull();
    expect(second.error).toBeNull();
    // The hosted API answers { id }; ids here are UUIDs like the service's.
    expect(first.data?.id).toMatch(/^[0-9a-f-]{36}$/);

    const listed = await messages();
    expect(listed.map((m) => m.id)).toEqual([second.data?.id, first.data?.id]);
    expect(listed[0]).toMatchObject({
      to: ["seller@fluxyard.test", "Second Seller <other-seller@fluxyard.test>"],
      subject: "New order",
      html: null,
      text: "Someone bought your kit.",
    });
    expect(listed[1]).toMatchObject({ to: ["buyer@fluxyard.test"], subject: "Your order is paid", html: "<p>Paid.</p>", text: "Paid." });
    expect(Number.isNaN(Date.parse(listed[1]?.createdAt ?? ""))).toBe(false);

    const forBuyer = await messages("?to=BUYER@fluxyard.test");
    expect(forBuyer.map((m) => m.subject)).toEqual(["Your order is paid"]);
    const byNamedAddress = await messages(`?to=${encodeURIComponent("other-seller@fluxyard.test")}`);
    expect(byNamedAddress.map((m) => m.subject)).toEqual(["New order"]);
  });

  it("returns a sent message through the SDK's emails.get", async () => {
    const sent = await resend.emails.send({ from: FROM, to: "a@fluxyard.test", subject: "Look me up", html: "<p>x</p>" });
    const fetched = await resend.emails.get(sent.data?.id ?? "");
    expect(fetched.error).toBeNull();
    expect(fetched.data).toMatchObject({ object: "email", id: sent.data?.id, to: ["a@fluxyard.test"], subject: "Look me up", html: "<p>x</p>" });

    const missing = await resend.emails.get("00000000-0000-4000-8000-000000000000");
    expect(missing.error).toMatchObject({ statusCode: 404, name: "not_found" });
  });

  it("sends a batch and answers { data: [{ id }] }", async () => {
    const batch = await resend.batch.send([
      { from: FROM, to: "one@fluxyard.test", subject: "First of two", text: "1" },
      { from: FROM, to: "two@fluxyard.test", subject: "Second of two", text: "2" },
    ]);
    expect(batch.error).toBeNull();
    expect(batch.data?.data).toHaveLength(2);
    const listed = await messages();
    expect(listed.map((m) => m.subject)).toEqual(["Second of two", "First of two"]);
    expect(listed.map((m) => m.id)).toEqual([batch.data?.data[1]?.id, batch.data?.data[0]?.id]);

    // Strict validation (the SDK's default) refuses the whole batch when one email is invalid.
    const refused = await resend.batch.send([
      { from: FROM, to: "ok@fluxyard.test", subject: "Fine", text: "ok" },
      { from: FROM, to: "ok@fluxyard.test", text: "no subject" } as never,
    ]);
    expect(refused.error).toMatchObject({ statusCode: 422 });
    expect(await messages()).toHaveLength(2);
  });

  it("replays an Idempotency-Key instead of sending twice", async () => {
    const payload = { from: FROM, to: "buyer@fluxyard.test", subject: "Once only", text: "x" };
    const first = await resend.emails.send(payload, { idempotencyKey: "order-17-paid" });
    const again = await resend.emails.send(payload, { idempotencyKey: "order-17-paid" });
    expect(again.data?.id).toBe(first.data?.id);
    expect(await messages()).toHaveLength(1);
  });

  it("refuses a request without an API key with 401", async () => {
    const response = await fetch(`${fake.url}/emails`, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ from: FROM, to: "x@fluxyard.test", subject: "s", text: "t" }),
    });
    expect(response.status).toBe(401);
    expect(await response.json()).toMatchObject({ statusCode: 401, name: "missing_api_key" });
    expect(await messages()).toHaveLength(0);
  });

  it("answers missing to, from or subject with 422 in the service's error shape", async () => {
    const noTo = await resend.emails.send({ from: FROM, subject: "Nobody", html: "<p>x</p>" } as never);
    expect(noTo.data).toBeNull();
    expect(noTo.error).toMatchObject({ statusCode: 422, name: "missing_required_field" });
    expect(noTo.error?.message).toContain("`to`");

    const noFrom = await resend.emails.send({ to: "x@fluxyard.test", subject: "s", text: "t" } as never);
    expect(noFrom.error).toMatchObject({ statusCode: 422 });
    expect(noFrom.error?.message).toContain("`from`");

    const noSubject = await resend.emails.send({ from: FROM, to: "x@fluxyard.test", text: "t" } as never);
    expect(noSubject.error).toMatchObject({ statusCode: 422 });
    expect(noSubject.error?.message).toContain("`subject`");

    const badAddress = await resend.emails.send({ from: FROM, to: "not-an-address", subject: "s", text: "t" });
    expect(badAddress.error).toMatchObject({ statusCode: 422, name: "validation_error" });
    expect(await messages()).toHaveLength(0);
  });

  it("answers 503 while in fail mode and recovers", async () => {
    const down = await fetch(`${fake.url}/api/fail-mode`, { method: "POST", body: JSON.stringify({ down: true }) });
    expect(await down.json()).toEqual({ down: true });
    const failed = await resend.emails.send({ from: FROM, to: "x@fluxyard.test", subject: "Lost", text: "t" });
    expect(failed.data).toBeNull();
    expect(failed.error?.statusCode).toBe(503);
    expect(await messages()).toHaveLength(0);

    await fetch(`${fake.url}/api/fail-mode`, { method: "POST", body: JSON.stringify({ down: false }) });
    const recovered = await resend.emails.send({ from: FROM, to: "x@fluxyard.test", subject: "Delivered", text: "t" });
    expect(recovered.error).toBeNull();
    expect((await messages()).map((m) => m.subject)).toEqual(["Delivered"]);
  });

  it("lists subjects HTML-escaped on the outbox page", async () => {
    await resend.emails.send({ from: FROM, to: "buyer@fluxyard.test", subject: `Order <b>#12</b> & "paid"`, text: "t" });
    const response = await fetch(`${fake.url}/`);
    expect(response.headers.get("content-type")).toContain("text/html");
    const page = await response.text();
    expect(page).toContain("local development outbox");
    // HTML spec: <, >, & and " in text must be written as character references.
    expect(page).toContain("Order &lt;b&gt;#12&lt;/b&gt; &amp; &quot;paid&quot;");
    expect(page).not.toContain("<b>#12</b>");
    expect(page).toContain("buyer@fluxyard.test");
  });

  it("shows a message with its HTML in a sandboxed srcdoc frame and its text version", async () => {
    const html = `<p>Sign in: <a href="http://localhost:3000/api/auth/callback/resend?token=abc&email=x%40y.test">open</a></p><script>alert(1)</script>`;
    const sent = await resend.emails.send({ from: FROM, to: "x@fluxyard.test", subject: "Sign in", html, text: "Sign in: <link> & go" });
    const page = await (await fetch(`${fake.url}/messages/${sent.data?.id}`)).text();

    const frame = /<iframe\b[^>]*>/.exec(page)?.[0] ?? "";
    expect(frame).toContain('sandbox="allow-popups allow-popups-to-escape-sandbox allow-top-navigation-by-user-activation"');
    // No allow-scripts: the message's script must not run.
    expect(frame).not.toContain("allow-scripts");
    const srcdoc = /srcdoc="([^"]*)"/.exec(frame)?.[1];
    expect(srcdoc).toBeDefined();
    expect(decodeHtml(srcdoc ?? "")).toContain(html);
    expect(page).toContain("<pre>Sign in: &lt;link&gt; &amp; go</pre>");

    const unknown = await fetch(`${fake.url}/messages/no-such-id`);
    expect(unknown.status).toBe(404);
  });

  it("keeps the outbox in its store file across a restart", async () => {
    const storeFile = path.join(dir, "restart.json");
    const before = await startMailFake({ port: 0, storeFile });
    const client = new Resend("re_test_key", { baseUrl: before.url });
    await client.emails.send({ from: FROM, to: "x@fluxyard.test", subject: "Survives a restart", text: "t" });
    await before.close();

    const after = await startMailFake({ port: 0, storeFile });
    try {
      const listed = (await (await fetch(`${after.url}/api/messages`)).json()) as ListedMessage[];
      expect(listed.map((m) => m.subject)).toEqual(["Survives a restart"]);
    } finally {
      await after.close();
    }
  });

  it("accepts only the configured key when one is set", async () => {
    const strict = await startMailFake({ port: 0, apiKey: "re_the_right_key" });
    try {
      const wrong = await new Resend("re_wrong_key", { baseUrl: strict.url }).emails.send({ from: FROM, to: "x@fluxyard.test", subject: "s", text: "t" });
      expect(wrong.error).toMatchObject({ statusCode: 403, name: "invalid_api_key" });
      const right = await new Resend("re_the_right_key", { baseUrl: strict.url }).emails.send({ from: FROM, to: "x@fluxyard.test", subject: "s", text: "t" });
      expect(right.error).toBeNull();
    } finally {
      await strict.close();
    }
  });
});
