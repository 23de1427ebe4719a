import "server-only";
import { attachReviewerPayoutAccount, getReviewerProfile, recordReviewerPayoutStatus, ReviewError } from "@/db/queries/reviews";
import { env } from "@/lib/env";
import { payments } from "@/lib/payments/client";
import { callProvider } from "@/lib/payments/connect";

// A reviewer's payout account: a connected account at the provider, made and onboarded the way a
// seller's is (lib/payments/connect.ts), but kept on reviewer_profiles.

/** Makes the connected account on the first call, an onboarding link on every call; returns the provider's page. */
export async function startReviewerPayoutOnboarding(user: { id: string; email: string | null; name: string | null }): Promise<string> {
  const profile = await getReviewerProfile(user.id);
  if (!profile) throw new ReviewError(404, "Your reviewer profile is made when a moderator approves your application.");
  const client = payments();
  let accountId = profile.payoutAccountId;
  if (!accountId) {
    const account = await callProvider(() =>
      client.accounts.create({
        type: "express",
        ...(user.email ? { email: user.email } : {}),
        capabilities: { transfers: { requested: true } },
        business_profile: { name: user.name ?? "Fluxyard reviewer" },
        metadata: { userId: user.id, role: "reviewer" },
      }),
    );
    accountId = await attachReviewerPayoutAccount(user.id, account.id);
  }
  const base = env().APP_URL;
  const link = await callProvider(() =>
    client.accountLinks.create({ account: accountId, refresh_url: `${base}/reviews/payouts/refresh`, return_url: `${base}/reviews/payouts/return`, type: "account_onboarding" }),
  );
  return link.url;
}

/** Asks the provider whether the account can receive transfers and stores the answer. */
export async function refreshReviewerPayoutStatus(userId: string): Promise<{ payoutAccountId: string | null; payoutsEnabled: boolean }> {
  const profile = await getReviewerProfile(userId);
  if (!profile?.payoutAccountId) return { payoutAccountId: null, payoutsEnabled: false };
  const accountId = profile.payoutAccountId;
  const account = await callProvider(() => payments().accounts.retrieve(accountId));
  const payoutsEnabled = account.payouts_enabled === true && account.capabilities?.transfers === "active";
  await recordReviewerPayoutStatus(userId, accountId, payoutsEnabled);
  return { payoutAccountId: accountId, payoutsEnabled };
}
