import { describe, expect, it } from "vitest";
import { lineRefundSchema, platformFeeSchema, sellerOrdersQuerySchema, shipOrderSchema } from "@/lib/validations/orders";

const LINE = "0b6f2d8e-3c1a-4f7e-9d2b-5a6c7e8f9a0b";

describe("order form schemas", () => {
  it("a line refund in EUR takes major units and yields minor units", () => {
    expect(lineRefundSchema("EUR").parse({ lineId: LINE, amount: "12.50", reason: "Scratched heatsink" })).toEqual({ lineId: LINE, amount: 1250, reason: "Scratched heatsink" });
    expect(lineRefundSchema("eur").parse({ lineId: LINE, amount: "0,05", reason: "Late" }).amount).toBe(5);
  });

  it("a line refund refuses zero, more decimals than the currency has, and a missing reason, each on its field", () => {
    const zero = lineRefundSchema("EUR").safeParse({ lineId: LINE, amount: "0", reason: "x" });
    expect(zero.success).toBe(false);
    const paths = zero.error!.issues.map((i) => i.path.join("."));
    expect(paths).toContain("amount");
    expect(paths).toContain("reason");
    expect(lineRefundSchema("JPY").safeParse({ lineId: LINE, amount: "12.5", reason: "Short one part" }).success).toBe(false);
    expect(lineRefundSchema("EUR").safeParse({ lineId: "not-a-uuid", amount: "1", reason: "Short one part" }).success).toBe(false);
  });

  it("shipping needs a carrier and a tracking reference as carriers print them", () => {
    expect(shipOrderSchema.parse({ carrier: " Yard Post ", trackingRef: " YP-2026-0042 " })).toEqual({ carrier: "Yard Post", trackingRef: "YP-2026-0042" });
    expect(shipOrderSchema.safeParse({ carrier: "Yard Post", trackingRef: "<script>" }).success).toBe(false);
    expect(shipOrderSchema.safeParse({ carrier: "", trackingRef: "YP-1" }).success).toBe(false);
  });

  it("the platform fee is 0–50 % in basis points", () => {
    expect(platformFeeSchema.parse({ percent: "8.25" })).toEqual({ percent: 825 });
    expect(platformFeeSchema.parse({ percent: "50" })).toEqual({ percent: 5000 });
    expect(platformFeeSchema.safeParse({ percent: "50.01" }).success).toBe(false);
    expect(platformFeeSchema.safeParse({ percent: "eight" }).success).toBe(false);
  });

  it("the seller's table falls back to its defaults on anything unknown in the URL", () => {
    expect(sellerOrdersQuerySchema.parse({})).toEqual({ sort: "date", dir: "desc", page: 1 });
    expect(sellerOrdersQuerySchema.parse({ state: "shipped", sort: "total", dir: "asc", page: "3" })).toEqual({ state: "shipped", sort: "total", dir: "asc", page: 3 });
    expect(sellerOrdersQuerySchema.parse({ state: "lost", sort: "drop table", dir: "up", page: "-4" })).toEqual({ state: undefined, sort: "date", dir: "desc", page: 1 });
  });
});
