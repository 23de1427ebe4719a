"use client";

import { keepPreviousData, useQuery } from "@tanstack/react-query";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useEffect, useRef, useState, type FormEvent } from "react";
import type { CatalogResult } from "@/db/queries/catalog";
import { groupThousands } from "@/lib/format/plain";
import { CATALOG_DEPTH, catalogCountText } from "@/lib/listings/catalog-limits";
import { Button } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { ErrorState } from "@/components/ui/error-state";
import { SelectField, TextField } from "@/components/ui/field";
import { catalogSearchString, effectiveSort, type CatalogQuery, type CatalogSort } from "@/lib/validations/catalog-query";
import { CatalogFilters, hasFilters, type CatalogSeller, type FilterPatch } from "./catalog-filters";
import { CatalogPagination } from "./catalog-pagination";
import { fetchCatalog } from "./fetch-catalog";
import { ListingCard } from "./listing-card";
import { useDebouncedValue } from "./use-debounced-value";

const TYPING_PAUSE_MS = 250;

const SORT_LABELS: Record<CatalogSort, string> = {
  relevance: "Best match",
  newest: "Newest first",
  "price-asc": "Price, low to high",
  "price-desc": "Price, high to low",
};

export type CatalogBrowserProps = {
  initialQuery: CatalogQuery;
  /** the server-rendered first page, so the first paint has results and no loading flash */
  initialResult: CatalogResult;
  sellers: readonly CatalogSeller[];
};

/**
 * The catalog's search, filters, sort and pages. The query lives in the URL: every change
 * replaces it (no new history entry, no scroll, no page load), so a reload or a shared link
 * shows the same results; results come from GET /api/listings while the previous ones stay on
 * screen.
 */
export function CatalogBrowser({ initialQuery, initialResult, sellers }: CatalogBrowserProps) {
  const pathname = usePathname();
  const router = useRouter();
  const urlSearch = useSearchParams().toString();
  // The server page parses the URL (lib/validations/catalog.ts) and renders again for each new one,
  // so its query is the URL's; the schema never has to come to the browser.
  const initialSearch = catalogSearchString(initialQuery);
  const [query, setQuery] = useState<CatalogQuery>(initialQuery);
  const [text, setText] = useState(initialQuery.q ?? "");
  const resultsRef = useRef<HTMLHeadingElement>(null);

  const settledText = useDebouncedValue(text, TYPING_PAUSE_MS);
  useEffect(() => {
    const q = settledText.trim() || undefined;
    setQuery((prev) => (prev.q === q ? prev : { ...prev, q, page: undefined }));
  }, [settledText]);

  const search = catalogSearchString(query);
  const results = useQuery({
    queryKey: ["catalog", search],
    queryFn: ({ signal }) => fetchCatalog(search, signal),
    placeholderData: keepPreviousData,
    initialData: search === initialSearch ? initialResult : undefined,
  });

  // Replacing, not pushing: refining a search is not a step to go back through. The router
  // renders the page again for each new URL; those renders can land after the person has typed
  // on, so the URLs we asked for are remembered and not read back as a new search.
  const requested = useRef<string[]>([]);
  useEffect(() => {
    if (window.location.search.replace(/^\?/, "") === search) return;
    requested.current.push(search);
    router.replace(search ? `${pathname}?${search}` : pathname, { scroll: false });
  }, [search, pathname, router]);

  // Going back to this page can restore the server's earlier render under a later URL; then the
  // URL is the truth. Rare, so the parser is loaded only when the URL is not the render's.
  useEffect(() => {
    if (urlSearch === initialSearch) return;
    let current = true;
    void import("@/lib/validations/catalog").then(({ lenientCatalogQuery }) => {
      const fromUrl = lenientCatalogQuery(new URLSearchParams(urlSearch)).query;
      if (!current || catalogSearchString(fromUrl) === initialSearch) return;
      setQuery(fromUrl);
      setText(fromUrl.q ?? "");
    });
    return () => {
      current = false;
    };
    // Once, for the URL the page was restored under.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);

  // A URL we did not ask for (a link to /catalog?kind=kit, the header's Catalog link) is a new
  // search; the server has rendered it, parsed, as the new initial query.
  useEffect(() => {
    const next = initialQuery;
    const canonical = initialSearch;
    const ours = requested.current.indexOf(canonical);
    if (ours >= 0) {
      requested.current.splice(0, ours + 1);
      return;
    }
    if (canonical === search) return;
    setQuery(next);
    setText(next.q ?? "");
    // Only a new render for another URL is news; the query moving on is not.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [initialSearch]);

  const update = (patch: FilterPatch) => setQuery((prev) => ({ ...prev, ...patch, page: undefined }));
  const clearFilters = () => setQuery((prev) => ({ q: prev.q, sort: prev.sort }));
  const goToPage = (page: number) => {
    setQuery((prev) => ({ ...prev, page }));
    resultsRef.current?.scrollIntoView({ block: "start" });
  };
  const searchNow = (event: FormEvent) => {
    // Enter searches at once instead of waiting for the pause.
    event.preventDefault();
    const q = text.trim() || undefined;
    setQuery((prev) => (prev.q === q ? prev : { ...prev, q, page: undefined }));
  };

  const data = results.data ?? initialResult;
  const pages = Math.max(1, Math.ceil(data.total / data.pageSize));
  const updating = results.isFetching && results.isPlaceholderData;
  const sort = effectiveSort(query);
  const hrefFor = (page: number) => {
    const s = catalogSearchString({ ...query, page });
    return s ? `${pathname}?${s}` : pathname;
  };

  return (
    <div className="grid gap-8 lg:grid-cols-[16rem_1fr]">
      <aside aria-label="Filters" className="lg:order-1">
        <CatalogFilters query={query} sellers={sellers} onChange={update} onClear={clearFilters} />
      </aside>

      <div className="min-w-0 space-y-5 lg:order-2">
        <div className="flex flex-wrap items-end gap-4">
          <form role="search" aria-label="Catalog" onSubmit={searchNow} action={pathname} className="min-w-64 flex-1">
            <TextField
              label="Search the catalog"
              name="q"
              type="search"
              value={text}
              onChange={(e) => setText(e.target.value)}
              placeholder="e.g. output choke 20 µH"
              autoComplete="off"
              spellCheck={false}
            />
          </form>
          <div className="w-52">
            <SelectField
              label="Sort by"
              value={sort}
              onChange={(e) => setQuery((prev) => ({ ...prev, sort: e.target.value as CatalogSort, page: undefined }))}
              options={(Object.keys(SORT_LABELS) as CatalogSort[]).map((s) => ({
                value: s,
                label: SORT_LABELS[s],
                // Without words to match there is nothing to rank by.
                disabled: s === "relevance" && !query.q,
              }))}
            />
          </div>
        </div>

        <div className="flex flex-wrap items-baseline justify-between gap-2">
          <h2 ref={resultsRef} className="scroll-mt-4 text-lg font-semibold text-graphite-900">
            Results
          </h2>
          <p role="status" aria-live="polite" aria-atomic="true" className="text-sm text-graphite-700" data-testid="catalog-count">
            {countText(data.total, data.totalCapped, query.q)}
            {pages > 1 ? `, page ${data.page} of ${pages}` : ""}
            {updating ? <span className="ml-2 text-graphite-500">Updating…</span> : null}
          </p>
        </div>

        {results.isError && !results.isFetching ? (
          <ErrorState
            title="The results could not be updated"
            action={
              <Button variant="secondary" onClick={() => void results.refetch()}>
                Try again
              </Button>
            }
          >
            The list below may be out of date. Check your connection and try again.
          </ErrorState>
        ) : null}

        {data.items.length === 0 ? (
          <EmptyState
            title="Nothing matches"
            action={
              hasFilters(query) ? (
                <Button variant="secondary" onClick={clearFilters}>
                  Clear filters
                </Button>
              ) : undefined
            }
          >
            {query.q ? "Try fewer words, another spelling, or fewer filters." : "No live listing matches these filters."}
          </EmptyState>
        ) : (
          <ul
            className={`grid gap-5 transition-opacity sm:grid-cols-2 xl:grid-cols-3 ${updating ? "opacity-60" : ""}`}
            aria-busy={updating}
            data-testid="catalog-results"
          >
            {data.items.map((item) => (
              <ListingCard key={item.id} item={item} />
            ))}
          </ul>
        )}

        {data.totalCapped ? (
          <p className="text-sm text-graphite-700" data-testid="catalog-depth-note">
            {query.q
              ? `A search sorts the ${groupThousands(CATALOG_DEPTH)} newest listings that match. Add words or filters to narrow it.`
              : `Pages go as far as the first ${groupThousands(CATALOG_DEPTH)} listings. Filters narrow the list.`}
          </p>
        ) : null}
        <CatalogPagination page={data.page} pages={pages} hrefFor={hrefFor} onPage={goToPage} />
      </div>
    </div>
  );
}

function countText(total: number, capped: boolean, q: string | undefined): string {
  const count = catalogCountText(total, capped);
  return q ? `${count} for “${q}”` : count;
}
