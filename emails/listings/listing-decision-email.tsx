import { Button, Text } from "@react-email/components";
import { EmailFrame, emailColours } from "../email-frame";

export type ListingDecisionProps = {
  sellerName: string;
  listingTitle: string;
  listingUrl: string;
  reasons?: { topicLabel: string; text: string }[];
  note?: string | null;
};

/** The shared body of the four decision messages; each message file gives its own heading and lines. */
export function ListingDecisionEmail({
  preview,
  heading,
  lines,
  props,
}: {
  preview: string;
  heading: string;
  lines: string[];
  props: ListingDecisionProps;
}) {
  return (
    <EmailFrame preview={preview}>
      <Text style={{ fontSize: 18, fontWeight: 700 }}>{heading}</Text>
      <Text>Hello {props.sellerName},</Text>
      {lines.map((line) => (
        <Text key={line}>{line}</Text>
      ))}
      {props.reasons && props.reasons.length > 0 ? (
        <>
          <Text style={{ fontWeight: 700 }}>What to change:</Text>
          {props.reasons.map((r) => (
            <Text key={r.topicLabel + r.text} style={{ marginLeft: 12 }}>
              <strong>{r.topicLabel}:</strong> {r.text}
            </Text>
          ))}
        </>
      ) : null}
      {props.note ? <Text style={{ borderLeft: `3px solid ${emailColours.rule}`, paddingLeft: 10 }}>{props.note}</Text> : null}
      <Button href={props.listingUrl} style={{ backgroundColor: emailColours.copper, color: "#ffffff", padding: "10px 18px", borderRadius: 6 }}>
        Open the listing
      </Button>
    </EmailFrame>
  );
}
