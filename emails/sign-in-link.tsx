import { Button, Text } from "@react-email/components";
import { EmailFrame, emailColours } from "./email-frame";

export function SignInLinkEmail({ url, host, minutesValid }: { url: string; host: string; minutesValid: number }) {
  return (
    <EmailFrame preview="Your Fluxyard sign-in link">
      <Text style={{ fontSize: 16 }}>Use the button below to sign in to Fluxyard at {host}.</Text>
      <Button
        href={url}
        style={{ backgroundColor: emailColours.copper, color: "#ffffff", padding: "12px 20px", borderRadius: 6, fontWeight: 600 }}
      >
        Sign in to Fluxyard
      </Button>
      <Text style={{ fontSize: 13, color: emailColours.muted }}>
        The link works once and for {minutesValid} minutes. If you did not ask to sign in, you can ignore this message.
      </Text>
      <Text style={{ fontSize: 12, color: emailColours.muted, wordBreak: "break-all" }}>{url}</Text>
    </EmailFrame>
  );
}
