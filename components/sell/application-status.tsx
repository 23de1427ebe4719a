import { Markdown } from "@/components/markdown";
import { Panel } from "@/components/ui/panel";
import { StateBadge, type StateTone } from "@/components/ui/state-badge";
import type { SellerApplication } from "@/db/schema/sellers";

const STATUS: Record<SellerApplication["status"], { label: string; tone: StateTone; text: string }> = {
  pending: { label: "Pending", tone: "active", text: "A moderator will read it; you will get an e-mail with the decision. You can send only one application at a time." },
  approved: { label: "Approved", tone: "clear", text: "Your shop is open: connect your payout account on the seller desk." },
  declined: { label: "Declined", tone: "caution", text: "A moderator declined it for the reason below. You can apply again once you have addressed it." },
};

const dateFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });

export function ApplicationStatus({ application }: { application: SellerApplication }) {
  const status = STATUS[application.status];
  return (
    <Panel title="Your latest application" actions={<StateBadge label={status.label} tone={status.tone} />}>
      <div className="space-y-3 text-sm" data-testid="application-status" data-status={application.status}>
        <p>
          “{application.shopName}”, sent <time dateTime={application.createdAt.toISOString()}>{dateFormat.format(application.createdAt)}</time>.
        </p>
        <p>{status.text}</p>
        {application.status === "declined" && application.decisionReason ? (
          <blockquote className="border-l-4 border-amber-500 pl-3" data-testid="decline-reason">{application.decisionReason}</blockquote>
        ) : null}
        <details>
          <summary className="cursor-pointer text-copper-700">What you sent</summary>
          <div className="mt-2 space-y-2">
            <Markdown minHeadingLevel={3}>{application.profileMd}</Markdown>
            <p className="font-semibold">Returns ({application.returnsWindowDays} days)</p>
            <Markdown minHeadingLevel={3}>{application.returnsPolicyMd}</Markdown>
          </div>
        </details>
      </div>
    </Panel>
  );
}
