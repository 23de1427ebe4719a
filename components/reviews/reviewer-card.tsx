import { Markdown } from "@/components/markdown";
import { ButtonLink } from "@/components/ui/button";
import { Card } from "@/components/ui/card";
import type { ReviewerCard as Reviewer } from "@/db/queries/reviews";
import { formatMoney } from "@/lib/format/money";
import { ExpertiseTags } from "./expertise-tags";

/** One reviewer on the list: who, what they know, their price per review, and the way to book them. */
export function ReviewerCard({ reviewer, bookable }: { reviewer: Reviewer; bookable: boolean }) {
  return (
    <Card className="space-y-3" data-testid="reviewer-card" data-reviewer={reviewer.userId}>
      <header className="flex flex-wrap items-baseline justify-between gap-2">
        <h2 className="text-xl font-semibold">{reviewer.name}</h2>
        <p className="text-sm text-graphite-600">
          <span className="font-mono text-base font-semibold text-graphite-900" data-testid="reviewer-price">
            {formatMoney(reviewer.priceMinor, reviewer.currency)}
          </span>{" "}
          per review
        </p>
      </header>
      <ExpertiseTags expertise={reviewer.expertise} />
      <Markdown minHeadingLevel={3}>{reviewer.profileMd}</Markdown>
      {bookable ? (
        <ButtonLink href={`/reviews/new?reviewer=${encodeURIComponent(reviewer.userId)}`} aria-label={`Book a review with ${reviewer.name}`}>
          Book a review
        </ButtonLink>
      ) : null}
    </Card>
  );
}
