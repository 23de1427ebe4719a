import Link from "next/link";
import type { HeldRow } from "@/db/queries/moderation";
import { EmptyState } from "@/components/ui/empty-state";
import { StateBadge } from "@/components/ui/state-badge";
import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";
import { kindLabel } from "./labels";
import { RelativeTime } from "./relative-time";

export function HeldListingsTable({ rows }: { rows: HeldRow[] }) {
  if (rows.length === 0) return <EmptyState title="No listing is held">Held listings are out of the catalog until a moderator restores them.</EmptyState>;
  return (
    <Table caption="Held listings, the most recent first" captionHidden data-testid="held-listings">
      <THead>
        <TRow>
          <TH>Listing</TH>
          <TH>Kind</TH>
          <TH>Seller</TH>
          <TH>Held</TH>
          <TH>Reason</TH>
        </TRow>
      </THead>
      <TBody>
        {rows.map((row) => (
          <TRow key={row.id} data-testid={`held-row-${row.id}`}>
            <TD>
              <Link href={`/moderate/listings/${row.id}`} className="font-medium">
                {row.title}
              </Link>
            </TD>
            <TD>{kindLabel(row.kind)}</TD>
            <TD>{row.sellerName}</TD>
            <TD>
              {row.heldAt ? <RelativeTime iso={row.heldAt} /> : "—"}
              <div className="mt-1">
                <StateBadge label={row.bySystem ? "By the grace-period job" : "By a moderator"} />
              </div>
            </TD>
            <TD className="max-w-md whitespace-pre-line text-sm">{row.reason ?? "—"}</TD>
          </TRow>
        ))}
      </TBody>
    </Table>
  );
}
