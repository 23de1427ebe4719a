import pg from "pg";
import type { Page } from "playwright-core";
import { firstLink, waitForMessage } from "./outbox";

let pool: pg.Pool | null = null;

/**
 * A full browser run signs the demo moderator in more often than the per-address limit allows in
 * its 15 minutes (lib/rate-limit/sign-in.ts); each sign-in here starts that address's count afresh.
 * The limit itself is proven in tests/integration/security/sign-in-rate-limit.test.ts.
 */
async function forgetSignInCount(email: string): Promise<void> {
  const url = process.env.E2E_DATABASE_URL;
  if (!url) return;
  pool ??= new pg.Pool({ connectionString: url, max: 1, allowExitOnIdle: true });
  await pool.query("delete from rate_limits where key = $1", [`sign-in:address:${email.trim().toLowerCase()}`]);
}

/** Signs in as a person would: asks for a link, reads it in the outbox, follows it. */
export async function signInThroughOutbox(page: Page, email: string, next?: string): Promise<void> {
  await forgetSignInCount(email);
  const since = new Date(Date.now() - 1000);
  await page.goto(next ? `/sign-in?next=${encodeURIComponent(next)}` : "/sign-in");
  await page.getByLabel("E-mail address").fill(email);
  await page.getByRole("button", { name: "E-mail me a sign-in link" }).click();
  await page.getByRole("heading", { name: "Check your e-mail" }).waitFor();
  const message = await waitForMessage(email, since);
  await page.goto(firstLink(message, "/api/auth/callback/"));
}
