// Every route handler under app/api, and how the fuzz reaches it. route-inventory.test.ts reads the
// route files on disk and fails when one (or one of its methods) is missing here, so a new JSON API
// cannot go unfuzzed by accident.
import type { z } from "zod";
import { roleChangeSchema, userSearchSchema } from "@/lib/validations/admin";
import { addToCartSchema, removeFromCartSchema, setCartQuantitySchema } from "@/lib/validations/cart";
import { stockUpdateSchema } from "@/lib/validations/listings";
import {
  approveListingSchema,
  declineApplicationSchema,
  holdListingSchema,
  publishPolicySchema,
  restoreListingSchema,
  sendBackListingSchema,
} from "@/lib/validations/moderation";
import { declineReturnSchema, lineRefundSchema, returnRequestSchema, shipOrderSchema } from "@/lib/validations/orders";
import { acceptAnswerSchema, answerSchema, askQuestionSchema, approvePostSchema, flagPostSchema, removePostSchema, restorePostSchema, voteSchema } from "@/lib/validations/qa";
import { ADMIN, BUYER, MODERATOR, OTHER_MEMBER, SELLER, type Fixtures } from "./world";

export type Method = "GET" | "POST" | "PATCH" | "DELETE";

/** A route that takes a JSON body. */
export type BodyTarget = {
  /** The route file under app/api. */
  file: string;
  method: Method;
  /** Who asks: the role (and owner) that reaches the input parsing. */
  as: string | null;
  params?: (ids: Fixtures) => Record<string, string>;
  /** Path parameters also fuzzed with ids of nothing (with a valid body, so the lookup is reached). */
  fuzzParams?: readonly string[];
  /** A valid body; absent for routes that take none (only malformed text is sent to those). */
  example?: (ids: Fixtures) => Record<string, unknown>;
  /** The route's own schema; a generated body it would accept is never sent. */
  schema?: z.ZodType;
};

/** A GET route that reads query parameters or a path id. */
export type QueryTarget = {
  file: string;
  as: string | null;
  keys: readonly string[];
  params?: (ids: Fixtures) => Record<string, string>;
  fuzzParams?: readonly string[];
};

/** Routes with no input worth fuzzing, or that are fuzzed elsewhere, with the reason. */
export type OtherRoute = { file: string; methods: readonly Method[]; why: string };

const NO_CAPTURE = "00000000-0000-4000-8000-00000000c0de";

const listing = (key: keyof Fixtures) => (ids: Fixtures) => ({ id: ids[key] });

export const BODY_TARGETS: readonly BodyTarget[] = [
  // The cart belongs to the cookie or the member; any visitor may post.
  { file: "cart/route.ts", method: "POST", as: null, schema: addToCartSchema, example: (ids) => ({ listingId: ids.liveListing, quantity: 1 }) },
  { file: "cart/route.ts", method: "PATCH", as: BUYER, schema: setCartQuantitySchema, example: (ids) => ({ listingId: ids.liveListing, quantity: 2 }) },
  { file: "cart/route.ts", method: "DELETE", as: BUYER, schema: removeFromCartSchema, example: (ids) => ({ listingId: ids.liveListing }) },

  { file: "sell/listings/[id]/stock/route.ts", method: "PATCH", as: SELLER, params: listing("sellersListing"), fuzzParams: ["id"], schema: stockUpdateSchema, example: () => ({ stock: 7 }) },

  {
    file: "admin/policy/route.ts",
    method: "POST",
    as: ADMIN,
    schema: publishPolicySchema,
    example: () => ({ summary: "Tighter wait times after switch-off.", minWords: 40, topicMinWords: {}, safeVoltageV: 60, storedChargeThresholdMicroC: 45, waitMarginFactor: 2, graceDays: 14 }),
  },
  { file: "admin/users/[id]/roles/route.ts", method: "POST", as: ADMIN, params: () => ({ id: "fuzz-applicant" }), fuzzParams: ["id"], schema: roleChangeSchema, example: () => ({ role: "reviewer", grant: true }) },

  { file: "moderation/listings/[id]/approve/route.ts", method: "POST", as: MODERATOR, params: listing("inReviewListing"), fuzzParams: ["id"], schema: approveListingSchema, example: () => ({ note: "Sheet reads well." }) },
  {
    file: "moderation/listings/[id]/send-back/route.ts",
    method: "POST",
    as: MODERATOR,
    params: listing("inReviewListing"),
    fuzzParams: ["id"],
    schema: sendBackListingSchema,
    example: () => ({ reasons: [{ topic: "general", text: "The photos show another board." }] }),
  },
  { file: "moderation/listings/[id]/hold/route.ts", method: "POST", as: MODERATOR, params: listing("liveListing"), fuzzParams: ["id"], schema: holdListingSchema, example: () => ({ reason: "Held while a report is checked." }) },
  { file: "moderation/listings/[id]/restore/route.ts", method: "POST", as: MODERATOR, params: listing("heldListing"), fuzzParams: ["id"], schema: restoreListingSchema, example: () => ({ note: "Report cleared." }) },
  // Approving an application takes no body.
  { file: "moderation/applications/[id]/approve/route.ts", method: "POST", as: MODERATOR, params: (ids) => ({ id: ids.pendingApplication }), fuzzParams: ["id"] },
  {
    file: "moderation/applications/[id]/decline/route.ts",
    method: "POST",
    as: MODERATOR,
    params: (ids) => ({ id: ids.pendingApplication }),
    fuzzParams: ["id"],
    schema: declineApplicationSchema,
    example: () => ({ reason: "The profile names no workshop." }),
  },

  { file: "orders/[id]/ship/route.ts", method: "POST", as: SELLER, params: (ids) => ({ id: ids.paidOrder }), fuzzParams: ["id"], schema: shipOrderSchema, example: () => ({ carrier: "Yard Post", trackingRef: "YP-12345" }) },
  {
    file: "orders/[id]/refunds/route.ts",
    method: "POST",
    as: SELLER,
    params: (ids) => ({ id: ids.paidOrder }),
    fuzzParams: ["id"],
    schema: lineRefundSchema("EUR"),
    example: (ids) => ({ lineId: ids.paidOrderLine, amount: "1.50", reason: "Part of the kit was missing." }),
  },
  { file: "orders/[id]/returns/route.ts", method: "POST", as: BUYER, params: (ids) => ({ id: ids.deliveredOrder }), fuzzParams: ["id"], schema: returnRequestSchema, example: () => ({ reason: "The board arrived with a cracked corner." }) },
  {
    file: "orders/[id]/returns/[returnId]/decline/route.ts",
    method: "POST",
    as: SELLER,
    params: (ids) => ({ id: ids.deliveredOrder, returnId: ids.openReturn }),
    fuzzParams: ["id", "returnId"],
    schema: declineReturnSchema,
    example: () => ({ reason: "The board was used and is outside the terms." }),
  },
  // These three act on the order alone; a body is ignored, so only text that is not JSON is sent.
  { file: "orders/[id]/cancel/route.ts", method: "POST", as: SELLER, params: (ids) => ({ id: ids.paidOrder }), fuzzParams: ["id"] },
  { file: "orders/[id]/deliver/route.ts", method: "POST", as: BUYER, params: (ids) => ({ id: ids.paidOrder }), fuzzParams: ["id"] },
  { file: "orders/[id]/returns/[returnId]/accept/route.ts", method: "POST", as: SELLER, params: (ids) => ({ id: ids.deliveredOrder, returnId: ids.openReturn }), fuzzParams: ["id", "returnId"] },

  { file: "questions/route.ts", method: "POST", as: BUYER, schema: askQuestionSchema, example: () => ({ title: "Bus sits low through the lamp", bodyMd: "With the lamp in series the bus reads 305 V instead of 325 V." }) },
  { file: "questions/[id]/answers/route.ts", method: "POST", as: SELLER, params: (ids) => ({ id: ids.question }), fuzzParams: ["id"], schema: answerSchema, example: () => ({ bodyMd: "The lamp drops some voltage while the capacitors charge." }) },
  { file: "questions/[id]/accept/route.ts", method: "POST", as: BUYER, params: (ids) => ({ id: ids.question }), fuzzParams: ["id"], schema: acceptAnswerSchema, example: (ids) => ({ answerId: ids.answer }) },
  { file: "posts/[kind]/[id]/vote/route.ts", method: "POST", as: BUYER, params: (ids) => ({ kind: "answer", id: ids.answer }), fuzzParams: ["kind", "id"], schema: voteSchema, example: () => ({ value: 1 }) },
  { file: "posts/[kind]/[id]/flag/route.ts", method: "POST", as: SELLER, params: (ids) => ({ kind: "answer", id: ids.answer }), fuzzParams: ["kind", "id"], schema: flagPostSchema, example: () => ({ reason: "Advice that skips the discharge." }) },
  { file: "posts/[kind]/[id]/remove/route.ts", method: "POST", as: MODERATOR, params: (ids) => ({ kind: "answer", id: ids.answer }), fuzzParams: ["kind", "id"], schema: removePostSchema, example: () => ({ reason: "Unsafe advice about discharging." }) },
  // Approve and restore take an empty object; anything that is not one is refused.
  { file: "posts/[kind]/[id]/approve/route.ts", method: "POST", as: MODERATOR, params: (ids) => ({ kind: "question", id: ids.question }), fuzzParams: ["kind", "id"], schema: approvePostSchema, example: () => ({}) },
  { file: "posts/[kind]/[id]/restore/route.ts", method: "POST", as: MODERATOR, params: (ids) => ({ kind: "answer", id: ids.answer }), fuzzParams: ["kind", "id"], schema: restorePostSchema, example: () => ({}) },
];

export const QUERY_TARGETS: readonly QueryTarget[] = [
  { file: "listings/route.ts", as: null, keys: ["q", "kind", "subtype", "mains", "minPrice", "maxPrice", "inStock", "seller", "sort", "page"] },
  { file: "questions/route.ts", as: null, keys: ["listing", "show", "page"] },
  { file: "questions/[id]/route.ts", as: OTHER_MEMBER, keys: [], params: (ids) => ({ id: ids.question }), fuzzParams: ["id"] },
  { file: "orders/route.ts", as: SELLER, keys: ["as", "state", "sort", "dir", "page"] },
  { file: "orders/[id]/route.ts", as: BUYER, keys: [], params: (ids) => ({ id: ids.paidOrder }), fuzzParams: ["id"] },
  { file: "admin/users/route.ts", as: ADMIN, keys: ["q"] },
  { file: "checkout/status/route.ts", as: BUYER, keys: ["session"] },
  // No capture fixture: the window's parameters are parsed before the lookup, and any id names nothing here.
  { file: "captures/[id]/route.ts", as: BUYER, keys: [], params: () => ({ id: NO_CAPTURE }), fuzzParams: ["id"] },
  { file: "captures/[id]/window/route.ts", as: BUYER, keys: ["from", "to", "points", "channel"], params: () => ({ id: NO_CAPTURE }), fuzzParams: ["id"] },
  // The provider's cancel link: always a redirect back to the cart, whatever it carries.
  { file: "checkout/cancel/route.ts", as: BUYER, keys: ["checkout"] },
];

export const OTHER_ROUTES: readonly OtherRoute[] = [
  { file: "calc/inductor/route.ts", methods: ["POST"], why: "stateless; fuzzed in stateless-bodies.test.ts" },
  { file: "calc/mains/route.ts", methods: ["POST"], why: "stateless; fuzzed in stateless-bodies.test.ts" },
  { file: "calc/transformer/route.ts", methods: ["POST"], why: "stateless; fuzzed in stateless-bodies.test.ts" },
  { file: "calc/welding-output/route.ts", methods: ["POST"], why: "stateless; fuzzed in stateless-bodies.test.ts" },
  { file: "calc/winding/route.ts", methods: ["POST"], why: "stateless; fuzzed in stateless-bodies.test.ts" },
  { file: "policy/check/route.ts", methods: ["POST"], why: "stateless; fuzzed in stateless-bodies.test.ts" },
  { file: "webhooks/payments/route.ts", methods: ["POST"], why: "signed; bad signatures in webhook-signatures.test.ts" },
  { file: "auth/[...nextauth]/route.ts", methods: ["GET", "POST"], why: "Auth.js's own handlers" },
  { file: "uploadthing/route.ts", methods: ["GET", "POST"], why: "the uploadthing SDK's handler; uploads are tested in tests/integration/uploads" },
  { file: "cart/route.ts", methods: ["GET"], why: "no input" },
  { file: "admin/policy/route.ts", methods: ["GET"], why: "no input" },
  { file: "health/route.ts", methods: ["GET"], why: "no input" },
  { file: "session/route.ts", methods: ["GET"], why: "no input; reads only the session cookie" },
  { file: "moderation/queue/route.ts", methods: ["GET"], why: "no input" },
  { file: "posts/queue/route.ts", methods: ["GET"], why: "no input" },
  { file: "payouts/status/route.ts", methods: ["GET"], why: "no input; reads the payment provider" },
];

