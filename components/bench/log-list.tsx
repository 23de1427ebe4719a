import Link from "next/link";
import { Card } from "@/components/ui/card";
import { StateBadge } from "@/components/ui/state-badge";
import type { LogSummary } from "@/db/queries/bench";
import { formatDay } from "./format";
import { StageProgress } from "./stage-progress";

/** The member's logs, each with its kit and its progress stage by stage. */
export function LogList({ logs }: { logs: LogSummary[] }) {
  return (
    <ul className="space-y-4" aria-label="Your bring-up logs">
      {logs.map((log) => {
        const total = log.progress.reduce((n, s) => n + s.checkpoints, 0);
        const read = log.progress.reduce((n, s) => n + s.read, 0);
        return (
          <li key={log.id}>
            <Card data-testid="log-summary" data-log-id={log.id} className="space-y-3">
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <h3 className="text-lg font-semibold">
                  <Link href={`/bench/logs/${log.id}`}>{log.title}</Link>
                </h3>
                <StateBadge label={log.visibility === "public" ? "Public" : "Private"} tone={log.visibility === "public" ? "active" : "neutral"} />
              </div>
              <p className="text-sm text-graphite-600">
                {log.kit ? (
                  <>
                    Kit: <Link href={`/listings/${log.kit.slug}`}>{log.kit.title}</Link>
                  </>
                ) : (
                  "A build of your own"
                )}
                {" · "}
                <span className="figure font-mono">{read}</span> of <span className="figure font-mono">{total}</span> checkpoints read · last worked on {formatDay(log.updatedAt)}
              </p>
              <StageProgress progress={log.progress} caption={`Progress of ${log.title}`} captionHidden />
            </Card>
          </li>
        );
      })}
    </ul>
  );
}
