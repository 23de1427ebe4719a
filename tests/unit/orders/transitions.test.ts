import { describe, expect, it } from "vitest";
import { ORDER_STATES, type OrderState } from "@/db/schema/orders";
import { ORDER_ACTIONS, planOrderAction, stateAfterRefund, type OrderAction } from "@/lib/orders/transitions";

// The expected rules are written out here from the product's own description of "after the sale"
// (issue 5 and PRODUCT.md: order states awaiting payment → paid → shipped → delivered, refunded,
// cancelled; the seller marks shipped, cancels before shipping, refunds; the buyer asks for a return
// and the seller decides), not read back from the module.
const order = (state: OrderState) => ({ state, buyerId: "noor", sellerId: "bram" });

const EXPECTED: Record<OrderAction, { by: "buyer" | "seller"; from: OrderState[]; to?: OrderState }> = {
  ship: { by: "seller", from: ["paid"], to: "shipped" },
  confirm_delivery: { by: "buyer", from: ["shipped"], to: "delivered" },
  mark_delivered: { by: "seller", from: ["shipped"], to: "delivered" },
  cancel: { by: "seller", from: ["paid"], to: "cancelled" },
  refund: { by: "seller", from: ["paid", "shipped", "delivered", "cancelled"] },
  request_return: { by: "buyer", from: ["shipped", "delivered"] },
  accept_return: { by: "seller", from: ["shipped", "delivered", "refunded"] },
  decline_return: { by: "seller", from: ["shipped", "delivered", "refunded"] },
};

describe("planOrderAction", () => {
  for (const action of ORDER_ACTIONS) {
    const rule = EXPECTED[action];
    const actor = rule.by === "seller" ? "bram" : "noor";
    for (const state of ORDER_STATES) {
      const allowed = rule.from.includes(state);
      it(`${action} by the ${rule.by} from ${state}: ${allowed ? "allowed" : "refused with 409"}`, () => {
        const plan = planOrderAction({ order: order(state), action, actorId: actor });
        if (allowed) expect(plan).toEqual({ ok: true, party: rule.by, from: state, to: rule.to ?? state });
        else expect(plan).toMatchObject({ ok: false, status: 409 });
      });
    }
  }

  it("refuses the other side of the order with 403, whatever the state", () => {
    expect(planOrderAction({ order: order("paid"), action: "ship", actorId: "noor" })).toMatchObject({ ok: false, status: 403 });
    expect(planOrderAction({ order: order("paid"), action: "cancel", actorId: "noor" })).toMatchObject({ ok: false, status: 403 });
    expect(planOrderAction({ order: order("paid"), action: "refund", actorId: "noor" })).toMatchObject({ ok: false, status: 403 });
    expect(planOrderAction({ order: order("shipped"), action: "confirm_delivery", actorId: "bram" })).toMatchObject({ ok: false, status: 403 });
    expect(planOrderAction({ order: order("delivered"), action: "request_return", actorId: "bram" })).toMatchObject({ ok: false, status: 403 });
  });

  it("answers 404 to someone who is neither buyer nor seller, so the order's existence is not revealed", () => {
    for (const action of ORDER_ACTIONS) {
      expect(planOrderAction({ order: order("paid"), action, actorId: "idunn" })).toEqual({ ok: false, status: 404, message: "No such order." });
    }
  });

  it("names the state in words from the product brief when refusing", () => {
    const plan = planOrderAction({ order: order("awaiting_payment"), action: "ship", actorId: "bram" });
    expect(plan.ok).toBe(false);
    if (!plan.ok) expect(plan.message).toContain("awaiting payment");
    const shipped = planOrderAction({ order: order("shipped"), action: "cancel", actorId: "bram" });
    if (!shipped.ok) expect(shipped.message).toContain("shipped");
  });
});

describe("stateAfterRefund", () => {
  it("moves paid, shipped and delivered orders to refunded exactly when the refunded total reaches the subtotal", () => {
    for (const state of ["paid", "shipped", "delivered"] as const) {
      expect(stateAfterRefund(state, 12_500, 12_499)).toBe(state);
      expect(stateAfterRefund(state, 12_500, 12_500)).toBe("refunded");
    }
  });

  it("keeps a cancelled order cancelled once its money is back", () => {
    expect(stateAfterRefund("cancelled", 12_500, 12_500)).toBe("cancelled");
  });

  it("refuses a refunded total above the subtotal", () => {
    expect(() => stateAfterRefund("paid", 12_500, 12_501)).toThrow(RangeError);
  });
});
