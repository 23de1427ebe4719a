import type { ReactNode } from "react";
import { Body, Container, Head, Hr, Html, Preview, Section, Text } from "@react-email/components";

const colours = { paper: "#f7f5f0", graphite: "#22252a", muted: "#5b616b", copper: "#a4532a", rule: "#d9d4ca" };

export function EmailFrame({ preview, children }: { preview: string; children: ReactNode }) {
  return (
    <Html lang="en">
      <Head />
      <Preview>{preview}</Preview>
      <Body style={{ backgroundColor: colours.paper, color: colours.graphite, fontFamily: "Helvetica, Arial, sans-serif" }}>
        <Container style={{ maxWidth: 560, padding: "24px 20px" }}>
          <Text style={{ fontSize: 18, fontWeight: 700, letterSpacing: 0.5, color: colours.copper, margin: 0 }}>Fluxyard</Text>
          <Section style={{ marginTop: 16 }}>{children}</Section>
          <Hr style={{ borderColor: colours.rule, marginTop: 32 }} />
          <Text style={{ fontSize: 12, color: colours.muted }}>
            Mains and charged capacitors can kill. Local electrical codes and licensed practice take precedence over anything
            on Fluxyard.
          </Text>
        </Container>
      </Body>
    </Html>
  );
}

export const emailColours = colours;
