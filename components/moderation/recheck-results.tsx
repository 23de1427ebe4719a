import Link from "next/link";
import type { RecheckRun } from "@/db/queries/moderation";
import { EmptyState } from "@/components/ui/empty-state";
import { ProductStateBadge } from "@/components/ui/state-badge";
import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";
import { topicLabel } from "@/lib/policy";
import { RelativeTime } from "./relative-time";

function Count({ label, value, testId }: { label: string; value: number; testId: string }) {
  return (
    <div className="rounded border border-graphite-200 bg-paper-sunken px-3 py-2">
      <dt className="text-xs font-semibold tracking-wide text-graphite-600 uppercase">{label}</dt>
      <dd className="figure font-mono text-xl text-graphite-900" data-testid={testId}>
        {value}
      </dd>
    </div>
  );
}

/** Per published revision: how many live listings it cleared, failed and held, and the failing ones with their grace date. */
export function RecheckResults({ runs }: { runs: RecheckRun[] }) {
  if (runs.length === 0) {
    return <EmptyState title="No policy revision has been published yet">When an admin publishes one, every live listing is checked against it and the results appear here.</EmptyState>;
  }
  return (
    <div className="space-y-8">
      {runs.map((run) => (
        <section key={run.revision} aria-labelledby={`recheck-${run.revision}`} data-testid={`recheck-${run.revision}`} className="space-y-3">
          <h3 id={`recheck-${run.revision}`} className="font-semibold text-graphite-900">
            Revision {run.revision} · published <RelativeTime iso={run.publishedAt} showIso={false} /> · grace {run.graceDays} days
          </h3>
          <p className="max-w-reading text-sm text-graphite-700">{run.summary}</p>
          <dl className="grid max-w-xl grid-cols-2 gap-2 sm:grid-cols-4">
            <Count label="Checked" value={run.counts.checked} testId={`recheck-${run.revision}-checked`} />
            <Count label="Clear" value={run.counts.clear} testId={`recheck-${run.revision}-clear`} />
            <Count label="Failing" value={run.counts.failing} testId={`recheck-${run.revision}-failing`} />
            <Count label="Held" value={run.counts.held} testId={`recheck-${run.revision}-held`} />
          </dl>
          {run.counts.checked === 0 ? <p className="text-sm text-graphite-600">The re-check has not run yet, or there were no live listings.</p> : null}
          {run.failing.length > 0 ? (
            <Table caption={`Listings that failed revision ${run.revision}`} captionHidden>
              <THead>
                <TRow>
                  <TH>Listing</TH>
                  <TH>Seller</TH>
                  <TH>Sheet</TH>
                  <TH>What fails</TH>
                  <TH>Grace until</TH>
                  <TH>Outcome</TH>
                </TRow>
              </THead>
              <TBody>
                {run.failing.map((f) => (
                  <TRow key={f.listingId}>
                    <TD>
                      <Link href={`/moderate/listings/${f.listingId}`} className="font-medium">
                        {f.title}
                      </Link>
                      <div className="mt-1">
                        <ProductStateBadge kind="listing" state={f.listingState} />
                      </div>
                    </TD>
                    <TD>{f.sellerName}</TD>
                    <TD>
                      <ProductStateBadge kind="policy" state={f.status} />
                    </TD>
                    <TD className="text-sm">{[...new Set(f.findings.map((x) => topicLabel(x.topic)))].join(", ")}</TD>
                    <TD>{f.graceUntil ? <RelativeTime iso={f.graceUntil} /> : "—"}</TD>
                    <TD className="text-sm">
                      {f.heldAt ? "Held when the grace ran out" : f.resolvedAt ? "Fixed in time" : f.listingState === "live" ? "Grace running" : "Back with the seller or in review"}
                    </TD>
                  </TRow>
                ))}
              </TBody>
            </Table>
          ) : null}
        </section>
      ))}
    </div>
  );
}
