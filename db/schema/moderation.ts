import { relations } from "drizzle-orm";
import { index, integer, jsonb, pgEnum, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import type { PolicyRevision, SafetyFinding } from "@/lib/policy";
import { users } from "./users";
import { listings } from "./listings";

export const LISTING_DECISIONS = ["submitted", "approved", "sent_back", "held", "restored", "retired", "grace_notice", "grace_expired"] as const;
export type ListingDecisionKind = (typeof LISTING_DECISIONS)[number];
export const listingDecisionEnum = pgEnum("listing_decision", LISTING_DECISIONS);

export type TopicReason = { topic: string; text: string };

/** The moderation history of a listing, as the seller sees it. (The audit log records the same actions.) */
export const listingDecisions = pgTable(
  "listing_decisions",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    listingId: uuid("listing_id")
      .notNull()
      .references(() => listings.id, { onDelete: "cascade" }),
    actorId: text("actor_id").references(() => users.id, { onDelete: "set null" }),
    decision: listingDecisionEnum("decision").notNull(),
    reasons: jsonb("reasons").$type<TopicReason[]>().notNull().default([]),
    note: text("note"),
    policyRevision: integer("policy_revision"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("listing_decisions_listing_idx").on(t.listingId, t.createdAt)],
);

/** Revisions an admin published; revision 1 is the built-in one in lib/policy. */
export const policyRevisions = pgTable("policy_revisions", {
  revision: integer("revision").primaryKey(),
  rules: jsonb("rules").$type<PolicyRevision>().notNull(),
  summary: text("summary").notNull(),
  graceDays: integer("grace_days").notNull().default(14),
  publishedBy: text("published_by").references(() => users.id, { onDelete: "set null" }),
  publishedAt: timestamp("published_at", { withTimezone: true }).notNull().defaultNow(),
});

/** One row per live listing per re-check run: what the new revision found. */
export const policyRecheckResults = pgTable(
  "policy_recheck_results",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    revision: integer("revision")
      .notNull()
      .references(() => policyRevisions.revision, { onDelete: "cascade" }),
    listingId: uuid("listing_id")
      .notNull()
      .references(() => listings.id, { onDelete: "cascade" }),
    status: text("status").notNull(),
    findings: jsonb("findings").$type<SafetyFinding[]>().notNull().default([]),
    graceUntil: timestamp("grace_until", { withTimezone: true }),
    noticeSentAt: timestamp("notice_sent_at", { withTimezone: true }),
    heldAt: timestamp("held_at", { withTimezone: true }),
    resolvedAt: timestamp("resolved_at", { withTimezone: true }),
    checkedAt: timestamp("checked_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("policy_recheck_results_revision_idx").on(t.revision, t.status), index("policy_recheck_results_listing_idx").on(t.listingId)],
);

export const listingDecisionsRelations = relations(listingDecisions, ({ one }) => ({
  listing: one(listings, { fields: [listingDecisions.listingId], references: [listings.id] }),
  actor: one(users, { fields: [listingDecisions.actorId], references: [users.id] }),
}));

export type ListingDecision = typeof listingDecisions.$inferSelect;
export type PolicyRevisionRow = typeof policyRevisions.$inferSelect;
