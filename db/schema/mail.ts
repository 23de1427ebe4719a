import { index, integer, jsonb, pgEnum, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";

export const MAIL_STATUSES = ["pending", "sent", "failed"] as const;
export const mailStatusEnum = pgEnum("mail_status", MAIL_STATUSES);

/**
 * Transactional outbox: a message is written in the same transaction as the change it reports,
 * then delivered by a background job. Its id is the provider's idempotency key, so a retry never
 * sends it twice.
 */
export const mailOutbox = pgTable(
  "mail_outbox",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    template: text("template").notNull(),
    to: text("to").notNull(),
    props: jsonb("props").$type<Record<string, unknown>>().notNull(),
    status: mailStatusEnum("status").notNull().default("pending"),
    attempts: integer("attempts").notNull().default(0),
    lastError: text("last_error"),
    providerId: text("provider_id"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    sentAt: timestamp("sent_at", { withTimezone: true }),
  },
  (t) => [index("mail_outbox_pending_idx").on(t.status, t.createdAt)],
);

export type OutboxMail = typeof mailOutbox.$inferSelect;
