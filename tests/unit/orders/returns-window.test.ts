import { describe, expect, it } from "vitest";
import { isReturnsWindowOpen, returnsWindowClosesAt } from "@/lib/orders/returns-window";

// Counting a period of days: Regulation (EEC, Euratom) No 1182/71, art. 3(1) (the day of the event
// is not counted) and art. 3(2)(b) (the period ends with the last hour of its last day). The 2011/83/EU
// withdrawal period is counted this way (its recital 41); the Commission's guidance on that directive
// works the example of goods received on one day with the last day fourteen days later (from memory).
// Our days are UTC days.
const at = (iso: string) => new Date(iso);

describe("returns window", () => {
  const delivered = { deliveredAt: at("2026-03-02T15:00:00Z"), shippedAt: at("2026-02-27T09:00:00Z"), windowDays: 14 };

  it("delivered on 2 March with 14 days: the last day is 16 March, so it closes at the start of 17 March", () => {
    expect(returnsWindowClosesAt(delivered)).toEqual(at("2026-03-17T00:00:00Z"));
  });

  it("is open in the last millisecond of the last day and closed at the first of the next", () => {
    expect(isReturnsWindowOpen(delivered, at("2026-03-16T23:59:59.999Z"))).toBe(true);
    expect(isReturnsWindowOpen(delivered, at("2026-03-17T00:00:00.000Z"))).toBe(false);
  });

  it("does not depend on the hour of delivery within its day", () => {
    const early = { ...delivered, deliveredAt: at("2026-03-02T00:00:00Z") };
    const late = { ...delivered, deliveredAt: at("2026-03-02T23:59:59Z") };
    expect(returnsWindowClosesAt(early)).toEqual(returnsWindowClosesAt(late));
  });

  it("counts from shipping while the delivery is unconfirmed", () => {
    const shippedOnly = { deliveredAt: null, shippedAt: at("2026-02-27T09:00:00Z"), windowDays: 14 };
    // 27 February 2026 + 14 days: last day 13 March (2026 is not a leap year).
    expect(returnsWindowClosesAt(shippedOnly)).toEqual(at("2026-03-14T00:00:00Z"));
    expect(isReturnsWindowOpen(shippedOnly, at("2026-03-13T12:00:00Z"))).toBe(true);
    expect(isReturnsWindowOpen(shippedOnly, at("2026-03-14T00:00:00Z"))).toBe(false);
  });

  it("a delivery confirmation moves the start later, never earlier", () => {
    const shippedOnly = { ...delivered, deliveredAt: null };
    expect(returnsWindowClosesAt(delivered)!.getTime()).toBeGreaterThan(returnsWindowClosesAt(shippedOnly)!.getTime());
  });

  it("is closed before anything has shipped, and always for a seller who takes no returns", () => {
    expect(returnsWindowClosesAt({ deliveredAt: null, shippedAt: null, windowDays: 30 })).toBeNull();
    expect(isReturnsWindowOpen({ deliveredAt: null, shippedAt: null, windowDays: 30 }, at("2026-03-01T00:00:00Z"))).toBe(false);
    expect(isReturnsWindowOpen({ ...delivered, windowDays: 0 }, at("2026-03-02T16:00:00Z"))).toBe(false);
  });

  it("refuses a window that is not whole days", () => {
    expect(() => returnsWindowClosesAt({ ...delivered, windowDays: 1.5 })).toThrow(RangeError);
    expect(() => returnsWindowClosesAt({ ...delivered, windowDays: -1 })).toThrow(RangeError);
  });
});
