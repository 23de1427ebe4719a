import { invalidParam, noSuch } from "../api-error";
import { changedFields, emitEvent } from "../context";
import { newAccount } from "../core/accounts";
import { expandObject } from "../expand";
import type { FormObject } from "../form-body";
import { LIST_PARAMS, paginate } from "../list";
import {
  applyMetadata,
  expandPaths,
  optBool,
  optCurrency,
  optEnum,
  optMetadata,
  optObject,
  optString,
  rejectUnknown,
} from "../params";
import type { ApiCall, Route } from "../router";
import type { Account, CapabilityStatus } from "../types";

const BUSINESS_PROFILE_KEYS = ["mcc", "name", "product_description", "support_email", "support_phone", "support_url", "url"];
const CREATE_KEYS = [
  "type", "controller", "country", "email", "capabilities", "business_profile", "business_type", "metadata",
  "default_currency", "expand",
];
const UPDATE_KEYS = ["email", "capabilities", "business_profile", "business_type", "metadata", "default_currency", "expand"];

function readBusinessProfile(input: FormObject): Record<string, string | null> {
  const profile = optObject(input, "business_profile");
  if (!profile) return {};
  rejectUnknown(profile, BUSINESS_PROFILE_KEYS, "business_profile");
  const out: Record<string, string | null> = {};
  for (const key of Object.keys(profile)) out[key] = optString(profile, key, "business_profile") ?? null;
  return out;
}

/** `capabilities[transfers][requested]=true` → the names asked for (and those turned off). */
function readCapabilities(input: FormObject): { requested: string[]; dropped: string[] } {
  const capabilities = optObject(input, "capabilities");
  const requested: string[] = [];
  const dropped: string[] = [];
  if (!capabilities) return { requested, dropped };
  for (const name of Object.keys(capabilities)) {
    if (!/^[a-z_]+$/.test(name)) throw invalidParam(`capabilities[${name}]`, `Invalid capability: ${name}`);
    const entry = optObject(capabilities, name, "capabilities") ?? {};
    rejectUnknown(entry, ["requested"], `capabilities[${name}]`);
    const wanted = optBool(entry, "requested", `capabilities[${name}]`);
    if (wanted === true) requested.push(name);
    if (wanted === false) dropped.push(name);
  }
  return { requested, dropped };
}

// The newer way to pick the kind of account: who owns the dashboard decides it.
function typeFromController(input: FormObject): Account["type"] | undefined {
  const controller = optObject(input, "controller");
  if (!controller) return undefined;
  rejectUnknown(controller, ["stripe_dashboard", "fees", "losses", "requirement_collection"], "controller");
  const dashboard = optObject(controller, "stripe_dashboard", "controller") ?? {};
  const kind = optEnum(dashboard, "type", ["express", "full", "none"] as const, "controller[stripe_dashboard]");
  if (kind === "full") return "standard";
  if (kind === "none") return "custom";
  return "express";
}

function readEmail(input: FormObject): string | undefined {
  const email = optString(input, "email");
  if (email !== undefined && !/^[^\s@]+@[^\s@]+$/.test(email)) throw invalidParam("email", `Invalid email address: ${email}`, "email_invalid");
  return email;
}

function findAccount(call: ApiCall): Account {
  const id = call.params.id ?? "";
  const account = call.ctx.store.state.accounts[id];
  if (!account) throw noSuch("account", id, "account");
  return account;
}

function create(call: ApiCall): unknown {
  const { input, ctx } = call;
  rejectUnknown(input, CREATE_KEYS);
  const type = optEnum(input, "type", ["express", "standard", "custom"] as const) ?? typeFromController(input);
  if (!type) {
    throw invalidParam("type", "Specify the account type (express, standard or custom) or controller[stripe_dashboard][type].", "parameter_missing");
  }
  const country = (optString(input, "country") ?? "US").toUpperCase();
  if (!/^[A-Z]{2}$/.test(country)) throw invalidParam("country", `Invalid country: ${country}`, "country_unsupported");
  const { requested } = readCapabilities(input);
  const account = newAccount({
    created: ctx.clock.now(),
    type,
    country,
    email: readEmail(input) ?? null,
    requestedCapabilities: requested,
    businessProfile: readBusinessProfile(input),
    businessType: optEnum(input, "business_type", ["individual", "company", "non_profit", "government_entity"] as const) ?? null,
    defaultCurrency: optCurrency(input, "default_currency") ?? null,
    metadata: applyMetadata({}, optMetadata(input)),
  });
  ctx.store.state.accounts[account.id] = account;
  ctx.store.changed();
  return expandObject(ctx.store.state, account, expandPaths(input));
}

function retrieve(call: ApiCall): unknown {
  return expandObject(call.ctx.store.state, findAccount(call), expandPaths(call.input));
}

function update(call: ApiCall): unknown {
  const { input, ctx } = call;
  rejectUnknown(input, UPDATE_KEYS);
  const account = findAccount(call);
  const before = structuredClone(account);
  const email = readEmail(input);
  if (email !== undefined) account.email = email;
  account.business_profile = { ...account.business_profile, ...readBusinessProfile(input) };
  const businessType = optEnum(input, "business_type", ["individual", "company", "non_profit", "government_entity"] as const);
  if (businessType) account.business_type = businessType;
  const currency = optCurrency(input, "default_currency");
  if (currency) account.default_currency = currency;
  const { requested, dropped } = readCapabilities(input);
  const capabilities: Record<string, CapabilityStatus> = { ...account.capabilities };
  // A newly asked-for capability waits for onboarding unless the account is already through it.
  for (const name of requested) capabilities[name] ??= account.details_submitted ? "active" : "inactive";
  for (const name of dropped) delete capabilities[name];
  account.capabilities = capabilities;
  account.metadata = applyMetadata(account.metadata, optMetadata(input));
  const previous = changedFields(before, account);
  ctx.store.changed();
  if (Object.keys(previous).length > 0) emitEvent(ctx, call.origin, "account.updated", account, previous);
  return expandObject(ctx.store.state, account, expandPaths(input));
}

function remove(call: ApiCall): unknown {
  const account = findAccount(call);
  const { state } = call.ctx.store;
  delete state.accounts[account.id];
  for (const [id, link] of Object.entries(state.accountLinks)) if (link.account === account.id) delete state.accountLinks[id];
  call.ctx.store.changed();
  return { id: account.id, object: "account", deleted: true };
}

function list(call: ApiCall): unknown {
  rejectUnknown(call.input, [...LIST_PARAMS]);
  return paginate(Object.values(call.ctx.store.state.accounts), call.input, "/v1/accounts");
}

export const accountRoutes: Route[] = [
  { method: "POST", pattern: "/v1/accounts", handler: create },
  { method: "GET", pattern: "/v1/accounts", handler: list },
  { method: "GET", pattern: "/v1/accounts/:id", handler: retrieve },
  { method: "POST", pattern: "/v1/accounts/:id", handler: update },
  { method: "DELETE", pattern: "/v1/accounts/:id", handler: remove },
];
