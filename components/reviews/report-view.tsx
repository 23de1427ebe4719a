import { Markdown } from "@/components/markdown";
import { Alert } from "@/components/ui/alert";
import { Panel } from "@/components/ui/panel";
import type { SessionDetail } from "@/db/queries/reviews";
import { STAGE_LABELS } from "@/lib/listings/labels";
import { VERDICT_LABELS } from "@/lib/reviews/labels";
import { VerdictTag } from "./verdict-tag";

const dateFormat = new Intl.DateTimeFormat("en-GB", { dateStyle: "medium", timeStyle: "short", timeZone: "UTC" });

/** The delivered report: the verdict per checkpoint with the reviewer's comments, then the summary. */
export function ReportView({ report, reviewerName }: { report: NonNullable<SessionDetail["report"]>; reviewerName: string }) {
  const stops = report.verdicts.filter((v) => v.verdict === "stop");
  return (
    <Panel title="The report">
      <div className="space-y-4" data-testid="review-report">
        <p className="text-sm text-graphite-600">
          By {reviewerName}, delivered <time dateTime={report.createdAt.toISOString()}>{dateFormat.format(report.createdAt)} UTC</time>.
        </p>
        {stops.length > 0 ? (
          <Alert tone="stop" title={`Do not power up again until ${stops.length === 1 ? "this point is" : "these points are"} fixed`}>
            {stops.map((s) => s.checkpointName).join(", ")}. Disconnect mains and check the bus is discharged before touching anything.
          </Alert>
        ) : null}
        <ol className="space-y-3">
          {report.verdicts.map((v) => (
            <li key={v.checkpointId} className="rounded border border-graphite-200 bg-paper px-3 py-2" data-testid="report-verdict" data-verdict={v.verdict}>
              <div className="flex flex-wrap items-baseline gap-x-3 gap-y-1">
                <span className="font-semibold">{v.checkpointName}</span>
                <VerdictTag verdict={v.verdict} />
                <span className="text-xs text-graphite-600">{STAGE_LABELS[v.stage]}</span>
              </div>
              <p className="text-sm text-graphite-600">{VERDICT_LABELS[v.verdict].meaning}</p>
              {v.comment !== "" ? <p className="mt-1 text-sm whitespace-pre-line">{v.comment}</p> : null}
            </li>
          ))}
        </ol>
        <section>
          <h3 className="mb-1 font-semibold">Summary</h3>
          <Markdown minHeadingLevel={4}>{report.summaryMd}</Markdown>
        </section>
      </div>
    </Panel>
  );
}
