import { afterEach, beforeEach, describe, expect, it } from "vitest";
import { openBrowser, screenshot, type Session, BASE_URL, MAIL_URL } from "./support/browser";
import { waitForMessage } from "./support/outbox";
import { signInThroughOutbox } from "./support/sign-in";
import { DEMO_ACCOUNTS } from "../../db/seed-data";

const admin = DEMO_ACCOUNTS.find((a) => a.roles.includes("admin"))!;
const builder = DEMO_ACCOUNTS.find((a) => a.id === "demo-builder")!;

describe("foundation journeys in Chromium", () => {
  let s: Session;
  beforeEach(async () => {
    s = await openBrowser();
  });
  afterEach(async () => {
    await s.close();
  });

  it("the start page says what Fluxyard is and carries the mains caution", async () => {
    await s.page.goto("/");
    await expect(s.page.getByRole("heading", { level: 1 }).textContent()).resolves.toContain("mains build");
    const footer = await s.page.locator("footer").textContent();
    expect(footer).toMatch(/charged capacitors can kill/i);
    expect(await s.page.getByTestId("home-sellers").textContent()).toContain("Idunn Kaszuba");
    await screenshot(s.page, "home");
  });

  it("a new visitor signs in through the link in the outbox and lands signed in", async () => {
    const email = `first.timer.${Date.now()}@example.test`;
    const since = new Date(Date.now() - 1000);
    await s.page.goto("/account");
    await s.page.getByTestId("sign-in-prompt").waitFor();
    await s.page.goto("/sign-in?next=/account");
    await s.page.getByLabel("E-mail address").fill(email);
    await s.page.getByRole("button", { name: "E-mail me a sign-in link" }).click();
    await s.page.getByRole("heading", { name: "Check your e-mail" }).waitFor();

    const message = await waitForMessage(email, since);
    expect(message.subject).toBe("Your Fluxyard sign-in link");
    // A person reads it on the outbox page and clicks the button there.
    await s.page.goto(`${MAIL_URL}/messages/${message.id}`);
    await screenshot(s.page, "outbox-message");
    const link = s.page.frameLocator("iframe").getByRole("link", { name: "Sign in to Fluxyard" });
    const href = await link.getAttribute("href");
    expect(href).toContain(`${BASE_URL}/api/auth/callback/resend`);
    await s.page.goto(href!);

    await s.page.waitForURL(`${BASE_URL}/account`);
    expect(await s.page.getByTestId("signed-in-as").textContent()).toBe(email);
    expect(await s.page.getByTestId("account-roles").textContent()).toContain("member");
    await screenshot(s.page, "account");

    // The link works once.
    await s.page.context().clearCookies();
    await s.page.goto(href!);
    await s.page.getByTestId("sign-in-problem").waitFor();
  });

  it("a malformed e-mail address gets a clear error beside the field", async () => {
    await s.page.goto("/sign-in");
    await s.page.getByLabel("E-mail address").fill("noor.at.larkspur");
    await s.page.getByRole("button", { name: "E-mail me a sign-in link" }).click();
    const field = s.page.getByLabel("E-mail address");
    await expect.poll(() => field.getAttribute("aria-invalid")).toBe("true");
    const describedBy = (await field.getAttribute("aria-describedby")) ?? "";
    const errorText = await s.page.locator(`[id="${describedBy.split(" ").find((id) => id.endsWith("-error"))}"]`).textContent();
    expect(errorText).toMatch(/does not look like an e-mail address/);
    expect(await field.inputValue()).toBe("noor.at.larkspur");
  });

  it("a member gets the not-allowed page in the admin area and 403 from its API", async () => {
    await signInThroughOutbox(s.page, builder.email);
    await s.page.goto("/admin/users");
    await s.page.getByTestId("not-allowed").waitFor();
    await screenshot(s.page, "not-allowed");
    const api = await s.page.request.get("/api/admin/users");
    expect(api.status()).toBe(403);
    expect(await api.json()).toMatchObject({ error: "forbidden" });
    const change = await s.page.request.post(`/api/admin/users/${builder.id}/roles`, { data: { role: "admin", grant: true } });
    expect(change.status()).toBe(403);
  });

  it("a visitor gets 401 JSON from the admin API", async () => {
    const res = await fetch(`${BASE_URL}/api/admin/users`);
    expect(res.status).toBe(401);
    expect(await res.json()).toMatchObject({ error: "not_signed_in" });
  });

  it("an admin grants the seller role, after which that person sees the seller area", async () => {
    const email = `future.seller.${Date.now()}@example.test`;
    const newcomer = await openBrowser();
    try {
      await signInThroughOutbox(newcomer.page, email);
      await newcomer.page.goto("/sell");
      await newcomer.page.getByTestId("not-allowed").waitFor();

      await signInThroughOutbox(s.page, admin.email);
      await s.page.goto("/admin/users");
      await s.page.getByLabel("Find a person").fill(email);
      const row = s.page.getByTestId(`user-row-${email}`);
      await row.getByRole("button", { name: "Grant seller" }).click();
      await row.getByRole("button", { name: "Revoke seller" }).waitFor();
      await screenshot(s.page, "admin-users");

      await newcomer.page.goto("/sell");
      await newcomer.page.getByTestId("seller-desk").waitFor();
      // The header's area links arrive after load (components/site/header-session.tsx).
      await newcomer.page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Seller desk" }).waitFor();
      expect(await newcomer.page.getByRole("link", { name: "Seller desk" }).count()).toBe(1);
    } finally {
      await newcomer.close();
    }
  });
});
