// Price text → integer minor units. Reference: ISO 4217 gives EUR, GBP, USD, CHF, SEK and PLN two
// minor digits; Intl (CLDR, which follows ISO 4217) is asked below so the test does not take it on trust.
import { describe, expect, it } from "vitest";
import { CURRENCIES, listingDraftSchema, minorToPriceText, parsePriceToMinor, priceTextSchema } from "@/lib/validations/listings";
import { minorDigits } from "@/lib/format/money";

describe("parsePriceToMinor", () => {
  it("reads major units exactly, without float multiplication", () => {
    expect(parsePriceToMinor("12.50")).toBe(1250);
    expect(parsePriceToMinor("12.5")).toBe(1250);
    expect(parsePriceToMinor("12")).toBe(1200);
    expect(parsePriceToMinor("0.10")).toBe(10);
    expect(parsePriceToMinor(" 48.99 ")).toBe(4899);
  });

  it("gets the values right where float multiplication does not (IEEE 754: 0.29 × 100 = 28.999999999999996)", () => {
    expect(0.29 * 100).not.toBe(29); // the trap this parser avoids
    expect(parsePriceToMinor("0.29")).toBe(29);
    expect(parsePriceToMinor("1.15")).toBe(115);
    expect(parsePriceToMinor("9999999.99")).toBe(999_999_999);
  });

  it("refuses a comma, more than two decimals, signs, exponents and words", () => {
    for (const bad of ["1,50", "1.505", "-3.00", "+3", "1e3", "twelve", "", ".50", "12.", "1 000.00", "10000000"]) {
      expect(parsePriceToMinor(bad), bad).toBeNull();
    }
  });

  it("every accepted currency has two minor digits, which the parser assumes (ISO 4217 via Intl)", () => {
    for (const currency of CURRENCIES) expect(minorDigits(currency), currency).toBe(2);
  });

  it("round-trips with minorToPriceText", () => {
    for (const minor of [1, 10, 99, 100, 1250, 4899, 999_999_999]) expect(parsePriceToMinor(minorToPriceText(minor))).toBe(minor);
    expect(minorToPriceText(5)).toBe("0.05");
  });
});

describe("priceTextSchema", () => {
  it("turns the text into minor units", () => {
    expect(priceTextSchema.parse("12.5")).toBe(1250);
  });

  it("tells the seller to use a point when they typed a comma, and refuses zero", () => {
    const comma = priceTextSchema.safeParse("1,50");
    expect(comma.success).toBe(false);
    expect(comma.error?.issues[0]?.message).toMatch(/point, not a comma/);
    expect(priceTextSchema.safeParse("0.00").error?.issues[0]?.message).toMatch(/above zero/);
  });

  it("is what the whole form uses: a draft's price comes out in minor units", () => {
    const draft = listingDraftSchema.parse({
      kind: "board",
      title: "Gate-drive board",
      price: "0.10",
      currency: "EUR",
      stock: 3,
      shippingWeightG: 120,
      declaration: { mainsConnected: false, liveHeatsinks: false, weldingSource: false },
    });
    expect(draft.price).toBe(10);
  });
});
