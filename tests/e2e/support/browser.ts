// Debian's Chromium driven by playwright-core, each test with a fresh profile in a temp folder.
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";

export const BASE_URL = process.env.E2E_BASE_URL ?? "http://localhost:3100";
export const MAIL_URL = process.env.E2E_MAIL_URL ?? "http://127.0.0.1:4110";
const ARTIFACTS = process.env.E2E_ARTIFACTS ?? path.join(os.tmpdir(), "fluxyard-e2e");

export type Session = { context: BrowserContext; page: Page; close(): Promise<void> };

export async function openBrowser(): Promise<Session> {
  const profile = mkdtempSync(path.join(os.tmpdir(), "fluxyard-chromium-"));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: "/usr/bin/chromium",
    headless: true,
    baseURL: BASE_URL,
    viewport: { width: 1280, height: 900 },
    args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  page.setDefaultTimeout(20_000);
  return {
    context,
    page,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

export async function screenshot(page: Page, name: string): Promise<void> {
  await page.screenshot({ path: path.join(ARTIFACTS, "screenshots", `${name}.png`), fullPage: true });
}
