import { Button, Text } from "@react-email/components";
import { EmailFrame, emailColours } from "../email-frame";

export type SellerApplicationMailProps = {
  applicantName: string;
  shopName: string;
  statusUrl: string;
  reason?: string | null;
};

/** The shared body of the application messages; each message file gives its heading and lines. */
export function SellerApplicationEmail({ preview, heading, lines, props }: { preview: string; heading: string; lines: string[]; props: SellerApplicationMailProps }) {
  return (
    <EmailFrame preview={preview}>
      <Text style={{ fontSize: 18, fontWeight: 700 }}>{heading}</Text>
      <Text>Hello {props.applicantName},</Text>
      {lines.map((line) => (
        <Text key={line}>{line}</Text>
      ))}
      {props.reason ? <Text style={{ borderLeft: `3px solid ${emailColours.rule}`, paddingLeft: 10 }}>{props.reason}</Text> : null}
      <Button href={props.statusUrl} style={{ backgroundColor: emailColours.copper, color: "#ffffff", padding: "10px 18px", borderRadius: 6 }}>
        See your application
      </Button>
    </EmailFrame>
  );
}
