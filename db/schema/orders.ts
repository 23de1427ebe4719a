import { relations, sql } from "drizzle-orm";
import { check, index, integer, jsonb, pgEnum, pgTable, primaryKey, text, timestamp, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { users } from "./users";
import { listings } from "./listings";

export const ORDER_STATES = ["awaiting_payment", "paid", "shipped", "delivered", "refunded", "cancelled"] as const;
export const CHECKOUT_STATUSES = ["open", "paid", "expired", "failed"] as const;
export const RESERVATION_STATUSES = ["held", "committed", "released"] as const;
export const RETURN_STATUSES = ["requested", "accepted", "declined"] as const;

export type OrderState = (typeof ORDER_STATES)[number];
export const orderStateEnum = pgEnum("order_state", ORDER_STATES);
export const checkoutStatusEnum = pgEnum("checkout_status", CHECKOUT_STATUSES);
export const reservationStatusEnum = pgEnum("reservation_status", RESERVATION_STATUSES);
export const returnStatusEnum = pgEnum("return_status", RETURN_STATUSES);

/** The platform's settings; one row (id 1). The fee is in basis points (800 = 8 %). */
export const platformSettings = pgTable(
  "platform_settings",
  {
    id: integer("id").primaryKey().default(1),
    feeBps: integer("fee_bps").notNull().default(800),
    updatedBy: text("updated_by").references(() => users.id, { onDelete: "set null" }),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [check("platform_settings_single_row", sql`${t.id} = 1`), check("platform_fee_range", sql`${t.feeBps} between 0 and 5000`)],
);

/** A cart belongs to a member, or to a visitor through a random token in a cookie. */
export const carts = pgTable(
  "carts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    userId: text("user_id").references(() => users.id, { onDelete: "cascade" }),
    token: text("token"),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("carts_user_idx").on(t.userId), uniqueIndex("carts_token_idx").on(t.token), check("carts_owner", sql`${t.userId} is not null or ${t.token} is not null`)],
);

export const cartItems = pgTable(
  "cart_items",
  {
    cartId: uuid("cart_id")
      .notNull()
      .references(() => carts.id, { onDelete: "cascade" }),
    listingId: uuid("listing_id")
      .notNull()
      .references(() => listings.id, { onDelete: "cascade" }),
    quantity: integer("quantity").notNull(),
    addedAt: timestamp("added_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.cartId, t.listingId] }), index("cart_items_listing_idx").on(t.listingId), check("cart_quantity_positive", sql`${t.quantity} > 0`)],
);

/** One payment: a buyer's checkout across one or more sellers. */
export const checkouts = pgTable(
  "checkouts",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    buyerId: text("buyer_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    email: text("email").notNull(),
    currency: text("currency").notNull(),
    totalMinor: integer("total_minor").notNull(),
    feeBps: integer("fee_bps").notNull(),
    status: checkoutStatusEnum("status").notNull().default("open"),
    sessionId: text("session_id").unique(),
    paymentIntentId: text("payment_intent_id"),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    paidAt: timestamp("paid_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("checkouts_buyer_idx").on(t.buyerId, t.createdAt), index("checkouts_open_idx").on(t.status, t.expiresAt)],
);

/** A seller's part of a checkout: shipped, refunded and cancelled on its own. */
export const orders = pgTable(
  "orders",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    number: text("number").notNull().unique(),
    checkoutId: uuid("checkout_id")
      .notNull()
      .references(() => checkouts.id, { onDelete: "restrict" }),
    buyerId: text("buyer_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    sellerId: text("seller_id")
      .notNull()
      .references(() => users.id, { onDelete: "restrict" }),
    state: orderStateEnum("state").notNull().default("awaiting_payment"),
    currency: text("currency").notNull(),
    subtotalMinor: integer("subtotal_minor").notNull(),
    feeMinor: integer("fee_minor").notNull(),
    sellerShareMinor: integer("seller_share_minor").notNull(),
    refundedMinor: integer("refunded_minor").notNull().default(0),
    transferId: text("transfer_id"),
    carrier: text("carrier"),
    trackingRef: text("tracking_ref"),
    paidAt: timestamp("paid_at", { withTimezone: true }),
    shippedAt: timestamp("shipped_at", { withTimezone: true }),
    deliveredAt: timestamp("delivered_at", { withTimezone: true }),
    cancelledAt: timestamp("cancelled_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp("updated_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [
    index("orders_checkout_idx").on(t.checkoutId),
    index("orders_buyer_idx").on(t.buyerId, t.createdAt),
    index("orders_seller_idx").on(t.sellerId, t.state, t.createdAt),
    check("orders_refund_within_total", sql`${t.refundedMinor} >= 0 and ${t.refundedMinor} <= ${t.subtotalMinor}`),
    check("orders_split", sql`${t.feeMinor} + ${t.sellerShareMinor} = ${t.subtotalMinor}`),
  ],
);

export const orderLines = pgTable(
  "order_lines",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    orderId: uuid("order_id")
      .notNull()
      .references(() => orders.id, { onDelete: "cascade" }),
    listingId: uuid("listing_id")
      .notNull()
      .references(() => listings.id, { onDelete: "restrict" }),
    title: text("title").notNull(),
    unitPriceMinor: integer("unit_price_minor").notNull(),
    quantity: integer("quantity").notNull(),
    refundedMinor: integer("refunded_minor").notNull().default(0),
    sheetRevision: integer("sheet_revision").notNull(),
  },
  (t) => [index("order_lines_order_idx").on(t.orderId), index("order_lines_listing_idx").on(t.listingId), check("order_line_quantity", sql`${t.quantity} > 0`)],
);

/** The buyer's acknowledgement of a mains-connected item's safety sheet, at the revision they read. */
export const orderAcknowledgements = pgTable(
  "order_acknowledgements",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    checkoutId: uuid("checkout_id")
      .notNull()
      .references(() => checkouts.id, { onDelete: "cascade" }),
    listingId: uuid("listing_id")
      .notNull()
      .references(() => listings.id, { onDelete: "restrict" }),
    sheetRevision: integer("sheet_revision").notNull(),
    policyRevision: integer("policy_revision").notNull(),
    hazards: jsonb("hazards").$type<string[]>().notNull(),
    acknowledgedAt: timestamp("acknowledged_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [uniqueIndex("order_ack_unique").on(t.checkoutId, t.listingId)],
);

/** Stock held for an open checkout; committed when paid, released when it expires or fails. */
export const stockReservations = pgTable(
  "stock_reservations",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    checkoutId: uuid("checkout_id")
      .notNull()
      .references(() => checkouts.id, { onDelete: "cascade" }),
    listingId: uuid("listing_id")
      .notNull()
      .references(() => listings.id, { onDelete: "restrict" }),
    quantity: integer("quantity").notNull(),
    status: reservationStatusEnum("status").notNull().default("held"),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("stock_reservations_checkout_idx").on(t.checkoutId), index("stock_reservations_held_idx").on(t.status, t.expiresAt)],
);

/** Every verified webhook event, by the provider's id: processed exactly once. */
export const paymentEvents = pgTable("payment_events", {
  id: text("id").primaryKey(),
  type: text("type").notNull(),
  objectId: text("object_id"),
  createdAtProvider: timestamp("created_at_provider", { withTimezone: true }),
  receivedAt: timestamp("received_at", { withTimezone: true }).notNull().defaultNow(),
  outcome: text("outcome"),
  payload: jsonb("payload").$type<Record<string, unknown>>().notNull(),
});

export const refunds = pgTable(
  "refunds",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    orderId: uuid("order_id")
      .notNull()
      .references(() => orders.id, { onDelete: "restrict" }),
    orderLineId: uuid("order_line_id").references(() => orderLines.id, { onDelete: "restrict" }),
    amountMinor: integer("amount_minor").notNull(),
    providerRefundId: text("provider_refund_id").unique(),
    reason: text("reason").notNull(),
    actorId: text("actor_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("refunds_order_idx").on(t.orderId), check("refund_positive", sql`${t.amountMinor} > 0`)],
);

export const returnRequests = pgTable(
  "return_requests",
  {
    id: uuid("id").primaryKey().defaultRandom(),
    orderId: uuid("order_id")
      .notNull()
      .references(() => orders.id, { onDelete: "cascade" }),
    reason: text("reason").notNull(),
    status: returnStatusEnum("status").notNull().default("requested"),
    decisionReason: text("decision_reason"),
    decidedAt: timestamp("decided_at", { withTimezone: true }),
    createdAt: timestamp("created_at", { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index("return_requests_order_idx").on(t.orderId)],
);

export const checkoutsRelations = relations(checkouts, ({ many, one }) => ({
  orders: many(orders),
  buyer: one(users, { fields: [checkouts.buyerId], references: [users.id] }),
  acknowledgements: many(orderAcknowledgements),
  reservations: many(stockReservations),
}));

export const ordersRelations = relations(orders, ({ one, many }) => ({
  checkout: one(checkouts, { fields: [orders.checkoutId], references: [checkouts.id] }),
  lines: many(orderLines),
  refunds: many(refunds),
  returns: many(returnRequests),
}));

export const orderLinesRelations = relations(orderLines, ({ one }) => ({
  order: one(orders, { fields: [orderLines.orderId], references: [orders.id] }),
  listing: one(listings, { fields: [orderLines.listingId], references: [listings.id] }),
}));

export type Order = typeof orders.$inferSelect;
export type Checkout = typeof checkouts.$inferSelect;
export type OrderLine = typeof orderLines.$inferSelect;
