import { changedFields, emitEvent, type FakeContext, type Origin } from "../context";
import { newId } from "../ids";
import type { Account, BankAccount, CapabilityStatus } from "../types";

// What a fresh express account still owes before it may take payments (a plausible
// subset of the provider's list; the names follow its `requirements` field paths).
const INITIAL_REQUIREMENTS = [
  "business_profile.mcc",
  "business_profile.url",
  "external_account",
  "individual.first_name",
  "individual.last_name",
  "tos_acceptance.date",
  "tos_acceptance.ip",
];

const CURRENCY_BY_COUNTRY: Record<string, string> = {
  US: "usd", GB: "gbp", CA: "cad", AU: "aud", CH: "chf",
  DE: "eur", FR: "eur", NL: "eur", BE: "eur", AT: "eur", IE: "eur", IT: "eur", ES: "eur", FI: "eur", PT: "eur",
};

export function defaultCurrencyFor(country: string): string {
  return CURRENCY_BY_COUNTRY[country] ?? "usd";
}

export function newAccount(input: {
  created: number;
  type: Account["type"];
  country: string;
  email: string | null;
  requestedCapabilities: string[];
  businessProfile: Record<string, string | null>;
  businessType: string | null;
  defaultCurrency: string | null;
  metadata: Record<string, string>;
}): Account {
  const id = newId("acct", 16);
  const capabilities: Record<string, CapabilityStatus> = {};
  for (const name of input.requestedCapabilities) capabilities[name] = "inactive";
  return {
    id,
    object: "account",
    type: input.type,
    country: input.country,
    email: input.email,
    created: input.created,
    livemode: false,
    metadata: input.metadata,
    default_currency: input.defaultCurrency ?? defaultCurrencyFor(input.country),
    business_type: input.businessType,
    business_profile: {
      mcc: null,
      name: null,
      product_description: null,
      support_email: null,
      support_phone: null,
      support_url: null,
      url: null,
      ...input.businessProfile,
    },
    capabilities,
    charges_enabled: false,
    payouts_enabled: false,
    details_submitted: false,
    requirements: {
      currently_due: [...INITIAL_REQUIREMENTS],
      eventually_due: [...INITIAL_REQUIREMENTS],
      past_due: [...INITIAL_REQUIREMENTS],
      pending_verification: [],
      disabled_reason: "requirements.past_due",
      current_deadline: null,
    },
    tos_acceptance: { date: null },
    external_accounts: { object: "list", data: [], has_more: false, total_count: 0, url: `/v1/accounts/${id}/external_accounts` },
  };
}

export interface OnboardingForm {
  businessName: string;
  accountHolderName: string;
  accountNumber: string;
  routingNumber: string;
}

/** What the hosted onboarding page does on "Finish test onboarding". */
export function completeOnboarding(ctx: FakeContext, account: Account, form: OnboardingForm, origin: Origin): Account {
  const before = structuredClone(account);
  const capabilities: Record<string, CapabilityStatus> = {};
  // An account that asked for nothing still needs to receive transfers to be any use here.
  const names = Object.keys(account.capabilities).length > 0 ? Object.keys(account.capabilities) : ["transfers"];
  for (const name of names) capabilities[name] = "active";
  const bank: BankAccount = {
    id: newId("ba"),
    object: "bank_account",
    account: account.id,
    account_holder_name: form.accountHolderName,
    country: account.country,
    currency: account.default_currency,
    last4: form.accountNumber.slice(-4).padStart(4, "0"),
    routing_number: form.routingNumber,
    status: "verified",
    default_for_currency: true,
    metadata: {},
  };
  account.capabilities = capabilities;
  account.business_profile = { ...account.business_profile, name: form.businessName || account.business_profile.name || null };
  account.charges_enabled = true;
  account.payouts_enabled = true;
  account.details_submitted = true;
  account.requirements = {
    currently_due: [],
    eventually_due: [],
    past_due: [],
    pending_verification: [],
    disabled_reason: null,
    current_deadline: null,
  };
  account.tos_acceptance = { date: ctx.clock.now() };
  account.external_accounts = { ...account.external_accounts, data: [bank], total_count: 1 };
  ctx.store.changed();
  emitEvent(ctx, origin, "account.updated", account, changedFields(before, account));
  return account;
}
