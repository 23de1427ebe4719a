/**
 * Shared schemas for what buyers, sellers and admins do with orders. The same schemas parse the
 * forms (server actions) and the JSON bodies of the routes under /api/orders:
 *   POST /api/orders/[id]/ship                              { carrier, trackingRef }
 *   POST /api/orders/[id]/deliver                           {}
 *   POST /api/orders/[id]/cancel                            {}
 *   POST /api/orders/[id]/refunds                           { lineId, amount: "12.50", reason }   (amount in major units)
 *   POST /api/orders/[id]/returns                           { reason }
 *   POST /api/orders/[id]/returns/[returnId]/accept         {}
 *   POST /api/orders/[id]/returns/[returnId]/decline        { reason }
 * and the admin's platform fee form { percent: "8.25" }.
 */
import { z } from "zod";
import { NUL_ERROR, NUL_FREE } from "./text";
import { ORDER_STATES } from "@/db/schema/orders";
import { minorDigits } from "@/lib/format/money";
import { parseMajorUnits, parsePercentToBasisPoints } from "@/lib/orders/amount-input";

export const MAX_FEE_BPS = 5000;

export const shipOrderSchema = z.object({
  carrier: z
    .string({ error: "Name the carrier." })
    .regex(NUL_FREE, NUL_ERROR)
    .trim()
    .min(2, { error: "Name the carrier (two letters at least)." })
    .max(60, { error: "Keep the carrier's name under 60 characters." }),
  trackingRef: z
    .string({ error: "Enter the tracking reference." })
    .regex(NUL_FREE, NUL_ERROR)
    .trim()
    .min(4, { error: "A tracking reference has at least 4 characters." })
    .max(64, { error: "Keep the tracking reference under 64 characters." })
    .regex(/^[A-Za-z0-9][A-Za-z0-9 ./-]*$/, { error: "Use letters, digits, spaces, dots, dashes or slashes, as the carrier prints it." }),
});

export type ShipOrderInput = z.infer<typeof shipOrderSchema>;

const reasonText = (what: string, min: number) =>
  z
    .string({ error: `Say ${what}.` })
    .regex(NUL_FREE, NUL_ERROR)
    .trim()
    .min(min, { error: `Say ${what} (${min} characters at least).` })
    .max(2000, { error: "Keep it under 2000 characters." });

/** A refund of part of a line; the amount is typed in major units of the order's currency and parsed exactly. */
export function lineRefundSchema(currency: string) {
  const digits = minorDigits(currency);
  return z.object({
    lineId: z.uuid({ error: "Pick the line to refund." }),
    amount: z
      .string({ error: "Enter the amount to refund." })
      .regex(NUL_FREE, NUL_ERROR)
      .transform((text, ctx) => {
        const parsed = parseMajorUnits(text, digits);
        if (!parsed.ok) {
          ctx.addIssue({ code: "custom", message: parsed.message });
          return z.NEVER;
        }
        if (parsed.minor <= 0) {
          ctx.addIssue({ code: "custom", message: "The amount must be more than zero." });
          return z.NEVER;
        }
        return parsed.minor;
      }),
    reason: reasonText("why you refund it; the buyer reads this", 3),
  });
}

export type LineRefundInput = z.infer<ReturnType<typeof lineRefundSchema>>;

export const returnRequestSchema = z.object({ reason: reasonText("why you want to return the order", 10) });
export const declineReturnSchema = z.object({ reason: reasonText("why you decline the return; the buyer reads this", 10) });

export const platformFeeSchema = z.object({
  percent: z.string({ error: "Enter the fee as a percentage." }).regex(NUL_FREE, NUL_ERROR).transform((text, ctx) => {
    const parsed = parsePercentToBasisPoints(text);
    if (!parsed.ok) {
      ctx.addIssue({ code: "custom", message: parsed.message });
      return z.NEVER;
    }
    if (parsed.minor > MAX_FEE_BPS) {
      ctx.addIssue({ code: "custom", message: "The fee can be at most 50 %." });
      return z.NEVER;
    }
    return parsed.minor;
  }),
});

export const SELLER_ORDER_SORTS = ["date", "number", "state", "total"] as const;
export type SellerOrderSort = (typeof SELLER_ORDER_SORTS)[number];

/** The seller's table lives in the URL; anything unknown falls back to the default instead of failing. */
export const sellerOrdersQuerySchema = z.object({
  state: z.enum(ORDER_STATES).optional().catch(undefined),
  sort: z.enum(SELLER_ORDER_SORTS).default("date").catch("date"),
  dir: z.enum(["asc", "desc"]).default("desc").catch("desc"),
  page: z.coerce.number().int().min(1).max(1000).default(1).catch(1),
});

export type SellerOrdersQuery = z.infer<typeof sellerOrdersQuerySchema>;
