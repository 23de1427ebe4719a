import type { Page } from "playwright-core";
import { firstLink, waitForMessage } from "./outbox";

/** Signs in as a person would: asks for a link, reads it in the outbox, follows it. */
export async function signInThroughOutbox(page: Page, email: string, next?: string): Promise<void> {
  const since = new Date(Date.now() - 1000);
  await page.goto(next ? `/sign-in?next=${encodeURIComponent(next)}` : "/sign-in");
  await page.getByLabel("E-mail address").fill(email);
  await page.getByRole("button", { name: "E-mail me a sign-in link" }).click();
  await page.getByRole("heading", { name: "Check your e-mail" }).waitFor();
  const message = await waitForMessage(email, since);
  await page.goto(firstLink(message, "/api/auth/callback/"));
}
