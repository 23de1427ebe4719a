// `/api/test/…`: switches and shortcuts for tests, answered in plain JSON.
import type { ServerResponse } from "node:http";
import { internalOrigin, type FakeContext } from "./context";
import { completeOnboarding } from "./core/accounts";
import { expireDueSessions, paySession, successRedirect } from "./core/checkout";
import { parseJsonObject, sendJson } from "./http-util";
import { TEST_PAYOUT_DETAILS } from "./pages/onboarding-page";

export interface TestControls {
  isDown(): boolean;
  setDown(down: boolean): void;
  addEndpoint(url: string, secret: string): void;
  reset(): void;
}

function bad(res: ServerResponse, message: string, status = 400): void {
  sendJson(res, status, { ok: false, error: { message } });
}

function str(body: Record<string, unknown>, key: string): string | undefined {
  const value = body[key];
  return typeof value === "string" && value !== "" ? value : undefined;
}

export function handleTestHook(
  ctx: FakeContext,
  controls: TestControls,
  res: ServerResponse,
  method: string,
  url: URL,
  rawBody: string,
): void {
  const path = url.pathname.replace(/^\/api\/test/, "");
  const body = method === "POST" ? parseJsonObject(rawBody) : {};
  if (!body) return bad(res, "Send a JSON object.");

  if (path === "/fail-mode") {
    if (method === "POST") {
      if (typeof body.down !== "boolean") return bad(res, "Send { down: true } or { down: false }.");
      controls.setDown(body.down);
    }
    return sendJson(res, 200, { ok: true, down: controls.isDown() });
  }

  if (path === "/hold-webhooks") {
    if (method === "POST") {
      if (typeof body.held !== "boolean") return bad(res, "Send { held: true } or { held: false }.");
      ctx.dispatcher.setHeld(body.held);
    }
    return sendJson(res, 200, { ok: true, held: ctx.dispatcher.isHeld() });
  }

  if (path === "/deliveries" && method === "GET") {
    const eventId = url.searchParams.get("event_id");
    const type = url.searchParams.get("type");
    const deliveries = ctx.dispatcher
      .list()
      .filter((d) => (!eventId || d.event_id === eventId) && (!type || d.event_type === type));
    return sendJson(res, 200, { ok: true, deliveries });
  }

  if (path === "/webhooks") {
    if (method === "POST") {
      const endpointUrl = str(body, "url");
      const secret = str(body, "secret");
      if (!endpointUrl || !secret) return bad(res, "Send { url, secret }.");
      try {
        new URL(endpointUrl);
      } catch {
        return bad(res, `Not a URL: ${endpointUrl}`);
      }
      controls.addEndpoint(endpointUrl, secret);
    }
    return sendJson(res, 200, { ok: true, endpoints: ctx.dispatcher.listEndpoints() });
  }

  const resend = /^\/resend\/([^/]+)$/.exec(path);
  if (resend && method === "POST") {
    const event = ctx.store.state.events[decodeURIComponent(resend[1] ?? "")];
    if (!event) return bad(res, "No such event.", 404);
    const deliveries = ctx.dispatcher.enqueue(event, str(body, "url"));
    return sendJson(res, 200, { ok: true, deliveries });
  }

  if (path === "/pay" && method === "POST") {
    const sessionId = str(body, "sessionId");
    const card = str(body, "card");
    if (!sessionId || !card) return bad(res, "Send { sessionId, card }.");
    const result = paySession(ctx, sessionId, { card, email: str(body, "email"), name: str(body, "name") }, internalOrigin(ctx));
    switch (result.kind) {
      case "missing":
        return bad(res, `No such checkout session: ${sessionId}`, 404);
      case "not_open":
        return sendJson(res, 409, { ok: false, error: { message: `The session is ${result.session.status}.` }, session: result.session });
      case "unknown_card":
        return sendJson(res, 400, { ok: false, error: { code: "incorrect_number", message: result.message }, session: result.session });
      case "declined":
        return sendJson(res, 402, {
          ok: false,
          error: { code: result.error.code, decline_code: result.error.decline_code, message: result.error.message },
          session: result.session,
          payment_intent: result.intent,
        });
      case "paid":
        return sendJson(res, 200, {
          ok: true,
          session: result.session,
          payment_intent: result.intent,
          redirect_to: successRedirect(result.session),
        });
    }
  }

  if (path === "/complete-onboarding" && method === "POST") {
    const accountId = str(body, "account");
    const account = accountId ? ctx.store.state.accounts[accountId] : undefined;
    if (!account) return bad(res, "Send { account } with a known account id.", 404);
    completeOnboarding(
      ctx,
      account,
      { businessName: account.business_profile.name ?? "Test workshop", ...TEST_PAYOUT_DETAILS },
      internalOrigin(ctx),
    );
    return sendJson(res, 200, { ok: true, account });
  }

  if (path === "/advance-clock" && method === "POST") {
    const seconds = body.seconds;
    if (typeof seconds !== "number" || !Number.isFinite(seconds) || seconds < 0) {
      return bad(res, "Send { seconds } with a number of seconds ≥ 0.");
    }
    ctx.clock.advance(Math.floor(seconds));
    ctx.store.state.clockOffsetSeconds = ctx.clock.offsetSeconds;
    ctx.store.changed();
    const expired = expireDueSessions(ctx, internalOrigin(ctx));
    return sendJson(res, 200, { ok: true, now: ctx.clock.now(), expired_sessions: expired });
  }

  if (path === "/reset" && method === "POST") {
    controls.reset();
    return sendJson(res, 200, { ok: true });
  }

  return bad(res, `Unknown test hook: ${method} ${url.pathname}`, 404);
}
