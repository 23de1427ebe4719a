import Link from "next/link";
import { ButtonLink } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { Panel } from "@/components/ui/panel";
import { questionsForListing } from "@/db/queries/qa";
import { QuestionList } from "./question-list";

/**
 * The listing page's Q&A panel: the newest visible questions about the listing, a link to all of
 * them and to ask a new one. A server component; place it anywhere on app/(shop)/listings/[slug]/page.tsx.
 */
export async function ListingQuestions({ listingId, canAsk = true }: { listingId: string; canAsk?: boolean }) {
  const { rows, total } = await questionsForListing(listingId, 5);
  const ask = canAsk ? (
    <ButtonLink href={`/questions/new?listing=${listingId}`} variant="secondary" size="sm">
      Ask about this listing
    </ButtonLink>
  ) : null;
  return (
    <Panel title="Questions from builders" actions={ask}>
      <div className="space-y-3" data-testid="listing-questions">
        {rows.length === 0 ? (
          <EmptyState title="No questions yet">Ask the seller and other builders about this listing; answers show here.</EmptyState>
        ) : (
          <>
            <QuestionList rows={rows} showListing={false} />
            {total > rows.length ? (
              <p className="text-sm">
                <Link href={`/questions?listing=${listingId}`}>All {total} questions about this listing</Link>
              </p>
            ) : null}
          </>
        )}
      </div>
    </Panel>
  );
}
