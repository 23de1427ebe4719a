import { relations, sql } from "drizzle-orm";
import { check, index, integer, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { users } from "./users";
import { listings } from "./listings";
import { uploads } from "./uploads";
import { bringUpLogs } from "./bench";

/** pending: waits in pre-moderation; visible; hidden: flagged enough, waiting for a moderator; removed. */
export const POST_STATES = ["pending", "visible", "hidden", "removed"] as const;
export type PostState = (typeof POST_STATES)[number];
export const postStateEnum = pgEnum("post_state", POST_STATES);
export const POST_KINDS = ["question", "answer"] as const;
export const postKindEnum = pgEnum("post_kind", POST_KINDS);

export const questions = pgTable(
  "questions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    authorId: text("author_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    listingId: uuid("listing_id").references(() => listings.id, { onDelete: "set null" }),
    logId: uuid("log_id").references(() => bringUpLogs.id, { onDelete: "set null" }),
    title: text("title").notNull(),
    bodyMd: text("body_md").notNull(),
    state: postStateEnum("state").notNull().default("pending"),
    acceptedAnswerId: uuid("accepted_answer_id"),
    removalReason: text("removal_reason"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("questions_state_idx").on(t.state, t.createdAt), index("questions_listing_idx").on(t.listingId), index("questions_author_idx").on(t.authorId)],
);

export const answers = pgTable(
  "answers",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    questionId: uuid("question_id")
      .notNull()
      .references(() => questions.id, { onDelete: "cascade" }),
    authorId: text("author_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    bodyMd: text("body_md").notNull(),
    state: postStateEnum("state").notNull().default("pending"),
    score: integer("score").notNull().default(0),
    removalReason: text("removal_reason"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("answers_question_idx").on(t.questionId, t.state), index("answers_author_idx").on(t.authorId)],
);

export const postPhotos = pgTable(
  "post_photos",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    postKind: postKindEnum("post_kind").notNull(),
    postId: uuid("post_id").notNull(),
    uploadKey: text("upload_key")
      .notNull()
      .references(() => uploads.key, { onDelete: "restrict" }),
    position: integer("position").notNull().default(0),
  },
  (t) => [index("post_photos_post_idx").on(t.postKind, t.postId)],
);

export const answerVotes = pgTable(
  "answer_votes",
  {
    answerId: uuid("answer_id")
      .notNull()
      .references(() => answers.id, { onDelete: "cascade" }),
    voterId: text("voter_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    value: integer("value").notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.answerId, t.voterId] }), check("vote_value", sql`${t.value} in (-1, 1)`)],
);

export const postFlags = pgTable(
  "post_flags",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    postKind: postKindEnum("post_kind").notNull(),
    postId: uuid("post_id").notNull(),
    flaggerId: text("flagger_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    reason: text("reason").notNull(),
    resolvedAt: timestamp("resolved_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("post_flags_once_idx").on(t.postKind, t.postId, t.flaggerId), index("post_flags_open_idx").on(t.resolvedAt, t.createdAt)],
);

/** Fixed-window counters for rate limits, shared by every app instance. */
export const rateLimits = pgTable(
  "rate_limits",
  {
    key: text("key").notNull(),
    windowStart: timestamp("window_start", { withTimezone: true }).notNull(),
    count: integer("count").notNull().default(0),
  },
  (t) => [primaryKey({ columns: [t.key, t.windowStart] })],
);

export const questionsRelations = relations(questions, ({ one, many }) => ({
  author: one(users, { fields: [questions.authorId], references: [users.id] }),
  listing: one(listings, { fields: [questions.listingId], references: [listings.id] }),
  log: one(bringUpLogs, { fields: [questions.logId], references: [bringUpLogs.id] }),
  answers: many(answers),
}));

export const answersRelations = relations(answers, ({ one }) => ({
  question: one(questions, { fields: [answers.questionId], references: [questions.id] }),
  author: one(users, { fields: [answers.authorId], references: [users.id] }),
}));

export type Question = typeof questions.$inferSelect;
export type Answer = typeof answers.$inferSelect;
