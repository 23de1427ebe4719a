import { Button, Text } from "@react-email/components";
import { defineMailTemplate } from "../registry";
import { EmailFrame, emailColours } from "../email-frame";

export type PolicyGraceNoticeProps = {
  sellerName: string;
  listingTitle: string;
  listingUrl: string;
  revision: number;
  revisionSummary: string;
  /** ISO 8601; shown as a calendar date in UTC */
  graceUntil: string;
  findings: { topicLabel: string; message: string }[];
};

export function graceDate(iso: string): string {
  return new Date(iso).toLocaleDateString("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });
}

export const policyGraceNoticeMail = defineMailTemplate<PolicyGraceNoticeProps>("policy-grace-notice", {
  subject: (p) => `Action needed by ${graceDate(p.graceUntil)}: “${p.listingTitle}” and policy revision ${p.revision}`,
  render: (p) => (
    <EmailFrame preview={`Update the safety sheet by ${graceDate(p.graceUntil)}`}>
      <Text style={{ fontSize: 18, fontWeight: 700 }}>The safety policy changed</Text>
      <Text>Hello {p.sellerName},</Text>
      <Text>
        Policy revision {p.revision} is in force: {p.revisionSummary} We checked “{p.listingTitle}” against it, and its safety sheet no
        longer meets it. The listing stays live until {graceDate(p.graceUntil)}. If the sheet still does not meet the policy then, the
        listing is held and leaves the catalog.
      </Text>
      <Text style={{ fontWeight: 700 }}>What to change:</Text>
      {p.findings.map((f) => (
        <Text key={f.topicLabel + f.message} style={{ marginLeft: 12 }}>
          <strong>{f.topicLabel}:</strong> {f.message}
        </Text>
      ))}
      <Text>Editing the safety sheet sends the listing back to review, where a moderator checks it against the new revision.</Text>
      <Button href={p.listingUrl} style={{ backgroundColor: emailColours.copper, color: "#ffffff", padding: "10px 18px", borderRadius: 6 }}>
        Open the listing
      </Button>
    </EmailFrame>
  ),
});
