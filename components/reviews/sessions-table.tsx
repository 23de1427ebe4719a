import Link from "next/link";
import { ProductStateBadge } from "@/components/ui/state-badge";
import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";
import type { SessionListItem } from "@/db/queries/reviews";
import { formatMoney } from "@/lib/format/money";
import { stageList } from "@/lib/reviews/labels";

const dateFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });

/** A person's review sessions, as builder or as reviewer, each state shown as its word. */
export function SessionsTable({ sessions, as, caption }: { sessions: SessionListItem[]; as: "builder" | "reviewer"; caption: string }) {
  return (
    <Table caption={caption} captionHidden data-testid={`sessions-${as}`}>
      <THead>
        <tr>
          <TH>Log</TH>
          <TH>{as === "builder" ? "Reviewer" : "Builder"}</TH>
          <TH>Stages</TH>
          <TH>State</TH>
          <TH numeric>{as === "builder" ? "Price" : "Your share"}</TH>
          <TH>Booked</TH>
        </tr>
      </THead>
      <TBody>
        {sessions.map((s) => (
          <TRow key={s.id} data-testid="session-row" data-state={s.state}>
            <TD>
              <Link href={`/reviews/${s.id}`}>{s.logTitle}</Link>
            </TD>
            <TD>{s.counterpart}</TD>
            <TD>{stageList(s.stages)}</TD>
            <TD>
              <ProductStateBadge kind="review" state={s.state} />
            </TD>
            <TD numeric>{formatMoney(as === "builder" ? s.priceMinor : s.reviewerShareMinor, s.currency)}</TD>
            <TD>
              <time dateTime={s.createdAt.toISOString()}>{dateFormat.format(s.createdAt)}</time>
            </TD>
          </TRow>
        ))}
      </TBody>
    </Table>
  );
}
