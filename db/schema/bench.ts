import { relations, sql } from "drizzle-orm";
import { boolean, check, doublePrecision, index, integer, pgEnum, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { users } from "./users";
import { listings, bringUpStageEnum, listingCheckpoints } from "./listings";
import { uploads } from "./uploads";

export const READING_VERDICTS = ["within", "low", "high"] as const;
export type ReadingVerdict = (typeof READING_VERDICTS)[number];
export const readingVerdictEnum = pgEnum("reading_verdict", READING_VERDICTS);
export const LOG_VISIBILITIES = ["private", "public"] as const;
export const logVisibilityEnum = pgEnum("log_visibility", LOG_VISIBILITIES);

/** A builder's bring-up log: for a kit they bought (its checkpoints copied in) or a build of their own. */
export const bringUpLogs = pgTable(
  "bring_up_logs",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    ownerId: text("owner_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    kitListingId: uuid("kit_listing_id").references(() => listings.id, { onDelete: "set null" }),
    title: text("title").notNull(),
    notesMd: text("notes_md").notNull().default(""),
    visibility: logVisibilityEnum("visibility").notNull().default("private"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("bring_up_logs_owner_idx").on(t.ownerId, t.updatedAt), index("bring_up_logs_kit_idx").on(t.kitListingId)],
);

/** The log's own checkpoints: copied from the kit (sourceCheckpointId) or added by the builder. */
export const logCheckpoints = pgTable(
  "log_checkpoints",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    logId: uuid("log_id")
      .notNull()
      .references(() => bringUpLogs.id, { onDelete: "cascade" }),
    sourceCheckpointId: uuid("source_checkpoint_id").references(() => listingCheckpoints.id, { onDelete: "set null" }),
    position: integer("position").notNull(),
    stage: bringUpStageEnum("stage").notNull(),
    name: text("name").notNull(),
    measure: text("measure").notNull(),
    unit: text("unit").notNull(),
    expectedMin: doublePrecision("expected_min").notNull(),
    expectedMax: doublePrecision("expected_max").notNull(),
    addedByBuilder: boolean("added_by_builder").notNull().default(false),
  },
  (t) => [index("log_checkpoints_log_idx").on(t.logId, t.position), check("log_checkpoint_range", sql`${t.expectedMin} <= ${t.expectedMax}`)],
);

/** One measurement at a checkpoint, in the checkpoint's unit, with the verdict against its range. */
export const readings = pgTable(
  "readings",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    logId: uuid("log_id")
      .notNull()
      .references(() => bringUpLogs.id, { onDelete: "cascade" }),
    checkpointId: uuid("checkpoint_id")
      .notNull()
      .references(() => logCheckpoints.id, { onDelete: "cascade" }),
    value: doublePrecision("value").notNull(),
    /** as the builder typed it, before conversion to the checkpoint's unit */
    enteredValue: doublePrecision("entered_value").notNull(),
    enteredUnit: text("entered_unit").notNull(),
    verdict: readingVerdictEnum("verdict").notNull(),
    farOutside: boolean("far_outside").notNull().default(false),
    instrument: text("instrument").notNull().default(""),
    note: text("note").notNull().default(""),
    takenAt: timestamp("taken_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("readings_log_idx").on(t.logId, t.takenAt), index("readings_checkpoint_idx").on(t.checkpointId)],
);

export const readingPhotos = pgTable(
  "reading_photos",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    readingId: uuid("reading_id")
      .notNull()
      .references(() => readings.id, { onDelete: "cascade" }),
    uploadKey: text("upload_key")
      .notNull()
      .references(() => uploads.key, { onDelete: "restrict" }),
    position: integer("position").notNull().default(0),
    caption: text("caption").notNull().default(""),
  },
  (t) => [index("reading_photos_reading_idx").on(t.readingId), index("reading_photos_upload_idx").on(t.uploadKey)],
);

export const bringUpLogsRelations = relations(bringUpLogs, ({ one, many }) => ({
  owner: one(users, { fields: [bringUpLogs.ownerId], references: [users.id] }),
  kit: one(listings, { fields: [bringUpLogs.kitListingId], references: [listings.id] }),
  checkpoints: many(logCheckpoints),
  readings: many(readings),
}));

export const logCheckpointsRelations = relations(logCheckpoints, ({ one, many }) => ({
  log: one(bringUpLogs, { fields: [logCheckpoints.logId], references: [bringUpLogs.id] }),
  readings: many(readings),
}));

export const readingsRelations = relations(readings, ({ one, many }) => ({
  log: one(bringUpLogs, { fields: [readings.logId], references: [bringUpLogs.id] }),
  checkpoint: one(logCheckpoints, { fields: [readings.checkpointId], references: [logCheckpoints.id] }),
  photos: many(readingPhotos),
}));

export type BringUpLog = typeof bringUpLogs.$inferSelect;
export type LogCheckpoint = typeof logCheckpoints.$inferSelect;
export type Reading = typeof readings.$inferSelect;
