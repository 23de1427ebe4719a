import { describe, expect, it } from "vitest";
import { orderTimeline } from "@/lib/orders/timeline";

const at = (iso: string) => new Date(iso);
const base = { createdAt: at("2026-03-01T10:00:00Z"), paidAt: null, shippedAt: null, deliveredAt: null, cancelledAt: null, carrier: null, trackingRef: null, refunds: [], returns: [] };

// The order of events is the order of the product's states (issue 5: paid → shipped → delivered,
// refunds and returns after), checked here by their times.
describe("orderTimeline", () => {
  it("lists what happened oldest first, with the tracking on the shipping event", () => {
    const events = orderTimeline({
      ...base,
      paidAt: at("2026-03-01T10:05:00Z"),
      shippedAt: at("2026-03-02T08:00:00Z"),
      deliveredAt: at("2026-03-04T12:00:00Z"),
      carrier: "Yard Post",
      trackingRef: "YP-42",
      refunds: [{ createdAt: at("2026-03-03T09:00:00Z"), amountMinor: 500, settled: true }],
      returns: [{ createdAt: at("2026-03-05T09:00:00Z"), status: "declined", decidedAt: at("2026-03-06T09:00:00Z") }],
    });
    expect(events.map((e) => e.kind)).toEqual(["placed", "paid", "shipped", "refund", "delivered", "return_requested", "return_declined"]);
    expect(events.find((e) => e.kind === "shipped")?.detail).toBe("Yard Post · YP-42");
  });

  it("shows a refund the payment service has not confirmed as pending", () => {
    const events = orderTimeline({ ...base, paidAt: at("2026-03-01T10:05:00Z"), cancelledAt: at("2026-03-01T11:00:00Z"), refunds: [{ createdAt: at("2026-03-01T11:00:00Z"), amountMinor: 900, settled: false }] });
    expect(events.map((e) => e.kind)).toEqual(["placed", "paid", "cancelled", "refund_pending"]);
  });

  it("keeps an undecided return request without a decision event", () => {
    const events = orderTimeline({ ...base, returns: [{ createdAt: at("2026-03-05T09:00:00Z"), status: "requested", decidedAt: null }] });
    expect(events.map((e) => e.kind)).toEqual(["placed", "return_requested"]);
  });

  it("keeps placing the order first even when the payment's clock reads a moment earlier", () => {
    const events = orderTimeline({ ...base, createdAt: at("2026-03-01T10:00:01Z"), paidAt: at("2026-03-01T10:00:00Z") });
    expect(events.map((e) => e.kind)).toEqual(["placed", "paid"]);
  });
});
