"use client";

import Link from "next/link";
import { useQuery } from "@tanstack/react-query";
import type { QueueRow } from "@/db/queries/moderation";
import { EmptyState } from "@/components/ui/empty-state";
import { ErrorState } from "@/components/ui/error-state";
import { ProductStateBadge, StateBadge } from "@/components/ui/state-badge";
import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";
import { kindLabel } from "./labels";
import { RelativeTime } from "./relative-time";

export const QUEUE_QUERY_KEY = ["moderation-queue"] as const;
const REFRESH_MS = 15_000;

async function fetchQueue(): Promise<QueueRow[]> {
  const res = await fetch("/api/moderation/queue", { cache: "no-store" });
  if (!res.ok) throw new Error(((await res.json().catch(() => null)) as { message?: string } | null)?.message ?? `The queue answered ${res.status}.`);
  return ((await res.json()) as { listings: QueueRow[] }).listings;
}

const RESUBMISSION: Record<NonNullable<QueueRow["resubmission"]>, string> = {
  "after-approval": "Changed since approval",
  "after-send-back": "Re-submitted after send-back",
};

/** The listings waiting for review, oldest first; refreshes itself every 15 s while the page is open. */
export function ReviewQueueTable({ initial }: { initial: QueueRow[] }) {
  const queue = useQuery({
    queryKey: QUEUE_QUERY_KEY,
    queryFn: fetchQueue,
    initialData: initial,
    // The server rendered `initial` just now; refetch on the interval, not at once.
    initialDataUpdatedAt: () => Date.now(),
    staleTime: REFRESH_MS,
    refetchInterval: REFRESH_MS,
  });

  if (queue.isError && queue.data === undefined) {
    return <ErrorState title="The review queue could not be loaded">{queue.error.message}</ErrorState>;
  }
  const rows = queue.data ?? [];
  return (
    <div className="space-y-2">
      <p className="text-sm text-graphite-600" aria-live="polite" data-testid="queue-status">
        {rows.length === 1 ? "1 listing waits" : `${rows.length} listings wait`} for review. The list refreshes every 15 seconds
        {queue.isFetching ? " (refreshing…)" : ""}.{queue.isError ? ` The last refresh failed: ${queue.error.message}` : ""}
      </p>
      {rows.length === 0 ? (
        <EmptyState title="Nothing waits for review">New submissions appear here on their own.</EmptyState>
      ) : (
        <Table caption="Listings waiting for review, oldest first" captionHidden data-testid="review-queue">
          <THead>
            <TRow>
              <TH>Listing</TH>
              <TH>Kind</TH>
              <TH>Seller</TH>
              <TH sort="ascending">Submitted</TH>
              <TH>Safety sheet</TH>
            </TRow>
          </THead>
          <TBody>
            {rows.map((row) => (
              <TRow key={row.id} data-testid={`queue-row-${row.id}`}>
                <TD>
                  <Link href={`/moderate/listings/${row.id}`} className="font-medium">
                    {row.title}
                  </Link>
                  {row.resubmission ? (
                    <div className="mt-1">
                      <StateBadge label={RESUBMISSION[row.resubmission]} tone="caution" />
                    </div>
                  ) : null}
                </TD>
                <TD className="whitespace-nowrap">{kindLabel(row.kind, row.magneticSubtype)}</TD>
                <TD>{row.sellerName}</TD>
                <TD>{row.submittedAt ? <RelativeTime iso={row.submittedAt} /> : "—"}</TD>
                <TD className="whitespace-nowrap">
                  <ProductStateBadge kind="policy" state={row.policyStatus} />
                  <span className="ml-2 font-mono text-xs text-graphite-600">rev. {row.policyRevision}</span>
                </TD>
              </TRow>
            ))}
          </TBody>
        </Table>
      )}
    </div>
  );
}
