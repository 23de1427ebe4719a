import { Markdown } from "@/components/markdown";
import { Panel } from "@/components/ui/panel";
import { StateBadge, type StateTone } from "@/components/ui/state-badge";
import { formatMoney } from "@/lib/format/money";
import { expertiseLabel } from "@/lib/validations/reviews";
import type { ReviewerApplicationRow } from "@/db/queries/reviews";

const STATUS: Record<ReviewerApplicationRow["status"], { label: string; tone: StateTone; text: string }> = {
  pending: { label: "Pending", tone: "active", text: "A moderator will read it; you will get an e-mail with the decision." },
  approved: { label: "Approved", tone: "clear", text: "You are a reviewer: connect your payout account on your review desk so builders can book you." },
  declined: { label: "Declined", tone: "caution", text: "A moderator declined it for the reason below. You can apply again once you have addressed it." },
};

const dateFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });

export function ReviewerApplicationStatus({ application }: { application: ReviewerApplicationRow }) {
  const status = STATUS[application.status];
  return (
    <Panel title="Your latest application" actions={<StateBadge label={status.label} tone={status.tone} />}>
      <div className="space-y-3 text-sm" data-testid="reviewer-application-status" data-status={application.status}>
        <p>
          Sent <time dateTime={application.createdAt.toISOString()}>{dateFormat.format(application.createdAt)}</time>, at{" "}
          <span className="font-mono">{formatMoney(application.priceMinor, application.currency)}</span> per review ·{" "}
          {application.expertise.map(expertiseLabel).join(", ")}.
        </p>
        <p>{status.text}</p>
        {application.status === "declined" && application.decisionReason ? (
          <blockquote className="border-l-4 border-amber-500 pl-3">{application.decisionReason}</blockquote>
        ) : null}
        <details>
          <summary className="cursor-pointer text-copper-700">What you sent</summary>
          <div className="mt-2 space-y-2">
            <Markdown minHeadingLevel={3}>{application.profileMd}</Markdown>
            <p className="font-semibold">Track record</p>
            <Markdown minHeadingLevel={3}>{application.trackRecordMd}</Markdown>
          </div>
        </details>
      </div>
    </Panel>
  );
}
