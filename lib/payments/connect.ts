import "server-only";
import Stripe from "stripe";
import { attachPayoutAccount, getSellerProfile, recordPayoutStatus } from "@/db/queries/sellers";
import { env } from "@/lib/env";
import { payments } from "./client";

export const PAYMENTS_UNAVAILABLE_MESSAGE = "The payment provider is not answering; try again in a minute — your drafts are safe.";

/** The provider could not be reached or failed on its side; nothing was changed here. */
export class PaymentsUnavailableError extends Error {
  constructor(readonly cause: unknown) {
    super(PAYMENTS_UNAVAILABLE_MESSAGE);
    this.name = "PaymentsUnavailableError";
  }
}

export class PayoutSetupError extends Error {
  constructor(
    readonly status: 404 | 409,
    message: string,
  ) {
    super(message);
    this.name = "PayoutSetupError";
  }
}

/** Connection failures, timeouts, 5xx and rate limits are the provider's trouble; a 4xx is ours and is rethrown. */
/** Runs a provider call, turning an outage or a 5xx into PaymentsUnavailableError. */
export async function callProvider<T>(run: () => Promise<T>): Promise<T> {
  try {
    return await run();
  } catch (error) {
    if (
      error instanceof Stripe.errors.StripeConnectionError ||
      error instanceof Stripe.errors.StripeAPIError ||
      error instanceof Stripe.errors.StripeRateLimitError ||
      (error instanceof Stripe.errors.StripeError && (error.statusCode ?? 0) >= 500)
    ) {
      throw new PaymentsUnavailableError(error);
    }
    throw error;
  }
}

export type PayoutStatus = { payoutAccountId: string | null; chargesEnabled: boolean; payoutsEnabled: boolean };

/**
 * Creates the seller's connected account on the first call and an onboarding link on every call;
 * returns the provider's onboarding page to send the seller to.
 */
export async function startPayoutOnboarding(user: { id: string; email: string | null }): Promise<string> {
  const profile = await getSellerProfile(user.id);
  if (!profile) throw new PayoutSetupError(404, "Open your shop first; the payout account belongs to it.");
  const client = payments();
  let accountId = profile.payoutAccountId;
  if (!accountId) {
    const account = await callProvider(() =>
      client.accounts.create({
        type: "express",
        country: profile.country,
        ...(user.email ? { email: user.email } : {}),
        business_profile: { name: profile.shopName },
        metadata: { userId: user.id },
      }),
    );
    accountId = await attachPayoutAccount(user.id, account.id);
  }
  const base = env().APP_URL;
  const link = await callProvider(() =>
    client.accountLinks.create({
      account: accountId,
      refresh_url: `${base}/sell/payouts/refresh`,
      return_url: `${base}/sell/payouts/return`,
      type: "account_onboarding",
    }),
  );
  return link.url;
}

/** Asks the provider where the account stands and stores it; the seller may submit once both are enabled. */
export async function refreshPayoutStatus(userId: string): Promise<PayoutStatus> {
  const profile = await getSellerProfile(userId);
  if (!profile?.payoutAccountId) return { payoutAccountId: null, chargesEnabled: false, payoutsEnabled: false };
  const accountId = profile.payoutAccountId;
  const account = await callProvider(() => payments().accounts.retrieve(accountId));
  const status = { chargesEnabled: account.charges_enabled === true, payoutsEnabled: account.payouts_enabled === true };
  await recordPayoutStatus(userId, accountId, status);
  return { payoutAccountId: accountId, ...status };
}

export function payoutReady(profile: { chargesEnabled: boolean; payoutsEnabled: boolean } | null): boolean {
  return profile !== null && profile.chargesEnabled && profile.payoutsEnabled;
}
