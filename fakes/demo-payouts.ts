// Gives the demo sellers and the demo reviewer connected payout accounts in the payments stand-in, so the demo can sell
// from the first start. Idempotent: an account that still exists in the stand-in is kept.
import pg from "pg";
import Stripe from "stripe";
import { DEMO_ACCOUNTS, DEMO_REVIEWER, DEMO_SELLERS } from "../db/seed-data";

export async function ensureDemoPayoutAccounts({ databaseUrl, paymentsUrl, secretKey }: { databaseUrl: string; paymentsUrl: string; secretKey: string }) {
  const url = new URL(paymentsUrl);
  const stripe = new Stripe(secretKey, { host: url.hostname, port: Number(url.port), protocol: "http", maxNetworkRetries: 1, timeout: 10_000 });
  const client = new pg.Client({ connectionString: databaseUrl });
  await client.connect();
  try {
    const holders = [
      ...DEMO_SELLERS.map((s) => ({ userId: s.userId, country: s.country, table: "seller_profiles" })),
      { userId: DEMO_REVIEWER.userId, country: "NL", table: "reviewer_profiles" },
    ];
    for (const holder of holders) {
      const { rows } = await client.query<{ payout_account_id: string | null }>(`select payout_account_id from ${holder.table} where user_id = $1`, [holder.userId]);
      if (rows.length === 0) continue;
      const existing = rows[0]!.payout_account_id;
      if (existing && (await accountIsEnabled(stripe, existing))) continue;
      const email = DEMO_ACCOUNTS.find((a) => a.id === holder.userId)?.email;
      const account = await stripe.accounts.create({ type: "express", country: holder.country, email, metadata: { userId: holder.userId } });
      const done = await fetch(`${paymentsUrl}/api/test/complete-onboarding`, {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ account: account.id }),
      });
      if (!done.ok) throw new Error(`the payments stand-in refused to finish onboarding for ${account.id}: ${done.status}`);
      const enable = holder.table === "seller_profiles" ? "charges_enabled = true, payouts_enabled = true" : "payouts_enabled = true";
      await client.query(`update ${holder.table} set payout_account_id = $2, ${enable}, updated_at = now() where user_id = $1`, [holder.userId, account.id]);
    }
  } finally {
    await client.end();
  }
}

async function accountIsEnabled(stripe: Stripe, id: string): Promise<boolean> {
  try {
    const account = await stripe.accounts.retrieve(id);
    return account.charges_enabled && account.payouts_enabled;
  } catch {
    return false;
  }
}
