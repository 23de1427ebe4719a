import { relations, sql } from "drizzle-orm";
import { boolean, check, customType, doublePrecision, index, integer, jsonb, pgEnum, pgTable, primaryKey, smallint, text, timestamp, uuid } from "drizzle-orm/pg-core";
import type { PulseMeasurement } from "@/lib/engineering/waveform";
import { bringUpLogs, readings } from "./bench";
import { reviewSessions } from "./reviews";
import { uploads } from "./uploads";
import { users } from "./users";

export const CAPTURE_STATES = ["queued", "measuring", "measured", "failed"] as const;
export type CaptureState = (typeof CAPTURE_STATES)[number];
export const captureStateEnum = pgEnum("capture_state", CAPTURE_STATES);

/** PostgreSQL's bytea as a Node Buffer (node-postgres reads and writes Buffers natively). */
const bytea = customType<{ data: Buffer; driverData: Buffer }>({ dataType: () => "bytea" });

/**
 * An oscilloscope capture carried by a reading: the original file (an upload, kept as given),
 * the measurement's progress, and — once the builder confirms it — which figure became the
 * reading's value and what the value was before.
 */
export const captures = pgTable(
  "captures",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    logId: uuid("log_id")
      .notNull()
      .references(() => bringUpLogs.id, { onDelete: "cascade" }),
    readingId: uuid("reading_id")
      .notNull()
      .references(() => readings.id, { onDelete: "cascade" }),
    uploadKey: text("upload_key")
      .notNull()
      .unique()
      .references(() => uploads.key, { onDelete: "restrict" }),
    state: captureStateEnum("state").notNull().default("queued"),
    progress: integer("progress").notNull().default(0),
    /** the parser's or measurement's message, naming the line of a bad file */
    errorMessage: text("error_message"),
    sampleCount: integer("sample_count"),
    startTimeS: doublePrecision("start_time_s"),
    endTimeS: doublePrecision("end_time_s"),
    sampleIntervalS: doublePrecision("sample_interval_s"),
    /** true when sample i sits at start + i · interval, so no time blocks are stored */
    evenlySpaced: boolean("evenly_spaced"),
    measuredAt: timestamp("measured_at", { withTimezone: true }),
    appliedAt: timestamp("applied_at", { withTimezone: true }),
    appliedChannel: integer("applied_channel"),
    appliedFigure: text("applied_figure"),
    appliedValue: doublePrecision("applied_value"),
    valueBefore: doublePrecision("value_before"),
    enteredValueBefore: doublePrecision("entered_value_before"),
    enteredUnitBefore: text("entered_unit_before"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("captures_reading_idx").on(t.readingId),
    index("captures_log_idx").on(t.logId, t.createdAt),
    // The worker's sweep looks for captures whose job never started.
    index("captures_state_idx").on(t.state, t.updatedAt),
    check("capture_progress_range", sql`${t.progress} between 0 and 100`),
  ],
);

/** The figures of one channel of a measured capture, with its value range for the plot's axis. */
export const captureChannels = pgTable(
  "capture_channels",
  {
    captureId: uuid("capture_id")
      .notNull()
      .references(() => captures.id, { onDelete: "cascade" }),
    position: integer("position").notNull(),
    name: text("name").notNull(),
    unit: text("unit"),
    minValue: doublePrecision("min_value").notNull(),
    maxValue: doublePrecision("max_value").notNull(),
    figures: jsonb("figures").$type<PulseMeasurement>().notNull(),
  },
  (t) => [primaryKey({ columns: [t.captureId, t.position] })],
);

/**
 * The parsed samples in fixed blocks, so zooming reads only the blocks a window overlaps (an
 * index range on the primary key) and never parses the CSV again. See lib/captures/blocks.ts for
 * the encoding: series ≥ 0 is a channel as Float32, series −1 the sample times as Float64 (only
 * for captures that are not evenly spaced).
 */
export const captureBlocks = pgTable(
  "capture_blocks",
  {
    captureId: uuid("capture_id")
      .notNull()
      .references(() => captures.id, { onDelete: "cascade" }),
    series: smallint("series").notNull(),
    block: integer("block").notNull(),
    firstIndex: integer("first_index").notNull(),
    sampleCount: integer("sample_count").notNull(),
    firstTimeS: doublePrecision("first_time_s").notNull(),
    lastTimeS: doublePrecision("last_time_s").notNull(),
    data: bytea("data").notNull(),
  },
  (t) => [primaryKey({ columns: [t.captureId, t.series, t.block] })],
);

/** A reviewer's comment pinned to a time (and optionally a channel) of a capture, within their session. */
export const capturePins = pgTable(
  "capture_pins",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    captureId: uuid("capture_id")
      .notNull()
      .references(() => captures.id, { onDelete: "cascade" }),
    sessionId: uuid("session_id")
      .notNull()
      .references(() => reviewSessions.id, { onDelete: "cascade" }),
    authorId: text("author_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    timeS: doublePrecision("time_s").notNull(),
    channel: integer("channel"),
    body: text("body").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("capture_pins_capture_idx").on(t.captureId, t.timeS),
    index("capture_pins_session_idx").on(t.sessionId),
    check("capture_pin_body_length", sql`char_length(${t.body}) between 1 and 2000`),
  ],
);

export const capturesRelations = relations(captures, ({ one, many }) => ({
  log: one(bringUpLogs, { fields: [captures.logId], references: [bringUpLogs.id] }),
  reading: one(readings, { fields: [captures.readingId], references: [readings.id] }),
  upload: one(uploads, { fields: [captures.uploadKey], references: [uploads.key] }),
  channels: many(captureChannels),
  pins: many(capturePins),
}));

export const captureChannelsRelations = relations(captureChannels, ({ one }) => ({
  capture: one(captures, { fields: [captureChannels.captureId], references: [captures.id] }),
}));

export const capturePinsRelations = relations(capturePins, ({ one }) => ({
  capture: one(captures, { fields: [capturePins.captureId], references: [captures.id] }),
  session: one(reviewSessions, { fields: [capturePins.sessionId], references: [reviewSessions.id] }),
  author: one(users, { fields: [capturePins.authorId], references: [users.id] }),
}));

export type Capture = typeof captures.$inferSelect;
export type CaptureChannelRow = typeof captureChannels.$inferSelect;
export type CapturePin = typeof capturePins.$inferSelect;
