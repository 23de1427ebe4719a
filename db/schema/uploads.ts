import { index, integer, pgEnum, pgTable, text, timestamp } from "drizzle-orm/pg-core";
import { users } from "./users";

export const UPLOAD_PURPOSES = ["listing-photo", "listing-document", "reading-photo", "capture"] as const;
export const uploadPurposeEnum = pgEnum("upload_purpose", UPLOAD_PURPOSES);

/**
 * Files that passed the content checks and were stored cleaned (photos re-encoded without metadata).
 * A row belongs to its uploader until a listing (or reading) takes it.
 */
export const uploads = pgTable(
  "uploads",
  {
    key: text("key").primaryKey(),
    ownerId: text("owner_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    purpose: uploadPurposeEnum("purpose").notNull(),
    originalName: text("original_name").notNull(),
    contentType: text("content_type").notNull(),
    bytes: integer("bytes").notNull(),
    url: text("url").notNull(),
    thumbKey: text("thumb_key"),
    thumbUrl: text("thumb_url"),
    width: integer("width"),
    height: integer("height"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("uploads_owner_idx").on(t.ownerId, t.createdAt)],
);

export type Upload = typeof uploads.$inferSelect;
