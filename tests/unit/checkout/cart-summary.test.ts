import { describe, expect, it } from "vitest";
import { lineProblem, mixedCurrencyMessage, summariseCart, type CartLine } from "@/lib/checkout/cart-summary";

function line(overrides: Partial<CartLine>): CartLine {
  return {
    listingId: "00000000-0000-4000-8000-000000000001",
    slug: "item",
    title: "Item",
    kind: "kit",
    magneticSubtype: null,
    sellerId: "seller-a",
    shopName: "Shop A",
    priceMinor: 1000,
    currency: "EUR",
    quantity: 1,
    stock: 5,
    live: true,
    mainsConnected: false,
    ...overrides,
  };
}

// Totals are sums of price × quantity in integer minor units (hand arithmetic beside each case).
describe("summariseCart", () => {
  it("groups by seller with a subtotal each and one total", () => {
    const summary = summariseCart([
      line({ listingId: "a1", sellerId: "seller-a", shopName: "Shop A", priceMinor: 12_900, quantity: 2 }), // 258.00
      line({ listingId: "b1", sellerId: "seller-b", shopName: "Shop B", priceMinor: 4_550, quantity: 1 }), // 45.50
      line({ listingId: "a2", sellerId: "seller-a", shopName: "Shop A", priceMinor: 999, quantity: 3 }), // 29.97
    ]);
    expect(summary.groups.map((g) => [g.shopName, g.subtotalMinor, g.lines.length])).toEqual([
      ["Shop A", 28_797, 2],
      ["Shop B", 4_550, 1],
    ]);
    expect(summary.totals).toEqual([{ currency: "EUR", totalMinor: 33_347 }]);
    expect(summary.itemCount).toBe(6);
    expect(summary.ready).toBe(true);
    expect(summary.mixedCurrencies).toBe(false);
  });

  it("keeps currencies apart and flags the mix", () => {
    const summary = summariseCart([line({ listingId: "x", currency: "EUR", priceMinor: 500 }), line({ listingId: "y", currency: "GBP", priceMinor: 700, sellerId: "seller-b", shopName: "Shop B" })]);
    expect(summary.mixedCurrencies).toBe(true);
    expect(summary.totals).toEqual([
      { currency: "EUR", totalMinor: 500 },
      { currency: "GBP", totalMinor: 700 },
    ]);
    expect(mixedCurrencyMessage(["EUR", "GBP"])).toMatch(/EUR and GBP/);
  });

  it("leaves lines that cannot be bought out of the totals and marks the cart not ready", () => {
    const summary = summariseCart([
      line({ listingId: "ok", priceMinor: 1000, quantity: 1 }),
      line({ listingId: "short", priceMinor: 2000, quantity: 4, stock: 3 }),
      line({ listingId: "gone", priceMinor: 3000, live: false }),
    ]);
    expect(summary.totals).toEqual([{ currency: "EUR", totalMinor: 1000 }]);
    expect(summary.ready).toBe(false);
  });
});

describe("lineProblem", () => {
  it("tells not-for-sale, out-of-stock and short apart", () => {
    expect(lineProblem({ live: false, stock: 9, quantity: 1 })).toBe("not-for-sale");
    expect(lineProblem({ live: true, stock: 0, quantity: 1 })).toBe("out-of-stock");
    expect(lineProblem({ live: true, stock: 2, quantity: 3 })).toBe("short");
    expect(lineProblem({ live: true, stock: 3, quantity: 3 })).toBeNull();
  });
});
