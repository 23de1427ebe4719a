import { relations, sql } from "drizzle-orm";
import { boolean, check, index, integer, jsonb, pgEnum, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { users } from "./users";
import { bringUpLogs, logCheckpoints } from "./bench";
import { applicationStatusEnum } from "./sellers";

export const REVIEW_STATES = ["requested", "accepted", "delivered", "closed", "declined", "expired", "disputed"] as const;
export type ReviewState = (typeof REVIEW_STATES)[number];
export const reviewStateEnum = pgEnum("review_state", REVIEW_STATES);
export const CHECKPOINT_VERDICTS = ["fine", "needs_attention", "stop"] as const;
export type CheckpointVerdict = (typeof CHECKPOINT_VERDICTS)[number];
export const checkpointVerdictEnum = pgEnum("checkpoint_verdict", CHECKPOINT_VERDICTS);
export const DISPUTE_OUTCOMES = ["open", "closed_payment_stands", "refunded_full", "refunded_partial"] as const;
export const disputeOutcomeEnum = pgEnum("dispute_outcome", DISPUTE_OUTCOMES);

export const reviewerApplications = pgTable(
  "reviewer_applications",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    expertise: jsonb("expertise").$type<string[]>().notNull(),
    profileMd: text("profile_md").notNull(),
    trackRecordMd: text("track_record_md").notNull(),
    priceMinor: integer("price_minor").notNull(),
    currency: text("currency").notNull().default("EUR"),
    status: applicationStatusEnum("status").notNull().default("pending"),
    decidedBy: text("decided_by").references(() => users.id, { onDelete: "set null" }),
    decidedAt: timestamp("decided_at", { withTimezone: true }),
    decisionReason: text("decision_reason"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("reviewer_applications_status_idx").on(t.status, t.createdAt), index("reviewer_applications_user_idx").on(t.userId)],
);

export const reviewerProfiles = pgTable("reviewer_profiles", {
  userId: text("user_id")
    .primaryKey()
    .references(() => users.id, { onDelete: "cascade" }),
  expertise: jsonb("expertise").$type<string[]>().notNull(),
  profileMd: text("profile_md").notNull(),
  priceMinor: integer("price_minor").notNull(),
  currency: text("currency").notNull().default("EUR"),
  available: boolean("available").notNull().default(true),
  payoutAccountId: text("payout_account_id").unique(),
  payoutsEnabled: boolean("payouts_enabled").notNull().default(false),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
});

/** A paid review of a bring-up log: authorised at booking, captured on delivery, released on decline or expiry. */
export const reviewSessions = pgTable(
  "review_sessions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    logId: uuid("log_id")
      .notNull()
      .references(() => bringUpLogs.id, { onDelete: "restrict" }),
    builderId: text("builder_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    reviewerId: text("reviewer_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    stages: jsonb("stages").$type<string[]>().notNull(),
    state: reviewStateEnum("state").notNull().default("requested"),
    priceMinor: integer("price_minor").notNull(),
    currency: text("currency").notNull(),
    feeBps: integer("fee_bps").notNull(),
    feeMinor: integer("fee_minor").notNull(),
    reviewerShareMinor: integer("reviewer_share_minor").notNull(),
    paymentIntentId: text("payment_intent_id").unique(),
    capturedAt: timestamp("captured_at", { withTimezone: true }),
    releasedAt: timestamp("released_at", { withTimezone: true }),
    transferId: text("transfer_id"),
    refundedMinor: integer("refunded_minor").notNull().default(0),
    message: text("message").notNull().default(""),
    respondBy: timestamp("respond_by", { withTimezone: true }).notNull(),
    acceptedAt: timestamp("accepted_at", { withTimezone: true }),
    deliveredAt: timestamp("delivered_at", { withTimezone: true }),
    disputeBy: timestamp("dispute_by", { withTimezone: true }),
    closedAt: timestamp("closed_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("review_sessions_builder_idx").on(t.builderId, t.createdAt),
    index("review_sessions_reviewer_idx").on(t.reviewerId, t.state),
    index("review_sessions_due_idx").on(t.state, t.respondBy),
    check("review_not_self", sql`${t.builderId} <> ${t.reviewerId}`),
    check("review_split", sql`${t.feeMinor} + ${t.reviewerShareMinor} = ${t.priceMinor}`),
  ],
);

export const reviewReports = pgTable("review_reports", {
  sessionId: uuid("session_id")
    .primaryKey()
    .references(() => reviewSessions.id, { onDelete: "cascade" }),
  summaryMd: text("summary_md").notNull(),
  createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
});

export const reviewVerdicts = pgTable(
  "review_verdicts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    sessionId: uuid("session_id")
      .notNull()
      .references(() => reviewSessions.id, { onDelete: "cascade" }),
    checkpointId: uuid("checkpoint_id")
      .notNull()
      .references(() => logCheckpoints.id, { onDelete: "cascade" }),
    verdict: checkpointVerdictEnum("verdict").notNull(),
    comment: text("comment").notNull().default(""),
  },
  (t) => [index("review_verdicts_session_idx").on(t.sessionId)],
);

export const reviewDisputes = pgTable(
  "review_disputes",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    sessionId: uuid("session_id")
      .notNull()
      .references(() => reviewSessions.id, { onDelete: "cascade" }),
    reason: text("reason").notNull(),
    outcome: disputeOutcomeEnum("outcome").notNull().default("open"),
    refundMinor: integer("refund_minor"),
    decidedBy: text("decided_by").references(() => users.id, { onDelete: "set null" }),
    decisionNote: text("decision_note"),
    decidedAt: timestamp("decided_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("review_disputes_session_idx").on(t.sessionId), index("review_disputes_open_idx").on(t.outcome, t.createdAt)],
);

export const reviewSessionsRelations = relations(reviewSessions, ({ one, many }) => ({
  log: one(bringUpLogs, { fields: [reviewSessions.logId], references: [bringUpLogs.id] }),
  builder: one(users, { fields: [reviewSessions.builderId], references: [users.id] }),
  reviewer: one(users, { fields: [reviewSessions.reviewerId], references: [users.id] }),
  report: one(reviewReports, { fields: [reviewSessions.id], references: [reviewReports.sessionId] }),
  verdicts: many(reviewVerdicts),
  disputes: many(reviewDisputes),
}));

export type ReviewSession = typeof reviewSessions.$inferSelect;
