// The hosted onboarding page behind an account link.
import type { ServerResponse } from "node:http";
import { internalOrigin, type FakeContext } from "../context";
import { completeOnboarding } from "../core/accounts";
import { decodeFormBody } from "../form-body";
import { redirect, sendHtml } from "../http-util";
import { renderMessagePage } from "../pages/layout";
import { renderOnboardingPage, TEST_PAYOUT_DETAILS } from "../pages/onboarding-page";
import type { AccountLinkRecord } from "../types";

type Usable = { kind: "ok"; link: AccountLinkRecord } | { kind: "missing" } | { kind: "stale"; link: AccountLinkRecord };

function usableLink(ctx: FakeContext, linkId: string): Usable {
  const link = ctx.store.state.accountLinks[linkId];
  if (!link || !ctx.store.state.accounts[link.account]) return { kind: "missing" };
  if (link.used || ctx.clock.now() >= link.expires_at) return { kind: "stale", link };
  return { kind: "ok", link };
}

function notFound(res: ServerResponse): void {
  sendHtml(res, 404, renderMessagePage("Link not found", "This onboarding link is not known to the local payments fake."));
}

export function showOnboarding(ctx: FakeContext, res: ServerResponse, linkId: string): void {
  const found = usableLink(ctx, linkId);
  if (found.kind === "missing") return notFound(res);
  // A used or expired link sends the person back to ask the platform for a fresh one.
  if (found.kind === "stale") return redirect(res, found.link.refresh_url);
  const account = ctx.store.state.accounts[found.link.account];
  if (!account) return notFound(res);
  sendHtml(res, 200, renderOnboardingPage({ linkId, account, returnUrl: found.link.return_url }));
}

export function submitOnboarding(ctx: FakeContext, res: ServerResponse, linkId: string, rawBody: string): void {
  const found = usableLink(ctx, linkId);
  if (found.kind === "missing") return notFound(res);
  if (found.kind === "stale") return redirect(res, found.link.refresh_url);
  const account = ctx.store.state.accounts[found.link.account];
  if (!account) return notFound(res);
  let form: Record<string, unknown>;
  try {
    form = decodeFormBody(rawBody);
  } catch {
    form = {};
  }
  const field = (name: string, fallback: string) => {
    const value = form[name];
    return typeof value === "string" && value.trim() !== "" ? value.trim() : fallback;
  };
  found.link.used = true;
  completeOnboarding(
    ctx,
    account,
    {
      businessName: field("business_name", account.business_profile.name ?? "Test workshop"),
      accountHolderName: field("account_holder_name", TEST_PAYOUT_DETAILS.accountHolderName),
      accountNumber: field("account_number", TEST_PAYOUT_DETAILS.accountNumber),
      routingNumber: field("routing_number", TEST_PAYOUT_DETAILS.routingNumber),
    },
    internalOrigin(ctx),
  );
  redirect(res, found.link.return_url);
}
