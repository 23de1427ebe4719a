import { Button, Section, Text } from "@react-email/components";
import { formatMoney } from "@/lib/format/money";
import { emailColours } from "../email-frame";

/** One line of an order as the paid messages list it; money in minor units, formatted when rendered. */
export type PaidLine = { title: string; quantity: number; unitPriceMinor: number };

export function PaidLines({ lines, currency }: { lines: PaidLine[]; currency: string }) {
  return (
    <Section style={{ borderTop: `1px solid ${emailColours.rule}`, borderBottom: `1px solid ${emailColours.rule}`, padding: "4px 0" }}>
      {lines.map((line) => (
        <Text key={line.title} style={{ margin: "6px 0" }}>
          {line.quantity} × {line.title} — {formatMoney(line.unitPriceMinor * line.quantity, currency)}
        </Text>
      ))}
    </Section>
  );
}

export function PaidButton({ href, children }: { href: string; children: string }) {
  return (
    <Button href={href} style={{ backgroundColor: emailColours.copper, color: "#ffffff", padding: "10px 18px", borderRadius: 6 }}>
      {children}
    </Button>
  );
}
