import { relations } from "drizzle-orm";
import { boolean, index, integer, pgEnum, pgTable, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { users } from "./users";

export const APPLICATION_STATUSES = ["pending", "approved", "declined"] as const;
export const applicationStatusEnum = pgEnum("application_status", APPLICATION_STATUSES);

export const sellerApplications = pgTable(
  "seller_applications",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    shopName: text("shop_name").notNull(),
    profileMd: text("profile_md").notNull(),
    country: text("country").notNull(),
    returnsPolicyMd: text("returns_policy_md").notNull(),
    returnsWindowDays: integer("returns_window_days").notNull().default(30),
    status: applicationStatusEnum("status").notNull().default("pending"),
    decidedBy: text("decided_by").references(() => users.id, { onDelete: "set null" }),
    decidedAt: timestamp("decided_at", { withTimezone: true }),
    decisionReason: text("decision_reason"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("seller_applications_user_idx").on(t.userId), index("seller_applications_status_idx").on(t.status, t.createdAt)],
);

/** One shop per seller, created when an application is approved. */
export const sellerProfiles = pgTable(
  "seller_profiles",
  {
    userId: text("user_id")
      .primaryKey()
      .references(() => users.id, { onDelete: "cascade" }),
    shopName: text("shop_name").notNull().unique(),
    slug: text("slug").notNull().unique(),
    profileMd: text("profile_md").notNull(),
    country: text("country").notNull(),
    returnsPolicyMd: text("returns_policy_md").notNull(),
    returnsWindowDays: integer("returns_window_days").notNull().default(30),
    payoutAccountId: text("payout_account_id").unique(),
    payoutsEnabled: boolean("payouts_enabled").notNull().default(false),
    chargesEnabled: boolean("charges_enabled").notNull().default(false),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
);

export const sellerApplicationsRelations = relations(sellerApplications, ({ one }) => ({
  user: one(users, { fields: [sellerApplications.userId], references: [users.id] }),
}));

export const sellerProfilesRelations = relations(sellerProfiles, ({ one }) => ({
  user: one(users, { fields: [sellerProfiles.userId], references: [users.id] }),
}));

export type SellerApplication = typeof sellerApplications.$inferSelect;
export type SellerProfile = typeof sellerProfiles.$inferSelect;
