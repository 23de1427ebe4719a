import type { Account } from "../types";
import { esc, renderPage } from "./layout";

// Clearly made-up payout details; nothing here resembles a real bank account.
export const TEST_PAYOUT_DETAILS = {
  accountHolderName: "Test Workshop Owner",
  routingNumber: "110000000",
  accountNumber: "000123456789",
};

export function renderOnboardingPage(input: { linkId: string; account: Account; returnUrl: string }): string {
  const { account } = input;
  const who = account.email ?? account.id;
  const businessName = account.business_profile.name ?? "Test workshop";
  const body = `
<h1>Set up payouts</h1>
<p>Payout details for <strong>${esc(who)}</strong> (<span class="mono">${esc(account.id)}</span>).
The fields are filled with test values; change them if you like.</p>
<form method="post" action="/onboarding/${esc(input.linkId)}">
<label for="business_name">Business name</label>
<input type="text" id="business_name" name="business_name" value="${esc(businessName)}">
<label for="account_holder_name">Account holder</label>
<input type="text" id="account_holder_name" name="account_holder_name" value="${esc(TEST_PAYOUT_DETAILS.accountHolderName)}">
<div class="row">
<div><label for="routing_number">Bank code (test)</label>
<input type="text" id="routing_number" name="routing_number" class="mono" value="${esc(TEST_PAYOUT_DETAILS.routingNumber)}"></div>
<div><label for="account_number">Account number (test)</label>
<input type="text" id="account_number" name="account_number" class="mono" value="${esc(TEST_PAYOUT_DETAILS.accountNumber)}"></div>
</div>
<p class="hint">Country: ${esc(account.country)} · payout currency: ${esc(account.default_currency.toUpperCase())}</p>
<div class="actions">
<button type="submit">Finish test onboarding</button>
<a href="${esc(input.returnUrl)}">Leave without finishing</a>
</div>
</form>`;
  return renderPage({
    title: "Local test onboarding",
    banner: "Local test page of the Fluxyard payments stand-in — no real bank details",
    body,
  });
}
