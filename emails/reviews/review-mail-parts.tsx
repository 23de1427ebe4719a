import { Button, Text } from "@react-email/components";
import { emailColours } from "../email-frame";

// Pieces every review e-mail shares, so the messages read alike.

export function ActionButton({ href, children }: { href: string; children: string }) {
  return (
    <Button href={href} style={{ backgroundColor: emailColours.copper, color: "#ffffff", padding: "10px 18px", borderRadius: 6 }}>
      {children}
    </Button>
  );
}

export function Quoted({ children }: { children: string }) {
  return <Text style={{ borderLeft: `3px solid ${emailColours.rule}`, paddingLeft: 10, whiteSpace: "pre-wrap" }}>{children}</Text>;
}

export function Heading({ children }: { children: string }) {
  return <Text style={{ fontSize: 18, fontWeight: 700 }}>{children}</Text>;
}
