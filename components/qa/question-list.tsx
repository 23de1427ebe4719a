import Link from "next/link";
import type { QuestionListRow } from "@/db/queries/qa";
import { StateBadge } from "@/components/ui/state-badge";
import { answerCountLabel, formatPostDate, POST_STATE_LABELS } from "./labels";

/** Questions as a list of titles with who asked, about what, when, and how many answers. */
export function QuestionList({ rows, showListing = true }: { rows: readonly QuestionListRow[]; showListing?: boolean }) {
  return (
    <ol className="divide-y divide-graphite-200 rounded-md border border-graphite-200 bg-paper-raised" data-testid="question-list">
      {rows.map((q) => (
        <li key={q.id} className="flex flex-wrap items-start justify-between gap-3 px-4 py-3" data-testid={`question-row-${q.id}`}>
          <div className="min-w-0 flex-1 space-y-1">
            <Link href={`/questions/${q.id}`} className="font-semibold break-words">
              {q.title}
            </Link>
            <p className="text-sm text-graphite-600">
              {q.mine ? "You asked" : `${q.authorName} asked`} · <time dateTime={q.createdAt.toISOString()}>{formatPostDate(q.createdAt)}</time>
              {showListing ? (
                q.listing ? (
                  <>
                    {" "}
                    · about{" "}
                    {q.listing.public ? <Link href={`/listings/${q.listing.slug}`}>{q.listing.title}</Link> : <span>{q.listing.title}</span>}
                  </>
                ) : (
                  " · general bench"
                )
              ) : null}
            </p>
          </div>
          <div className="flex shrink-0 flex-wrap items-center gap-2">
            {q.state !== "visible" ? <StateBadge label={POST_STATE_LABELS[q.state].label} tone={POST_STATE_LABELS[q.state].tone} /> : null}
            <StateBadge label={answerCountLabel(q.answerCount)} tone={q.answered ? "clear" : "neutral"} />
          </div>
        </li>
      ))}
    </ol>
  );
}
