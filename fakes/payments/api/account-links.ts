import { invalidParam, missingParam } from "../api-error";
import { newId } from "../ids";
import { optEnum, optUrl, rejectUnknown, reqString } from "../params";
import type { ApiCall, Route } from "../router";
import type { AccountLinkRecord } from "../types";

// Onboarding links are short-lived and single-use (the provider documents a few minutes;
// five is from memory).
const LINK_LIFETIME_SECONDS = 300;

function create(call: ApiCall): unknown {
  const { input, ctx } = call;
  rejectUnknown(input, ["account", "refresh_url", "return_url", "type", "collect", "collection_options", "expand"]);
  const accountId = reqString(input, "account");
  if (!ctx.store.state.accounts[accountId]) throw invalidParam("account", `No such account: '${accountId}'`, "resource_missing");
  const type = optEnum(input, "type", ["account_onboarding", "account_update"] as const);
  if (!type) throw missingParam("type");
  const refreshUrl = optUrl(input, "refresh_url");
  const returnUrl = optUrl(input, "return_url");
  if (!refreshUrl) throw missingParam("refresh_url");
  if (!returnUrl) throw missingParam("return_url");
  const created = ctx.clock.now();
  const record: AccountLinkRecord = {
    id: newId("aclink"),
    account: accountId,
    type,
    refresh_url: refreshUrl,
    return_url: returnUrl,
    created,
    expires_at: created + LINK_LIFETIME_SECONDS,
    used: false,
  };
  ctx.store.state.accountLinks[record.id] = record;
  ctx.store.changed();
  return {
    object: "account_link",
    created,
    expires_at: record.expires_at,
    url: `${ctx.publicUrl}/onboarding/${record.id}`,
  };
}

export const accountLinkRoutes: Route[] = [{ method: "POST", pattern: "/v1/account_links", handler: create }];
