import { render } from "@react-email/render";
import { describe, expect, it } from "vitest";
import { mailTemplate } from "@/emails/registry";
import "@/emails/all";

// Each order e-mail registers under its name (so the worker can render a queued row) and carries the
// facts its issue asks for: carrier and tracking when shipped, the amount when refunded, the reason
// when a return is declined.
const CASES: { name: string; props: Record<string, unknown>; subject: RegExp; text: string[] }[] = [
  {
    name: "order-shipped",
    props: { buyerName: "Noor", orderNumber: "FY-1001", sellerName: "Bench Kits", carrier: "Larkspur Courier", trackingRef: "LC-118834", orderUrl: "http://localhost:3000/orders/x" },
    subject: /^Shipped: order FY-1001/,
    text: ["Larkspur Courier", "LC-118834", "http://localhost:3000/orders/x"],
  },
  {
    name: "order-refunded",
    props: { buyerName: "Noor", orderNumber: "FY-1001", amount: "€10.50", lineTitle: "Gate-drive board", reason: "Cracked ferrite", orderUrl: "u" },
    subject: /€10\.50.*FY-1001/,
    text: ["€10.50", "Gate-drive board", "Cracked ferrite"],
  },
  {
    name: "order-cancelled",
    props: { buyerName: "Noor", orderNumber: "FY-1002", sellerName: "Bench Kits", refundAmount: "€166.00", orderUrl: "u" },
    subject: /^Cancelled: order FY-1002/,
    text: ["€166.00", "Bench Kits"],
  },
  {
    name: "return-requested",
    props: { sellerName: "Bram", buyerName: "Noor", orderNumber: "FY-1003", reason: "Older board revision", orderUrl: "u" },
    subject: /Return requested for order FY-1003/,
    text: ["Older board revision", "Noor"],
  },
  {
    name: "return-accepted",
    props: { buyerName: "Noor", orderNumber: "FY-1003", sellerName: "Bench Kits", refundAmount: "€129.00", orderUrl: "u" },
    subject: /Return accepted for order FY-1003/,
    text: ["€129.00"],
  },
  {
    name: "return-declined",
    props: { buyerName: "Noor", orderNumber: "FY-1004", sellerName: "Bench Kits", reason: "Soldered boards cannot be returned.", orderUrl: "u" },
    subject: /Return declined for order FY-1004/,
    text: ["Soldered boards cannot be returned."],
  },
];

describe("order e-mails", () => {
  for (const c of CASES) {
    it(`${c.name} renders its subject and facts`, async () => {
      const template = mailTemplate(c.name);
      expect(template, c.name).toBeDefined();
      expect(template!.subject(c.props)).toMatch(c.subject);
      const text = await render(template!.render(c.props), { plainText: true });
      for (const fact of c.text) expect(text).toContain(fact);
      // Every message carries the frame's mains caution.
      expect(text).toMatch(/charged capacitors can kill/i);
    });
  }
});
