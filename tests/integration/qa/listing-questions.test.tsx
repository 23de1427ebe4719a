import { renderToStaticMarkup } from "react-dom/server";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { newMember, QUESTION, sessionUser, setupQaDb, trustedMember, type QaTestDb } from "./setup";

// The listing page's Q&A panel (issue 6: "questions attached to a listing … shown on the listing
// page"): only visible questions about that listing, newest first, with links to ask and to all.

const KIT_ID = "0b7d1c3e-5a21-4c6e-9f10-000000000001"; // the demo kit of db/seed-listings.ts

let t: QaTestDb;
beforeAll(async () => {
  t = await setupQaDb("qa_listing_panel");
});
afterAll(async () => {
  await t.teardown();
});

describe("ListingQuestions", () => {
  it("shows the listing's visible questions, not pending ones or those about the general bench", async () => {
    const { askQuestion } = await import("@/lib/qa/posting");
    const { ListingQuestions } = await import("@/components/qa/listing-questions");
    const trusted = await sessionUser((await trustedMember(t.pool, "Hale Turner")).id);
    const fresh = await sessionUser((await newMember(t.pool, "Ida Fenn")).id);
    const older = await askQuestion(trusted, { ...QUESTION, title: "Which gate resistor for the kit's IGBTs?", listingId: KIT_ID });
    const newer = await askQuestion(trusted, { ...QUESTION, title: "Does the kit's choke run warm at 100 A?", listingId: KIT_ID });
    const pending = await askQuestion(fresh, { ...QUESTION, title: "Waiting question about the kit", listingId: KIT_ID });
    const general = await askQuestion(trusted, { ...QUESTION, title: "General bench question about scopes" });
    expect([older, newer, pending, general].map((o) => o.ok && o.state)).toEqual(["visible", "visible", "pending", "visible"]);

    const html = renderToStaticMarkup(await ListingQuestions({ listingId: KIT_ID }));
    expect(html).toContain("Does the kit&#x27;s choke run warm at 100 A?");
    expect(html).toContain("Which gate resistor for the kit&#x27;s IGBTs?");
    expect(html.indexOf("choke run warm")).toBeLessThan(html.indexOf("gate resistor"));
    expect(html).not.toContain("Waiting question");
    expect(html).not.toContain("General bench question");
    expect(html).toContain(`href="/questions/new?listing=${KIT_ID}"`);
  });

  it("refuses a question about a listing that is not in the catalog", async () => {
    const { askQuestion } = await import("@/lib/qa/posting");
    const { rows } = await t.pool.query("select id from listings where state <> 'live' limit 1");
    const trusted = await sessionUser((await trustedMember(t.pool, "Noa Brandt")).id);
    expect(await askQuestion(trusted, { ...QUESTION, listingId: rows[0].id })).toMatchObject({ ok: false, status: 422, fieldErrors: { listingId: expect.any(Array) } });
  });
});
