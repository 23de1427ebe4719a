import type { Metadata } from "next";
import Link from "next/link";
import { QuestionList } from "@/components/qa/question-list";
import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { cx } from "@/components/ui/cx";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { listingById, listQuestions } from "@/db/queries/qa";
import { getSessionUser } from "@/lib/auth/guard";
import { questionFiltersSchema, type QuestionFilters } from "@/lib/validations/qa";

export const metadata: Metadata = { title: "Questions" };
export const dynamic = "force-dynamic";

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

function href(filters: QuestionFilters, change: Partial<QuestionFilters>): string {
  const next = { ...filters, ...change };
  const params = new URLSearchParams();
  if (next.listing) params.set("listing", next.listing);
  if (next.show !== "newest") params.set("show", next.show);
  if (next.page > 1) params.set("page", String(next.page));
  const query = params.toString();
  return query ? `/questions?${query}` : "/questions";
}

export default async function QuestionsPage({ searchParams }: Props) {
  const raw = await searchParams;
  const flagged = typeof raw.flagged === "string" ? raw.flagged : undefined;
  const filters = questionFiltersSchema.parse(Object.fromEntries(Object.entries(raw).map(([k, v]) => [k, Array.isArray(v) ? v[0] : v])));
  const viewer = await getSessionUser();
  const [{ rows, hasMore }, listing] = await Promise.all([
    listQuestions(viewer, { listingId: filters.listing, unanswered: filters.show === "unanswered", page: filters.page }),
    filters.listing ? listingById(filters.listing) : null,
  ]);
  const tabs: { show: QuestionFilters["show"]; label: string }[] = [
    { show: "newest", label: "Newest" },
    { show: "unanswered", label: "Unanswered" },
  ];

  return (
    <div className="space-y-6">
      <PageHeader
        eyebrow="Bench help"
        title="Questions"
        lede="Ask other builders about a listing or about your own bring-up; answers come from the community, read by our moderators."
        actions={<ButtonLink href={filters.listing ? `/questions/new?listing=${filters.listing}` : "/questions/new"}>Ask a question</ButtonLink>}
      />
      {flagged === "hidden" ? (
        <Alert tone="info" title="Thank you for flagging" role="status">
          Enough members have flagged that question that it is now hidden until a moderator reviews it.
        </Alert>
      ) : null}
      <nav aria-label="Which questions" className="flex flex-wrap items-center gap-3 border-b border-graphite-200">
        <ul className="-mb-px flex gap-1">
          {tabs.map((tab) => (
            <li key={tab.show}>
              <Link
                href={href(filters, { show: tab.show, page: 1 })}
                aria-current={filters.show === tab.show ? "page" : undefined}
                className={cx(
                  "inline-block border-b-2 px-3 py-2 text-sm font-medium no-underline",
                  filters.show === tab.show ? "border-copper-600 text-graphite-900" : "border-transparent text-graphite-600 hover:text-graphite-900",
                )}
              >
                {tab.label}
              </Link>
            </li>
          ))}
        </ul>
        {filters.listing ? (
          <p className="pb-2 text-sm text-graphite-700" data-testid="listing-filter">
            About {listing ? listing.public ? <Link href={`/listings/${listing.slug}`}>{listing.title}</Link> : listing.title : "one listing"} ·{" "}
            <Link href={href(filters, { listing: undefined, page: 1 })}>all questions</Link>
          </p>
        ) : null}
      </nav>
      {rows.length === 0 ? (
        <EmptyState
          title={filters.show === "unanswered" ? "Every question has an answer" : "No questions yet"}
          action={<ButtonLink href="/questions/new" variant="secondary">Ask the first one</ButtonLink>}
        >
          {filters.page > 1 ? "There are no more questions on this page." : "Questions other builders ask show here, newest first."}
        </EmptyState>
      ) : (
        <QuestionList rows={rows} />
      )}
      {filters.page > 1 || hasMore ? (
        <nav aria-label="Pages" className="flex justify-between text-sm">
          {filters.page > 1 ? <Link href={href(filters, { page: filters.page - 1 })}>Newer questions</Link> : <span />}
          {hasMore ? <Link href={href(filters, { page: filters.page + 1 })}>Older questions</Link> : <span />}
        </nav>
      ) : null}
    </div>
  );
}
