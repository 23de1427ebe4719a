import { relations, sql } from "drizzle-orm";
import {
  boolean,
  check,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  text,
  timestamp,
  uniqueIndex,
  uuid,
} from "drizzle-orm/pg-core";
import type { SafetyDeclaration, SafetyNote } from "@/lib/policy";
import { users } from "./users";
import { uploads } from "./uploads";

export const LISTING_KINDS = ["board", "magnetic", "kit"] as const;
export const MAGNETIC_SUBTYPES = ["transformer", "choke", "current-transformer"] as const;
export const LISTING_STATES = ["draft", "in_review", "live", "sent_back", "held", "retired"] as const;
export const BRING_UP_STAGES = ["control-supply", "series-lamp", "low-current", "rated-load"] as const;
export const DOCUMENT_KINDS = ["schematic", "bom", "build-notes", "other"] as const;

export type ListingKind = (typeof LISTING_KINDS)[number];
export type MagneticSubtype = (typeof MAGNETIC_SUBTYPES)[number];
export type ListingState = (typeof LISTING_STATES)[number];
export type BringUpStage = (typeof BRING_UP_STAGES)[number];

export const listingKindEnum = pgEnum("listing_kind", LISTING_KINDS);
export const magneticSubtypeEnum = pgEnum("magnetic_subtype", MAGNETIC_SUBTYPES);
export const listingStateEnum = pgEnum("listing_state", LISTING_STATES);
export const bringUpStageEnum = pgEnum("bring_up_stage", BRING_UP_STAGES);
export const documentKindEnum = pgEnum("document_kind", DOCUMENT_KINDS);

/** Kind-specific figures, validated by lib/validations/listings.ts; SI units throughout. */
export type ListingFigures = Record<string, unknown>;

export const listings = pgTable(
  "listings",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    sellerId: text("seller_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    kind: listingKindEnum("kind").notNull(),
    magneticSubtype: magneticSubtypeEnum("magnetic_subtype"),
    title: text("title").notNull(),
    slug: text("slug").notNull(),
    descriptionMd: text("description_md").notNull().default(""),
    priceMinor: integer("price_minor").notNull(),
    currency: text("currency").notNull().default("EUR"),
    stock: integer("stock").notNull().default(0),
    shippingWeightG: integer("shipping_weight_g").notNull().default(0),
    figures: jsonb("figures").$type<ListingFigures>().notNull().default({}),
    declaration: jsonb("declaration").$type<SafetyDeclaration>().notNull(),
    safetyNotes: jsonb("safety_notes").$type<SafetyNote[]>().notNull().default([]),
    /** Bumped whenever the declaration or notes change; buyers acknowledge a given revision. */
    sheetRevision: integer("sheet_revision").notNull().default(1),
    state: listingStateEnum("state").notNull().default("draft"),
    /** Policy revision and outcome of the last check (at submission, approval or a re-check). */
    policyRevision: integer("policy_revision"),
    policyStatus: text("policy_status"),
    /** Derived for matching magnetics to kits' requirements (SI). */
    inductanceH: doublePrecision("inductance_h"),
    ratedCurrentA: doublePrecision("rated_current_a"),
    mainsConnected: boolean("mains_connected").generatedAlwaysAs(sql`((declaration->>'mainsConnected')::boolean)`),
    moderatorMessage: text("moderator_message"),
    /** Set by a policy re-check: the listing is held when the grace period runs out. */
    graceUntil: timestamp("grace_until", { withTimezone: true }),
    submittedAt: timestamp("submitted_at", { withTimezone: true }),
    liveAt: timestamp("live_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("listings_seller_idx").on(t.sellerId),
    index("listings_state_idx").on(t.state, t.submittedAt),
    index("listings_catalog_idx").on(t.state, t.kind, t.priceMinor),
    uniqueIndex("listings_slug_idx").on(t.slug),
    check("listings_stock_non_negative", sql`${t.stock} >= 0`),
    check("listings_price_non_negative", sql`${t.priceMinor} >= 0`),
    check("listings_subtype_only_for_magnetics", sql`(${t.kind} = 'magnetic') = (${t.magneticSubtype} is not null)`),
  ],
);

export const listingPhotos = pgTable(
  "listing_photos",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    listingId: uuid("listing_id")
      .notNull()
      .references(() => listings.id, { onDelete: "cascade" }),
    uploadKey: text("upload_key")
      .notNull()
      .references(() => uploads.key, { onDelete: "restrict" }),
    position: integer("position").notNull(),
    alt: text("alt").notNull().default(""),
  },
  (t) => [uniqueIndex("listing_photos_position_idx").on(t.listingId, t.position), index("listing_photos_upload_idx").on(t.uploadKey)],
);

export const listingDocuments = pgTable(
  "listing_documents",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    listingId: uuid("listing_id")
      .notNull()
      .references(() => listings.id, { onDelete: "cascade" }),
    uploadKey: text("upload_key")
      .notNull()
      .references(() => uploads.key, { onDelete: "restrict" }),
    kind: documentKindEnum("kind").notNull(),
    title: text("title").notNull(),
    position: integer("position").notNull().default(0),
  },
  (t) => [index("listing_documents_listing_idx").on(t.listingId), index("listing_documents_upload_idx").on(t.uploadKey)],
);

/** A kit's bring-up checkpoints: what a builder measures at each stage, and the expected range. */
export const listingCheckpoints = pgTable(
  "listing_checkpoints",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    listingId: uuid("listing_id")
      .notNull()
      .references(() => listings.id, { onDelete: "cascade" }),
    position: integer("position").notNull(),
    stage: bringUpStageEnum("stage").notNull(),
    name: text("name").notNull(),
    measure: text("measure").notNull(),
    unit: text("unit").notNull(),
    expectedMin: doublePrecision("expected_min").notNull(),
    expectedMax: doublePrecision("expected_max").notNull(),
  },
  (t) => [index("listing_checkpoints_listing_idx").on(t.listingId, t.position), check("checkpoint_range", sql`${t.expectedMin} <= ${t.expectedMax}`)],
);

/** What a kit needs of a magnetic, e.g. an output choke of at least 40 µH at 120 A. */
export const listingRequirements = pgTable(
  "listing_requirements",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    listingId: uuid("listing_id")
      .notNull()
      .references(() => listings.id, { onDelete: "cascade" }),
    subtype: magneticSubtypeEnum("subtype").notNull(),
    label: text("label").notNull(),
    minInductanceH: doublePrecision("min_inductance_h"),
    atCurrentA: doublePrecision("at_current_a"),
  },
  (t) => [index("listing_requirements_listing_idx").on(t.listingId), index("listing_requirements_match_idx").on(t.subtype)],
);

/** The content a moderator approved, kept so a re-submission can be shown as a diff. */
export const listingVersions = pgTable(
  "listing_versions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    listingId: uuid("listing_id")
      .notNull()
      .references(() => listings.id, { onDelete: "cascade" }),
    snapshot: jsonb("snapshot").$type<Record<string, unknown>>().notNull(),
    approvedBy: text("approved_by").references(() => users.id, { onDelete: "set null" }),
    approvedAt: timestamp("approved_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("listing_versions_listing_idx").on(t.listingId, t.approvedAt)],
);

export const listingsRelations = relations(listings, ({ one, many }) => ({
  seller: one(users, { fields: [listings.sellerId], references: [users.id] }),
  photos: many(listingPhotos),
  documents: many(listingDocuments),
  checkpoints: many(listingCheckpoints),
  requirements: many(listingRequirements),
  versions: many(listingVersions),
}));

export const listingPhotosRelations = relations(listingPhotos, ({ one }) => ({
  listing: one(listings, { fields: [listingPhotos.listingId], references: [listings.id] }),
  upload: one(uploads, { fields: [listingPhotos.uploadKey], references: [uploads.key] }),
}));

export const listingDocumentsRelations = relations(listingDocuments, ({ one }) => ({
  listing: one(listings, { fields: [listingDocuments.listingId], references: [listings.id] }),
  upload: one(uploads, { fields: [listingDocuments.uploadKey], references: [uploads.key] }),
}));

export const listingCheckpointsRelations = relations(listingCheckpoints, ({ one }) => ({
  listing: one(listings, { fields: [listingCheckpoints.listingId], references: [listings.id] }),
}));

export const listingRequirementsRelations = relations(listingRequirements, ({ one }) => ({
  listing: one(listings, { fields: [listingRequirements.listingId], references: [listings.id] }),
}));

export const listingVersionsRelations = relations(listingVersions, ({ one }) => ({
  listing: one(listings, { fields: [listingVersions.listingId], references: [listings.id] }),
}));

export type Listing = typeof listings.$inferSelect;
export type ListingCheckpoint = typeof listingCheckpoints.$inferSelect;
export type ListingRequirement = typeof listingRequirements.$inferSelect;
