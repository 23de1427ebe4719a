// Listings written straight into the database, so the moderator side can be tested without the
// seller's form. Shared by the integration tests and the browser test (tests/e2e/moderation.test.ts).
import { randomBytes } from "node:crypto";
import { eq, sql } from "drizzle-orm";
import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import pg from "pg";
import * as schema from "../../../db/schema";
import type { SafetyDeclaration, SafetyNote } from "../../../lib/policy";

export type FixtureDb = NodePgDatabase<typeof schema>;

export function connectFixtures(url: string): { db: FixtureDb; close(): Promise<void> } {
  const pool = new pg.Pool({ connectionString: url, max: 2 });
  return { db: drizzle(pool, { schema }), close: () => pool.end() };
}

/** 230 V +10 % mains (IEC 60038), 470 µF bus, 47 kΩ bleeder: about 358 V peak, 39 s to fall below 60 V. */
export const MAINS_KIT: SafetyDeclaration = {
  mainsConnected: true,
  mainsVrms: 230,
  mainsTolerance: 0.1,
  busCapacitanceF: 470e-6,
  bleederOhm: 47e3,
  liveHeatsinks: false,
  weldingSource: false,
};

const SHORT_NOTES: Record<string, string> = {
  "mains-isolation":
    "Unplug the kit at the wall before opening the case. The input filter, bridge and bus stay live whenever the cord is plugged in.",
  "stored-charge":
    "The 470 µF bus holds about 30 J at 358 V. Wait two minutes after unplugging, then confirm with a meter that the bus reads below 60 V.",
  "first-power-up":
    "Bring it up the first time through a 100 W series lamp, control supply first, and check the bus voltage before removing the lamp.",
  "protective-earth":
    "The case, the heatsink frame and the transformer screen are bonded to the earth stud; check continuity below 0.1 Ω with a meter.",
  "codes-and-competence":
    "Local electrical codes and licensed practice take precedence over this sheet. Build it only if you have worked on mains equipment before.",
};

// Each long note adds this, so it passes a revision that asks for 40 words per note.
const MORE =
  " Keep one hand in a pocket while measuring, use probes rated for the bus voltage, and never leave the open board powered and unattended on the bench, where a visitor or a pet could touch it.";

/** A complete sheet for MAINS_KIT: about 22 words a note (clear under revision 1's 12), or about 57 with `long`. */
export function sheetNotes({ long = false, waitSeconds = 120 }: { long?: boolean; waitSeconds?: number } = {}): SafetyNote[] {
  return Object.entries(SHORT_NOTES).map(([topic, text]) => ({
    topic: topic as SafetyNote["topic"],
    text: long ? text + MORE : text,
    ...(topic === "stored-charge" ? { waitSeconds } : {}),
  }));
}

export async function ensureSellerProfile(db: FixtureDb, userId: string, shopName: string): Promise<void> {
  await db
    .insert(schema.sellerProfiles)
    .values({
      userId,
      shopName,
      slug: `${shopName.toLowerCase().replace(/[^a-z0-9]+/g, "-")}-${randomBytes(2).toString("hex")}`,
      profileMd: "Boards and kits from the cooperative's bench.",
      country: "NL",
      returnsPolicyMd: "Unused parts can be returned within 30 days.",
      payoutAccountId: `acct_fixture_${randomBytes(4).toString("hex")}`,
      chargesEnabled: true,
      payoutsEnabled: true,
    })
    .onConflictDoNothing();
  // The demo seed may already have opened this shop; submissions need its payout account enabled.
  await db
    .update(schema.sellerProfiles)
    .set({ chargesEnabled: true, payoutsEnabled: true, payoutAccountId: sql`coalesce(${schema.sellerProfiles.payoutAccountId}, ${`acct_fixture_${randomBytes(4).toString("hex")}`})` })
    .where(eq(schema.sellerProfiles.userId, userId));
}

export type ListingFixture = {
  sellerId: string;
  title: string;
  state: schema.ListingState;
  kind?: schema.ListingKind;
  descriptionMd?: string;
  declaration?: SafetyDeclaration;
  notes?: SafetyNote[];
  figures?: Record<string, unknown>;
  /** minutes ago it was submitted (in_review) or went live */
  minutesAgo?: number;
  graceUntil?: Date | null;
  photoUrl?: string;
};

export async function insertListing(db: FixtureDb, f: ListingFixture): Promise<string> {
  const at = new Date(Date.now() - (f.minutesAgo ?? 30) * 60_000);
  const slug = `${f.title.toLowerCase().replace(/[^a-z0-9]+/g, "-")}-${randomBytes(3).toString("hex")}`;
  const kind = f.kind ?? "kit";
  const [row] = await db
    .insert(schema.listings)
    .values({
      sellerId: f.sellerId,
      kind,
      magneticSubtype: kind === "magnetic" ? "choke" : null,
      title: f.title,
      slug,
      descriptionMd: f.descriptionMd ?? "A two-board kit.\n\nThe **power board** carries the bridge and the bus capacitors.",
      priceMinor: 14_900,
      currency: "EUR",
      stock: 4,
      shippingWeightG: 900,
      figures: f.figures ?? { mainsVrms: 230, busCapacitanceF: 470e-6, bleederOhm: 47e3 },
      declaration: f.declaration ?? MAINS_KIT,
      safetyNotes: f.notes ?? sheetNotes(),
      state: f.state,
      policyRevision: 1,
      policyStatus: "clear",
      submittedAt: f.state === "draft" ? null : at,
      liveAt: f.state === "live" || f.state === "held" ? at : null,
      graceUntil: f.graceUntil ?? null,
      createdAt: new Date(at.getTime() - 60 * 60_000),
    })
    .returning({ id: schema.listings.id });
  const id = row!.id;
  const key = `fixture-${randomBytes(6).toString("hex")}`;
  await db.insert(schema.uploads).values({
    key,
    ownerId: f.sellerId,
    purpose: "listing-photo",
    originalName: "board.webp",
    contentType: "image/webp",
    bytes: 20_000,
    url: f.photoUrl ?? "/demo/board-gate-drive.webp",
    thumbUrl: f.photoUrl ?? "/demo/board-gate-drive-thumb.webp",
    width: 800,
    height: 600,
  });
  await db.insert(schema.listingPhotos).values({ listingId: id, uploadKey: key, position: 0, alt: `${f.title}, top view` });
  return id;
}

/** Records the version a moderator approved earlier, in the shape snapshotListing writes, with `changes` applied to it. */
export async function insertApprovedVersion(
  db: FixtureDb,
  listingId: string,
  changes: { descriptionMd?: string; notes?: SafetyNote[]; declaration?: SafetyDeclaration; title?: string },
): Promise<void> {
  const [listing] = await db.select().from(schema.listings).where(eq(schema.listings.id, listingId));
  if (!listing) throw new Error(`no listing ${listingId}`);
  const approvedAt = new Date(Date.now() - 7 * 24 * 60 * 60_000);
  await db.insert(schema.listingVersions).values({
    listingId,
    approvedBy: "demo-moderator",
    approvedAt,
    snapshot: {
      title: changes.title ?? listing.title,
      kind: listing.kind,
      magneticSubtype: listing.magneticSubtype,
      descriptionMd: changes.descriptionMd ?? listing.descriptionMd,
      figures: listing.figures,
      declaration: changes.declaration ?? listing.declaration,
      safetyNotes: changes.notes ?? listing.safetyNotes,
      checkpoints: [],
      requirements: [],
    },
  });
  await db.insert(schema.listingDecisions).values({ listingId, actorId: "demo-moderator", decision: "approved", policyRevision: 1, createdAt: approvedAt });
}
