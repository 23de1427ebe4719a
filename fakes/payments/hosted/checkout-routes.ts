// The hosted checkout page: GET shows the order and the card form, POST pays.
import type { ServerResponse } from "node:http";
import { internalOrigin, type FakeContext } from "../context";
import { paySession, successRedirect } from "../core/checkout";
import { decodeFormBody } from "../form-body";
import { redirect, sendHtml } from "../http-util";
import { renderCheckoutPage } from "../pages/checkout-page";
import { renderMessagePage } from "../pages/layout";
import type { CheckoutSession } from "../types";

function renderClosed(session: CheckoutSession): string {
  if (session.status === "complete") {
    return renderMessagePage("This checkout is already paid", "The payment for this checkout went through.", {
      href: successRedirect(session),
      label: "Continue to the shop",
    });
  }
  return renderMessagePage(
    "This checkout has expired",
    "The time to pay this checkout ran out, or the shop closed it. Nothing was charged.",
    session.cancel_url ? { href: session.cancel_url, label: "Go back to the shop" } : undefined,
  );
}

function renderOpen(ctx: FakeContext, session: CheckoutSession, extra: { error?: string; entered?: { card: string; email: string; name: string } } = {}): string {
  const { state } = ctx.store;
  return renderCheckoutPage({
    session,
    lineItems: state.lineItems[session.id] ?? [],
    manualCapture: state.sessionIntentData[session.id]?.capture_method === "manual",
    ...extra,
  });
}

export function showCheckout(ctx: FakeContext, res: ServerResponse, sessionId: string): void {
  const session = ctx.store.state.checkoutSessions[sessionId];
  if (!session) {
    sendHtml(res, 404, renderMessagePage("Checkout not found", "There is no checkout with this address on the local payments fake."));
    return;
  }
  sendHtml(res, 200, session.status === "open" ? renderOpen(ctx, session) : renderClosed(session));
}

export function submitCheckout(ctx: FakeContext, res: ServerResponse, sessionId: string, rawBody: string): void {
  let form: Record<string, unknown>;
  try {
    form = decodeFormBody(rawBody);
  } catch {
    form = {};
  }
  const field = (name: string) => (typeof form[name] === "string" ? (form[name] as string) : "");
  const entered = { card: field("card"), email: field("email"), name: field("name") };
  const result = paySession(ctx, sessionId, { card: entered.card, email: entered.email, name: entered.name }, internalOrigin(ctx));
  switch (result.kind) {
    case "missing":
      sendHtml(res, 404, renderMessagePage("Checkout not found", "There is no checkout with this address on the local payments fake."));
      return;
    case "not_open":
      redirect(res, `/pay/${encodeURIComponent(sessionId)}`);
      return;
    case "unknown_card":
      sendHtml(res, 400, renderOpen(ctx, result.session, { error: result.message, entered }));
      return;
    case "declined":
      sendHtml(res, 402, renderOpen(ctx, result.session, {
        error: `${result.error.message} Nothing was charged; try another test card.`,
        entered,
      }));
      return;
    case "paid":
      redirect(res, successRedirect(result.session));
      return;
  }
}
