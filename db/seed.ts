// Idempotent demo seed: every row has a fixed key and is inserted only when missing, so running it
// twice changes nothing. The base (accounts, shops, the first listings) is what the tests build on;
// `everyState` adds the rest of the scenario, in which every journey shows each of its states: orders,
// bring-up logs with their scope captures, reviews, the Q&A, applications and a policy revision with its
// grace period running.
// `npm run db:seed` or the launcher (`npm start`) seed all of it.
import { drizzle } from "drizzle-orm/node-postgres";
import pg from "pg";
import * as schema from "./schema";
import { DEMO_ACCOUNTS, DEMO_REVIEWER, DEMO_SELLERS } from "./seed-data";
import { DEMO_LISTINGS, type DemoListing } from "./seed-listings";
import { checkSafetySheet, CURRENT_POLICY_REVISION } from "@/lib/policy";
import { deriveMagnetic } from "@/lib/listings/derived";
import type { MagneticFigures } from "@/lib/validations/listings";
import { seedApplications } from "./seed-applications";
import { seedBench } from "./seed-bench";
import { seedCaptures } from "./seed-captures";
import { seedOrders } from "./seed-orders";
import { seedPolicy } from "./seed-policy";
import { seedQa } from "./seed-qa";
import { seedReviews } from "./seed-reviews";
import { seedStoryListings } from "./seed-stories";
import { demoClock, SEEDED_AT, type DemoClock, type SeedTx } from "./seed-support";

export type SeedOptions = {
  /** add the scenario with every state of every journey (default: the base only) */
  everyState?: boolean;
  /** the moment the scenario's relative times count from (tests pin it) */
  now?: Date;
};

export async function seedDemo(connectionString: string, { everyState = false, now = new Date() }: SeedOptions = {}): Promise<{ created: boolean }> {
  const pool = new pg.Pool({ connectionString, max: 2 });
  const db = drizzle(pool, { schema });
  try {
    return await db.transaction(async (tx) => {
      const inserted = await tx
        .insert(schema.users)
        .values(
          DEMO_ACCOUNTS.map((a) => ({
            id: a.id,
            email: a.email,
            name: a.name,
            emailVerified: new Date("2026-09-01T09:00:00Z"),
            createdAt: new Date("2026-09-01T09:00:00Z"),
          })),
        )
        .onConflictDoNothing()
        .returning({ id: schema.users.id });
      await tx
        .insert(schema.userRoles)
        .values(DEMO_ACCOUNTS.flatMap((a) => a.roles.map((role) => ({ userId: a.id, role, grantedAt: SEEDED_AT }))))
        .onConflictDoNothing();
      await seedSellers(tx);
      await tx
        .insert(schema.reviewerProfiles)
        .values({
          userId: DEMO_REVIEWER.userId,
          expertise: DEMO_REVIEWER.expertise,
          profileMd: DEMO_REVIEWER.profileMd,
          priceMinor: DEMO_REVIEWER.priceMinor,
          currency: "EUR",
          // The payout account is created in the payments stand-in by the launcher, like the sellers'.
          payoutsEnabled: true,
          createdAt: SEEDED_AT,
        })
        .onConflictDoNothing();
      const listings = await seedListings(tx);
      const states = everyState ? await seedEveryState(tx, demoClock(now)) : 0;
      return { created: inserted.length > 0 || listings > 0 || states > 0 };
    });
  } finally {
    await pool.end();
  }
}

/** The scenario's parts, in the order their rows refer to each other; returns how many top-level rows were new. */
async function seedEveryState(tx: SeedTx, clock: DemoClock): Promise<number> {
  let inserted = 0;
  inserted += await seedApplications(tx, clock);
  inserted += await seedStoryListings(tx, clock);
  inserted += await seedPolicy(tx, clock);
  inserted += await seedOrders(tx, clock);
  inserted += await seedBench(tx, clock);
  inserted += await seedReviews(tx, clock);
  inserted += await seedCaptures(tx, clock);
  inserted += await seedQa(tx, clock);
  return inserted;
}

async function seedSellers(tx: SeedTx) {
  for (const seller of DEMO_SELLERS) {
    const application = {
      id: seller.applicationId,
      userId: seller.userId,
      shopName: seller.shopName,
      profileMd: seller.profileMd,
      country: seller.country,
      returnsPolicyMd: seller.returnsPolicyMd,
      returnsWindowDays: seller.returnsWindowDays,
      status: "approved" as const,
      decidedBy: "demo-moderator",
      decidedAt: SEEDED_AT,
      createdAt: SEEDED_AT,
    };
    await tx.insert(schema.sellerApplications).values(application).onConflictDoNothing();
    await tx
      .insert(schema.sellerProfiles)
      .values({
        userId: seller.userId,
        shopName: seller.shopName,
        slug: seller.slug,
        profileMd: seller.profileMd,
        country: seller.country,
        returnsPolicyMd: seller.returnsPolicyMd,
        returnsWindowDays: seller.returnsWindowDays,
        // The payout account itself is created in the payments stand-in by the launcher (fakes/demo-payouts.ts).
        chargesEnabled: true,
        payoutsEnabled: true,
        createdAt: SEEDED_AT,
      })
      .onConflictDoNothing();
  }
}

/** Inserts the demo listings that are missing; returns how many it inserted. */
async function seedListings(tx: SeedTx): Promise<number> {
  let inserted = 0;
  for (const demo of DEMO_LISTINGS) {
    const check = checkSafetySheet({ declaration: demo.declaration, notes: demo.notes, revision: CURRENT_POLICY_REVISION });
    if (["live", "in_review", "held"].includes(demo.state) && check.status !== "clear") {
      throw new Error(`demo listing ${demo.slug} must have a clear sheet: ${check.findings.map((f) => f.message).join(" ")}`);
    }
    const derived = demo.kind === "magnetic" && demo.magneticSubtype ? deriveMagnetic(demo.magneticSubtype, demo.figures as MagneticFigures) : null;
    const rows = await tx
      .insert(schema.listings)
      .values({
        id: demo.id,
        sellerId: demo.sellerId,
        kind: demo.kind,
        magneticSubtype: demo.magneticSubtype ?? null,
        title: demo.title,
        slug: demo.slug,
        descriptionMd: demo.descriptionMd,
        priceMinor: demo.priceMinor,
        currency: "EUR",
        stock: demo.stock,
        shippingWeightG: demo.shippingWeightG,
        figures: demo.figures,
        declaration: demo.declaration,
        safetyNotes: demo.notes,
        state: demo.state,
        policyRevision: CURRENT_POLICY_REVISION.revision,
        policyStatus: check.status,
        inductanceH: derived?.inductanceH ?? null,
        ratedCurrentA: demo.kind === "magnetic" ? (demo.figures as MagneticFigures).ratedCurrentA : null,
        moderatorMessage: demo.moderatorMessage ?? null,
        submittedAt: demo.state === "draft" ? null : SEEDED_AT,
        liveAt: demo.state === "live" || demo.state === "held" ? SEEDED_AT : null,
        createdAt: SEEDED_AT,
        updatedAt: SEEDED_AT,
      })
      .onConflictDoNothing()
      .returning({ id: schema.listings.id });
    if (rows.length === 0) continue;
    inserted += 1;
    await seedListingParts(tx, demo);
  }
  return inserted;
}

async function seedListingParts(tx: SeedTx, demo: DemoListing) {
  const key = `demo-${demo.photo}-${demo.id.slice(-4)}`;
  await tx.insert(schema.uploads).values({
    key,
    ownerId: demo.sellerId,
    purpose: "listing-photo",
    originalName: `${demo.photo}.webp`,
    contentType: "image/webp",
    bytes: 12_000,
    url: `/demo/${demo.photo}.webp`,
    thumbUrl: `/demo/${demo.photo}-thumb.webp`,
    width: 1200,
    height: 900,
    createdAt: SEEDED_AT,
  });
  await tx.insert(schema.listingPhotos).values({ listingId: demo.id, uploadKey: key, position: 0, alt: demo.title });
  if (demo.checkpoints?.length) {
    await tx.insert(schema.listingCheckpoints).values(
      demo.checkpoints.map((c, position) => ({ listingId: demo.id, position, stage: c.stage, name: c.name, measure: c.measure, unit: c.unit, expectedMin: c.min, expectedMax: c.max })),
    );
  }
  if (demo.requirements?.length) {
    await tx.insert(schema.listingRequirements).values(
      demo.requirements.map((r) => ({ listingId: demo.id, subtype: r.subtype, label: r.label, minInductanceH: r.minInductanceH ?? null, atCurrentA: r.atCurrentA ?? null })),
    );
  }
  const history: { decision: schema.ListingDecisionKind; actorId: string; note?: string; reasons?: { topic: string; text: string }[] }[] = [];
  if (demo.state !== "draft") history.push({ decision: "submitted", actorId: demo.sellerId });
  if (demo.state === "live" || demo.state === "held") history.push({ decision: "approved", actorId: "demo-moderator" });
  if (demo.state === "held") history.push({ decision: "held", actorId: "demo-moderator", note: demo.moderatorMessage });
  if (demo.state === "sent_back") history.push({ decision: "sent_back", actorId: "demo-moderator", reasons: demo.reasons });
  for (const step of history) {
    await tx.insert(schema.listingDecisions).values({
      listingId: demo.id,
      actorId: step.actorId,
      decision: step.decision,
      reasons: step.reasons ?? [],
      note: step.note ?? null,
      policyRevision: CURRENT_POLICY_REVISION.revision,
      createdAt: SEEDED_AT,
    });
    await tx.insert(schema.auditLog).values({
      actorId: step.actorId,
      action: `listing.${step.decision}`,
      subjectType: "listing",
      subjectId: demo.id,
      reason: step.note ?? step.reasons?.map((r) => r.text).join("; ") ?? null,
      details: { seeded: true },
      at: SEEDED_AT,
    });
  }
  if (demo.state === "live" || demo.state === "held") {
    await tx.insert(schema.listingVersions).values({
      listingId: demo.id,
      approvedBy: "demo-moderator",
      approvedAt: SEEDED_AT,
      snapshot: { title: demo.title, descriptionMd: demo.descriptionMd, figures: demo.figures, declaration: demo.declaration, safetyNotes: demo.notes },
    });
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const url = process.env.DATABASE_URL;
  if (!url) {
    console.error("Set DATABASE_URL to the database to seed (npm start seeds its embedded database itself).");
    process.exit(1);
  }
  seedDemo(url, { everyState: true })
    .then((r) => console.log(r.created ? "demo data seeded" : "demo data already present"))
    .catch((error) => {
      console.error(error);
      process.exit(1);
    });
}
