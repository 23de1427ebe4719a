import { afterAll, beforeAll, describe, expect, it } from "vitest";
import pg from "pg";
import { openBrowser, screenshot, type Session } from "./support/browser";
import { signInThroughOutbox } from "./support/sign-in";
import { connectFixtures, ensureSellerProfile, insertListing, type FixtureDb } from "../integration/moderation/fixtures";

// The two journeys of selling and moderation joined end to end: a kit in review is sent back with a
// reason, the seller fixes the note and submits again, the moderator approves, the kit is in the
// catalog; then a moderator holds it and it is gone from the catalog, its page saying so.
// (Creating the kit with photos and watching the live check turn clear is tests/e2e/selling.test.ts.)
const MODERATOR = "sefa.moderator@larkspur.test";
const SELLER = "bram.kits@larkspur.test";
const run = Date.now().toString(36);
const title = `Resonant driver kit ${run}`;

let fixtures: { db: FixtureDb; close(): Promise<void> };
let pool: pg.Pool;
let listingId = "";
let slug = "";

beforeAll(async () => {
  const url = process.env.E2E_DATABASE_URL;
  if (!url) throw new Error("E2E_DATABASE_URL is not set: run this through npm test");
  fixtures = connectFixtures(url);
  pool = new pg.Pool({ connectionString: url, max: 2 });
  await ensureSellerProfile(fixtures.db, "demo-seller-kits", "Oyelaran Bench Kits");
  listingId = await insertListing(fixtures.db, { sellerId: "demo-seller-kits", title, state: "in_review", minutesAgo: 30, figures: {} });
  slug = (await pool.query("select slug from listings where id = $1", [listingId])).rows[0].slug;
});

afterAll(async () => {
  await fixtures?.close();
  await pool?.end();
});

const state = async () => (await pool.query("select state from listings where id = $1", [listingId])).rows[0].state as string;

async function catalogShows(session: Session): Promise<boolean> {
  await session.page.goto(`/catalog?q=${encodeURIComponent(title)}`);
  await session.page.getByTestId("catalog-count").waitFor();
  return (await session.page.getByTestId(`listing-card-${slug}`).count()) > 0;
}

describe("a kit from review to the catalog and out again", () => {
  it("send back with a reason, fix, approve, live in the catalog, hold, gone", async () => {
    const moderator = await openBrowser();
    const seller = await openBrowser();
    const visitor = await openBrowser();
    try {
      await signInThroughOutbox(moderator.page, MODERATOR, "/moderate");
      await signInThroughOutbox(seller.page, SELLER, "/sell");
      expect(await catalogShows(visitor)).toBe(false);

      // The moderator sends it back, naming the stored-charge topic.
      await moderator.page.goto(`/moderate/listings/${listingId}`);
      await moderator.page.getByLabel("Topic", { exact: true }).selectOption({ label: "Stored charge" });
      await moderator.page.getByLabel("What must change").fill("Say how to confirm with a meter that the bus is below 60 V.");
      await moderator.page.getByRole("button", { name: "Send back to the seller" }).click();
      await expect.poll(state).toBe("sent_back");

      // The seller reads the reason, fixes the note and submits again.
      await seller.page.goto(`/sell/listings/${listingId}`);
      expect(await seller.page.locator("main").textContent()).toContain("confirm with a meter");
      const note = seller.page.getByTestId("note-stored-charge").getByRole("textbox");
      await note.fill(
        `${await note.inputValue()} Before touching anything, measure across the bus terminals with a meter and go on only below 60 V.`,
      );
      await expect.poll(() => seller.page.getByTestId("live-check").getAttribute("data-status")).toBe("clear");
      await seller.page.getByRole("button", { name: "Submit for review" }).click();
      await expect.poll(state, { timeout: 20_000 }).toBe("in_review");
      await screenshot(seller.page, "journey-resubmitted");

      // The moderator approves; the kit is in the catalog.
      await moderator.page.goto(`/moderate/listings/${listingId}`);
      await moderator.page.getByRole("button", { name: "Approve: make it live" }).click();
      await expect.poll(state).toBe("live");
      expect(await catalogShows(visitor)).toBe(true);
      await screenshot(visitor.page, "journey-in-catalog");

      // Held: out of the catalog, and its page says why it cannot be bought.
      await moderator.page.goto(`/moderate/listings/${listingId}`);
      await moderator.page.getByLabel("Why is it held?").fill("A buyer reports the bleeder is missing from the board as shipped.");
      await moderator.page.getByRole("button", { name: "Hold the listing" }).click();
      await expect.poll(state).toBe("held");
      expect(await catalogShows(visitor)).toBe(false);
      await visitor.page.goto(`/listings/${slug}`);
      expect(await visitor.page.getByTestId("listing-page").getAttribute("data-state")).toBe("held");
      expect(await visitor.page.locator("main").textContent()).toContain("Held by a moderator");
      await screenshot(visitor.page, "journey-held");
    } finally {
      await Promise.all([moderator.close(), seller.close(), visitor.close()]);
    }
  });
});
