// Posting that reaches other people, besides questions and answers (their limit is tested in
// tests/integration/qa/rate-limits.test.ts): review requests (each opens a hosted payment and asks
// a reviewer) and listing submissions (each lands in the moderators' queue). The server actions run
// against the real PostgreSQL windows; what would happen past the limit — the payment session, the
// submission — is replaced by a recorder, so "not called" means nothing went out.
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { seedDemo } from "@/db/seed";
import { freshDatabase } from "../../support/test-database";
import { addUpload, KIT_DECLARATION, kitNotes } from "../selling/setup";

const state = vi.hoisted(() => ({ userId: null as string | null, bookings: 0, submissions: [] as string[] }));
vi.mock("@/lib/auth/config", () => ({ auth: async () => (state.userId ? { user: { id: state.userId } } : null) }));
vi.mock("next/cache", () => ({ revalidatePath: () => {}, revalidateTag: () => {} }));
vi.mock("@/lib/reviews/payments", () => ({
  startBooking: async () => {
    state.bookings += 1;
    return { url: "http://127.0.0.1:9/pay/cs_posting_limit" };
  },
}));
vi.mock("@/db/queries/listings", async (importOriginal) => ({
  ...(await importOriginal<typeof import("@/db/queries/listings")>()),
  submitListing: async (_actor: unknown, id: string) => {
    state.submissions.push(id);
  },
}));

let database: { url: string; drop(): Promise<void> };
let pool: import("pg").Pool;

beforeAll(async () => {
  database = await freshDatabase("security_posting_limits");
  await seedDemo(database.url);
  process.env.DATABASE_URL = database.url;
  (await import("@/lib/env"))._resetEnvForTests();
  const pg = (await import("pg")).default;
  pool = new pg.Pool({ connectionString: database.url, max: 2 });
});

afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
  await pool?.end();
  await database?.drop();
});

beforeEach(() => {
  // An hour's window starts on the hour; a case that ran across one would see two windows.
  const intoHour = (Date.now() / 1000) % 3600;
  if (intoHour > 3590) return new Promise((r) => setTimeout(r, (3601 - intoHour) * 1000));
});

/** The action's answer: "redirect <path>" when it went on, else its message. */
async function outcome(run: () => Promise<unknown>): Promise<string> {
  try {
    const result = (await run()) as { ok: boolean; message?: string };
    return result.ok ? "ok" : String(result.message);
  } catch (error) {
    const digest = (error as { digest?: string }).digest ?? "";
    if (digest.startsWith("NEXT_REDIRECT")) return `redirect ${digest.split(";")[2]}`;
    throw error;
  }
}

describe("review requests", () => {
  it("takes 10 in an hour from one member, then refuses with when to try again and opens no payment", async () => {
    const { REVIEW_REQUESTS_PER_HOUR } = await import("@/lib/rate-limit/posting");
    expect(REVIEW_REQUESTS_PER_HOUR).toBe(10);
    const { bookReview } = await import("@/app/(bench)/reviews/new/actions");
    state.userId = "demo-builder";
    const form = () => {
      const f = new FormData();
      f.set("logId", "6f0c8d1e-0000-4000-8000-00000000abcd");
      f.set("reviewerId", "demo-reviewer");
      f.append("stages", "series-lamp");
      return f;
    };
    for (let i = 0; i < 10; i++) expect(await outcome(() => bookReview(null, form()))).toMatch(/^redirect http:\/\/127\.0\.0\.1:9\/pay\//);
    expect(await outcome(() => bookReview(null, form()))).toMatch(/You have asked for 10 reviews in this hour.*Nothing was charged; you can ask again in \d+ (minutes|seconds?) \(at \d\d:00 UTC\)/);
    expect(state.bookings).toBe(10);
    // Another member's budget is their own.
    state.userId = "demo-seller-kits";
    expect(await outcome(() => bookReview(null, form()))).toMatch(/^redirect /);
  });
});

describe("listing submissions", () => {
  it("takes 20 in an hour from one seller; the 21st is saved as a draft but not submitted, and says when to try again", async () => {
    const { LISTING_SUBMISSIONS_PER_HOUR } = await import("@/lib/rate-limit/posting");
    expect(LISTING_SUBMISSIONS_PER_HOUR).toBe(20);
    const { saveListing } = await import("@/app/(sell)/sell/listings/actions");
    const { createListingDraft } = await import("@/db/queries/listings");
    const { listingDraftSchema } = await import("@/lib/validations/listings");
    await addUpload(pool, "demo-seller-kits", "posting-limit-photo", "listing-photo");
    const raw = {
      kind: "kit",
      title: "Half-bridge stick welder kit",
      descriptionMd: "Board, BOM and build notes for a half-bridge stick welder.",
      price: "189.00",
      currency: "EUR",
      stock: 4,
      shippingWeightG: 1800,
      photos: [{ key: "posting-limit-photo", alt: "Board, top" }],
      documents: [],
      declaration: KIT_DECLARATION,
      notes: kitNotes(),
      checkpoints: [{ stage: "series-lamp", name: "Bus through the lamp", measure: "DC bus across C1", unit: "V", expectedMin: 300, expectedMax: 340 }],
      requirements: [],
    };
    const { id } = await createListingDraft("demo-seller-kits", listingDraftSchema.parse(raw));
    state.userId = "demo-seller-kits";
    for (let i = 0; i < 20; i++) expect(await outcome(() => saveListing(id, raw, "submit")), `submission ${i + 1}`).toBe(`redirect /sell?submitted=${id}`);
    expect(await outcome(() => saveListing(id, raw, "submit"))).toMatch(/^Saved as a draft\. You have submitted 20 listings for review in this hour.*submit again in \d+ (minutes|seconds?) \(at \d\d:00 UTC\)/);
    expect(state.submissions).toHaveLength(20);
    // Saving a draft is not a submission and is never limited.
    expect(await outcome(() => saveListing(id, raw, "draft"))).toBe("ok");
  });
});
