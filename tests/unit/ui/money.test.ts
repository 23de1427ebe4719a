import { describe, expect, it } from "vitest";
import { formatMoney, minorDigits, toDecimalString } from "@/lib/format/money";

// Minor units per ISO 4217 (EUR 2, JPY 0, KWD 3: from memory, and what CLDR data in Intl says).
// Expected strings are written by hand and cross-checked with Intl.NumberFormat on the major amount.
describe("formatMoney", () => {
  it("formats 12345 minor EUR in en-GB as €123.45", () => {
    expect(formatMoney(12345, "EUR", "en-GB")).toBe("€123.45");
    expect(formatMoney(12345, "EUR", "en-GB")).toBe(
      new Intl.NumberFormat("en-GB", { style: "currency", currency: "EUR" }).format(123.45),
    );
  });

  it("uses no minor digits for JPY and three for KWD", () => {
    expect(minorDigits("JPY")).toBe(0);
    expect(minorDigits("KWD")).toBe(3);
    expect(formatMoney(1234, "JPY", "en-GB")).toBe("JP¥1,234");
    expect(formatMoney(1234, "JPY", "en-GB")).toBe(new Intl.NumberFormat("en-GB", { style: "currency", currency: "JPY" }).format(1234));
    expect(formatMoney(12345, "KWD", "en-GB")).toBe(new Intl.NumberFormat("en-GB", { style: "currency", currency: "KWD" }).format(12.345));
  });

  it("follows the locale's conventions", () => {
    // de-DE puts the sign after the amount with a no-break space and uses a decimal comma.
    expect(formatMoney(12345, "EUR", "de-DE")).toBe("123,45\u00a0€");
    expect(formatMoney(-12345, "EUR", "en-GB")).toBe("-€123.45");
    expect(formatMoney(5, "EUR", "en-GB")).toBe("€0.05");
  });

  it("stays exact where dividing by 100 in floating point would not", () => {
    // 9007199254740893 / 100 is stored as …408.9375 and would print as .94.
    expect(formatMoney(9_007_199_254_740_893, "EUR", "en-GB")).toBe("€90,071,992,547,408.93");
    expect(toDecimalString(-7, 2)).toBe("-0.07");
  });

  it("refuses amounts that are not whole minor units", () => {
    expect(() => formatMoney(12.5, "EUR", "en-GB")).toThrow(RangeError);
  });
});
