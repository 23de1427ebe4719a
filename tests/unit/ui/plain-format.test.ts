import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { formatMoney, toDecimalString } from "@/lib/format/money";
import { formatSignificant, formatUtcDay, formatUtcDayTime, groupThousands } from "@/lib/format/plain";
import { CURRENCIES } from "@/lib/validations/listings";

// The reference for every check here is ECMA-402 Intl as Node's ICU implements it (ICU and CLDR
// versions in process.versions). The functions under test stand in for those Intl calls in the
// browser, so they must print exactly what Intl prints.

const RUNS = { numRuns: 3000 };

describe("formatSignificant matches Intl.NumberFormat maximumSignificantDigits", () => {
  const intl = (value: number, digits: number) => new Intl.NumberFormat("en", { maximumSignificantDigits: digits, useGrouping: false }).format(value);

  it("on worked values, ties and carries", () => {
    for (const [value, digits] of [
      [47, 3], [357.77, 3], [1.005, 3], [0.125, 2], [2.5, 1], [999.95, 4], [999.5, 3], [0.00099995, 3],
      [123456789, 3], [1e21, 3], [1.5e-7, 2], [5e-324, 3], [Number.MAX_VALUE, 5], [0.1 + 0.2, 17], [1234.5, 21],
    ] as const) {
      expect(formatSignificant(value, digits), `${value} to ${digits}`).toBe(intl(value, digits));
    }
  });

  it("on doubles across every magnitude", () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1e30, noNaN: true, noDefaultInfinity: true }), fc.integer({ min: 1, max: 21 }), (value, digits) => {
        expect(formatSignificant(value, digits)).toBe(intl(value, digits));
      }),
      RUNS,
    );
  });

  it("on short decimals, where half-way ties are common", () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 99_999_999 }), fc.integer({ min: -12, max: 6 }), fc.integer({ min: 1, max: 8 }), (mantissa, exponent, digits) => {
        const value = Number(`${mantissa}e${exponent}`);
        expect(formatSignificant(value, digits)).toBe(intl(value, digits));
      }),
      RUNS,
    );
  });

  it("refuses what Intl would print differently", () => {
    expect(() => formatSignificant(-1, 3)).toThrow(RangeError);
    expect(() => formatSignificant(Number.NaN, 3)).toThrow(RangeError);
    expect(() => formatSignificant(1, 0)).toThrow(RangeError);
  });
});

describe("groupThousands matches Number#toLocaleString", () => {
  it("in en and en-GB", () => {
    fc.assert(
      fc.property(fc.maxSafeInteger(), (n) => {
        expect(groupThousands(n)).toBe(n.toLocaleString("en"));
        expect(groupThousands(n)).toBe(n.toLocaleString("en-GB"));
      }),
      RUNS,
    );
    expect(groupThousands(1000)).toBe("1,000");
    expect(groupThousands(999)).toBe("999");
  });
});

describe("formatMoney's en-GB path matches Intl currency formatting", () => {
  it("for every listing currency", () => {
    for (const currency of CURRENCIES) {
      const intl = new Intl.NumberFormat("en-GB", { style: "currency", currency });
      fc.assert(
        fc.property(fc.maxSafeInteger(), (minor) => {
          expect(formatMoney(minor, currency)).toBe(intl.format(toDecimalString(minor, 2)));
        }),
        { numRuns: 500 },
      );
      for (const minor of [0, 5, -5, 100, 99_999, 123_456_789]) expect(formatMoney(minor, currency)).toBe(intl.format(toDecimalString(minor, 2)));
    }
  });
});

describe("UTC days and times match Intl.DateTimeFormat en-GB medium", () => {
  const day = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeZone: "UTC" });
  const dayTime = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" });

  it("on every month, both ends of the day and random instants", () => {
    for (let month = 0; month < 12; month++) {
      for (const at of [new Date(Date.UTC(2026, month, 1, 0, 0)), new Date(Date.UTC(2026, month, 28, 23, 59, 59))]) {
        expect(formatUtcDay(at)).toBe(day.format(at));
        expect(formatUtcDayTime(at)).toBe(dayTime.format(at));
      }
    }
    fc.assert(
      fc.property(fc.date({ min: new Date("1970-01-01T00:00:00Z"), max: new Date("2199-12-31T23:59:59Z"), noInvalidDate: true }), (at) => {
        expect(formatUtcDay(at)).toBe(day.format(at));
        expect(formatUtcDayTime(at)).toBe(dayTime.format(at));
      }),
      RUNS,
    );
  });

  it("refuses an invalid date", () => {
    expect(() => formatUtcDay(new Date(Number.NaN))).toThrow(RangeError);
  });
});
