import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, it } from "vitest";
import pg from "pg";
import { openBrowser, screenshot, BASE_URL, type Session } from "./support/browser";
import { messagesTo, waitForMessage, type OutboxMessage } from "./support/outbox";
import { signInThroughOutbox } from "./support/sign-in";
import { connectFixtures, ensureSellerProfile, insertApprovedVersion, insertListing, sheetNotes, type FixtureDb } from "../integration/moderation/fixtures";

// The moderator's journey in Chromium against the production build: the queue, a send-back with a
// reason on one topic (and the seller's e-mail), an approval, a hold; and a seller who tries to
// approve his own listing through the API.
const MODERATOR = "sefa.moderator@larkspur.test";
const ADMIN = "oriel.admin@larkspur.test";
const SELLER = "bram.kits@larkspur.test";

let fixtures: { db: FixtureDb; close(): Promise<void> };
let pool: pg.Pool;
const run = Date.now().toString(36);
const ids = {} as Record<"sendBack" | "approve" | "hold" | "own" | "edited", string>;
const titles = {
  sendBack: `Half-bridge welder kit ${run}`,
  approve: `Gate drive board ${run}`,
  hold: `Bench supply kit ${run}`,
  own: `Snubber board ${run}`,
  edited: `Induction driver kit ${run}`,
};

async function listingState(id: string): Promise<string> {
  const { rows } = await pool.query("select state from listings where id = $1", [id]);
  return rows[0].state;
}

beforeAll(async () => {
  const url = process.env.E2E_DATABASE_URL;
  if (!url) throw new Error("E2E_DATABASE_URL is not set: run this through `npm test -- --e2e-only tests/e2e/moderation.test.ts`");
  fixtures = connectFixtures(url);
  pool = new pg.Pool({ connectionString: url, max: 2 });
  await ensureSellerProfile(fixtures.db, "demo-seller-kits", "Oyelaran Boards");
  ids.sendBack = await insertListing(fixtures.db, { sellerId: "demo-seller-kits", title: titles.sendBack, state: "in_review", minutesAgo: 300 });
  ids.approve = await insertListing(fixtures.db, { sellerId: "demo-seller-kits", title: titles.approve, state: "in_review", minutesAgo: 120, kind: "board", photoUrl: "/demo/board-bench-supply.webp" });
  ids.hold = await insertListing(fixtures.db, { sellerId: "demo-seller-kits", title: titles.hold, state: "live", minutesAgo: 2000 });
  ids.own = await insertListing(fixtures.db, { sellerId: "demo-seller-kits", title: titles.own, state: "in_review", minutesAgo: 10, kind: "board" });
  // Approved a week ago with a 60 s wait and a shorter description; edited since and back in review.
  ids.edited = await insertListing(fixtures.db, {
    sellerId: "demo-seller-kits",
    title: titles.edited,
    state: "in_review",
    minutesAgo: 60,
    descriptionMd: "A driver kit for a 2 kW work coil.\n\nNow ships with a fitted 47 kΩ bleeder.",
  });
  await insertApprovedVersion(fixtures.db, ids.edited, { descriptionMd: "A driver kit for a 2 kW work coil.", notes: sheetNotes({ waitSeconds: 60 }) });
});

afterAll(async () => {
  await fixtures?.close();
  await pool?.end();
});

describe("moderation in Chromium", () => {
  let s: Session;
  beforeEach(async () => {
    s = await openBrowser();
  });
  afterEach(async () => {
    await s.close();
  });

  it("a moderator works the queue: sends one back with a reason, approves one, holds a live one", async () => {
    const page = s.page;
    await signInThroughOutbox(page, MODERATOR, "/moderate");
    await page.goto("/moderate");
    const queue = page.getByTestId("review-queue");
    await queue.waitFor();
    const rows = queue.locator("tbody tr");
    const order = await rows.allTextContents();
    const at = (title: string) => order.findIndex((t) => t.includes(title));
    // Oldest first: submitted 300, 120 and 10 minutes ago.
    expect(at(titles.sendBack)).toBeGreaterThanOrEqual(0);
    expect(at(titles.sendBack)).toBeLessThan(at(titles.approve));
    expect(at(titles.approve)).toBeLessThan(at(titles.own));
    expect(await page.getByTestId(`queue-row-${ids.sendBack}`).textContent()).toMatch(/Clear/);
    await screenshot(page, "moderation-queue");

    // The queue refreshes in the client: a listing submitted now shows up without a reload.
    const late = await insertListing(fixtures.db, { sellerId: "demo-seller-kits", title: `Late arrival ${run}`, state: "in_review", minutesAgo: 0 });
    await page.getByTestId(`queue-row-${late}`).waitFor({ timeout: 30_000 });

    // Send back with a reason on the stored-charge topic.
    await page.getByRole("link", { name: titles.sendBack }).click();
    await page.getByTestId("listing-review").waitFor();
    expect(await page.getByTestId("hazard-profile").textContent()).toMatch(/358 V/);
    expect(await page.getByTestId("topic-stored-charge").textContent()).toMatch(/Meets the policy/);
    await screenshot(page, "moderation-review");
    const since = new Date(Date.now() - 1000);
    await page.getByLabel("Topic", { exact: true }).selectOption({ label: "Stored charge" });
    await page.getByLabel("What must change").fill("Say how to confirm with a meter that the bus is below 60 V before touching the board.");
    await page.getByRole("button", { name: "Send back to the seller" }).click();
    await page.waitForURL(/done=send_back/);
    expect(await page.getByTestId("listing-state").textContent()).toContain("Sent back");
    expect(await page.getByTestId("decision-history").textContent()).toMatch(/Stored charge:\s*Say how to confirm/);
    await screenshot(page, "moderation-sent-back");
    expect(await listingState(ids.sendBack)).toBe("sent_back");

    // The worker delivers the seller's e-mail from the outbox within seconds.
    const mail = await waitForMessage(SELLER, since, 20_000, "Changes needed");
    expect(mail.subject).toBe(`Changes needed: “${titles.sendBack}”`);
    expect(mail.text).toMatch(/Stored charge/);
    expect(mail.text).toMatch(/below 60 V before touching/);

    // Approve the second one.
    await page.goto(`/moderate/listings/${ids.approve}`);
    await page.getByRole("button", { name: "Approve: make it live" }).click();
    await page.waitForURL(/done=approve/);
    expect(await page.getByTestId("listing-state").textContent()).toContain("Live");
    await screenshot(page, "moderation-approved");
    expect(await listingState(ids.approve)).toBe("live");

    // Hold the live one, with the reason the seller will read.
    await page.goto(`/moderate/listings/${ids.hold}`);
    expect(await page.getByTestId("listing-state").textContent()).toContain("Live");
    await page.getByLabel("Why is it held?").fill("A buyer reports the bleeder resistor is missing from the board as shipped.");
    await page.getByRole("button", { name: "Hold the listing" }).click();
    await page.waitForURL(/done=hold/);
    expect(await page.getByTestId("listing-state").textContent()).toContain("Held");
    await screenshot(page, "moderation-held");
    expect(await listingState(ids.hold)).toBe("held");
    await page.goto("/moderate#held");
    expect(await page.getByTestId(`held-row-${ids.hold}`).textContent()).toMatch(/bleeder resistor is missing/);
    expect(await page.getByTestId(`queue-row-${ids.approve}`).count()).toBe(0);
    await screenshot(page, "moderation-desk-after");
  });

  it("a seller calling the approve API on his own listing gets 403, and it stays in review", async () => {
    await signInThroughOutbox(s.page, SELLER);
    const approve = await s.page.request.post(`/api/moderation/listings/${ids.own}/approve`, { data: {} });
    expect(approve.status()).toBe(403);
    expect(await approve.json()).toMatchObject({ error: "forbidden" });
    const queue = await s.page.request.get("/api/moderation/queue");
    expect(queue.status()).toBe(403);
    await s.page.goto("/moderate");
    await s.page.getByTestId("not-allowed").waitFor();
    await screenshot(s.page, "moderation-not-allowed");
    expect(await listingState(ids.own)).toBe("in_review");
  });

  it("a visitor gets 401 from the moderation API", async () => {
    const res = await fetch(`${BASE_URL}/api/moderation/listings/${ids.own}/approve`, { method: "POST" });
    expect(res.status).toBe(401);
    expect(await listingState(ids.own)).toBe("in_review");
  });

  it("a re-submitted listing shows what changed since its approval", async () => {
    await signInThroughOutbox(s.page, MODERATOR, "/moderate");
    await s.page.goto("/moderate");
    expect(await s.page.getByTestId(`queue-row-${ids.edited}`).textContent()).toMatch(/Changed since approval/);
    await s.page.goto(`/moderate/listings/${ids.edited}`);
    const diff = s.page.getByTestId("snapshot-diff");
    await diff.waitFor();
    expect(await diff.locator('[data-op="added"]').allTextContents()).toEqual(expect.arrayContaining([expect.stringContaining("Now ships with a fitted 47 kΩ bleeder.")]));
    expect(await diff.textContent()).toMatch(/wait 60 s → 120 s/);
    await screenshot(s.page, "moderation-diff");

    // A magnetic from the demo seed shows its derived figures beside the raw ones.
    const magnetic = await pool.query("select id from listings where kind = 'magnetic' order by created_at limit 1");
    if (magnetic.rows[0]) {
      await s.page.goto(`/moderate/listings/${magnetic.rows[0].id}`);
      await s.page.getByTestId("listing-figures").waitFor();
      await screenshot(s.page, "moderation-magnetic");
    }
  });

  it("a moderator approves a seller application, which opens the shop and e-mails the applicant", async () => {
    const email = `wren.windings.${run}@example.test`;
    const { rows } = await pool.query("insert into users (id, email, name) values ($1, $2, 'Wren Windings') returning id", [`applicant-${run}`, email]);
    await pool.query(
      `insert into seller_applications (user_id, shop_name, profile_md, country, returns_policy_md) values ($1, $2, $3, 'IE', $4)`,
      [rows[0].id, `Wren Windings ${run}`, "I wind **gapped ferrite chokes** for hobby welders.", "Unused parts back within 30 days."],
    );
    await signInThroughOutbox(s.page, MODERATOR, "/moderate/applications");
    await s.page.goto("/moderate/applications");
    await s.page.getByText(`Wren Windings ${run}`).first().waitFor();
    await screenshot(s.page, "moderation-applications");
    const since = new Date(Date.now() - 1000);
    await s.page.getByRole("button", { name: `Approve “Wren Windings ${run}”` }).click();
    await s.page.waitForURL(/done=approved/);
    const mail = await waitForMessage(email, since, 20_000, `Wren Windings ${run}`);
    expect(mail.subject).toContain(`Wren Windings ${run}`);
    const roles = await pool.query("select role from user_roles where user_id = $1", [rows[0].id]);
    expect(roles.rows.map((r) => r.role)).toContain("seller");
  });

  it("the policy page is for admins; a revision with a missing summary is refused beside the field", async () => {
    await signInThroughOutbox(s.page, MODERATOR, "/admin/policy");
    await s.page.goto("/admin/policy");
    await s.page.getByTestId("not-allowed").waitFor();

    const admin = await openBrowser();
    try {
      await signInThroughOutbox(admin.page, ADMIN, "/admin/policy");
      await admin.page.goto("/admin/policy");
      await admin.page.getByTestId("policy-figures").waitFor();
      // The form starts from the rules in force: revision 1's 12 words unless one was published since.
      const before = await pool.query("select count(*)::int as n, (array_agg(rules->>'minWords' order by revision desc))[1] as min_words from policy_revisions");
      expect(await admin.page.getByLabel("Minimum words per note").inputValue()).toBe(before.rows[0].min_words ?? "12");
      // Too short for the browser's `required` to stop it, so the server's schema answers.
      await admin.page.getByLabel("What changes").fill("short");
      await admin.page.getByLabel("Minimum words per note").fill("40");
      await admin.page.getByRole("button", { name: /Publish revision/ }).click();
      const field = admin.page.getByLabel("What changes");
      await expect.poll(() => field.getAttribute("aria-invalid")).toBe("true");
      // What the admin typed is still there to correct.
      expect(await field.inputValue()).toBe("short");
      expect(await admin.page.getByLabel("Minimum words per note").inputValue()).toBe("40");
      await screenshot(admin.page, "policy-admin");
      const { rows } = await pool.query("select count(*)::int as n from policy_revisions");
      expect(rows[0].n).toBe(before.rows[0].n);
    } finally {
      await admin.close();
    }
  });

  it("an admin publishes a stricter revision; the worker re-checks live listings and the desk shows who fails and until when", async () => {
    const shortKit = await insertListing(fixtures.db, { sellerId: "demo-seller-kits", title: `Re-check kit ${run}`, state: "live", minutesAgo: 500 });
    // Other browser suites share this database and expect the built-in revision: note what the re-check changes, and put it back.
    const started = new Date();
    const { rows: saved } = await pool.query("select id, policy_revision, policy_status, grace_until from listings where state = 'live'");
    const admin = await openBrowser();
    let revision: number | undefined;
    try {
      await signInThroughOutbox(admin.page, ADMIN, "/admin/policy");
      await admin.page.goto("/admin/policy");
      await admin.page.getByLabel("What changes").fill("Every note needs at least 40 words, so it says enough to act on.");
      await admin.page.getByLabel("Minimum words per note").fill("40");
      await admin.page.getByRole("button", { name: /Publish revision/ }).click();
      await admin.page.waitForURL(/published=\d+/);
      revision = Number(new URL(admin.page.url()).searchParams.get("published"));
      await screenshot(admin.page, "policy-published");

      // The worker picks the job up; the desk shows the run once every live listing has a result.
      const checked = admin.page.getByTestId(`recheck-${revision}-checked`);
      await expect
        .poll(
          async () => {
            // A fresh query each time: a goto that only changes the #hash would not reload the page.
            await admin.page.goto(`/moderate?at=${Date.now()}#rechecks`);
            return Number(await checked.textContent());
          },
          { timeout: 30_000, interval: 1_000 },
        )
        .toBe(saved.length);
      const section = admin.page.getByTestId(`recheck-${revision}`);
      const row = section.locator("tr", { hasText: `Re-check kit ${run}` });
      expect(await row.textContent()).toMatch(/Grace running/);
      await screenshot(admin.page, "moderation-rechecks");

      // Seeded live listings may get notices too; wait for the one about ours.
      const title = `Re-check kit ${run}`;
      let notice: OutboxMessage | undefined;
      await expect
        .poll(
          async () => {
            notice = (await messagesTo(SELLER)).find((m) => m.subject.includes(title) && new Date(m.createdAt) >= started);
            return notice !== undefined;
          },
          { timeout: 20_000, interval: 500 },
        )
        .toBe(true);
      expect(notice!.subject).toMatch(new RegExp(`^Action needed by .*: “Re-check kit ${run}” and policy revision ${revision}$`));
      expect(notice!.text).toMatch(/asks for at least 40/);
    } finally {
      await admin.close();
      for (const l of saved) {
        await pool.query("update listings set policy_revision = $2, policy_status = $3, grace_until = $4 where id = $1", [l.id, l.policy_revision, l.policy_status, l.grace_until]);
      }
      await pool.query("delete from listing_decisions where decision = 'grace_notice' and created_at >= $1", [started]);
      if (revision) await pool.query("delete from policy_revisions where revision = $1", [revision]);
      await pool.query("update listings set state = 'retired' where id = $1", [shortKit]);
    }
  });
});
