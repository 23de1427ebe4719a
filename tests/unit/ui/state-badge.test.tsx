import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { PRODUCT_STATES, ProductStateBadge, StateBadge, productState, type StateKind } from "@/components/ui/state-badge";

// The product's state words come from shared/PRODUCT.md ("Names used in the product"); the rule
// that a state is never shown by colour alone is WCAG 2.2 SC 1.4.1 (Use of Color).
const PRODUCT_WORDS: Record<StateKind, string[]> = {
  listing: ["draft", "in review", "live", "sent back", "held", "retired"],
  order: ["awaiting payment", "paid", "shipped", "delivered", "refunded", "cancelled"],
  review: ["requested", "accepted", "delivered", "closed", "declined", "expired", "disputed"],
  reading: ["within", "low", "high"],
  policy: ["clear", "incomplete", "blocked"],
};

const text = (html: string) => html.replace(/<[^>]+>/g, "");

describe("StateBadge", () => {
  it("renders every product state as its own word", () => {
    for (const [kind, words] of Object.entries(PRODUCT_WORDS) as Array<[StateKind, string[]]>) {
      for (const word of words) {
        const html = renderToStaticMarkup(<ProductStateBadge kind={kind} state={word.replace(/ /g, "_")} />);
        expect(text(html).toLowerCase(), `${kind}/${word}`).toBe(word);
      }
    }
  });

  it("maps exactly the product's states, no more and no fewer", () => {
    for (const [kind, words] of Object.entries(PRODUCT_WORDS) as Array<[StateKind, string[]]>) {
      const labels = Object.values(PRODUCT_STATES[kind]).map((entry) => entry.label.toLowerCase());
      expect(labels.sort(), kind).toEqual([...words].sort());
    }
  });

  it("accepts the spaced and hyphenated spellings of a state", () => {
    expect(productState("listing", "sent back")).toEqual(productState("listing", "sent_back"));
    expect(productState("order", "Awaiting-Payment").label).toBe("Awaiting payment");
  });

  it("still shows the word of a state it does not know", () => {
    const html = renderToStaticMarkup(<ProductStateBadge kind="order" state="on_hold_at_customs" />);
    expect(text(html)).toBe("On hold at customs");
    expect(html).toContain('data-tone="neutral"');
  });

  it("keeps red for stop states and green for clear ones, as the look brief asks", () => {
    expect(productState("policy", "blocked").tone).toBe("stop");
    expect(productState("listing", "held").tone).toBe("stop");
    expect(productState("reading", "within").tone).toBe("clear");
    expect(productState("listing", "sent_back").tone).toBe("caution");
    const html = renderToStaticMarkup(<StateBadge label="Blocked" tone="stop" />);
    expect(text(html)).toBe("Blocked");
    expect(html).toContain("text-signal-700");
  });
});
