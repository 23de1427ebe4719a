import type { Metadata } from "next";
import Link from "next/link";
import { ListingCard } from "@/components/catalog/listing-card";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { listLiveListings } from "@/db/queries/catalog";
import { LISTING_KINDS, type ListingKind } from "@/db/schema/listings";

export const metadata: Metadata = { title: "Catalog" };
export const dynamic = "force-dynamic";

export default async function CatalogPage({ searchParams }: { searchParams: Promise<{ q?: string; kind?: string; page?: string }> }) {
  const params = await searchParams;
  const kind = LISTING_KINDS.includes(params.kind as ListingKind) ? (params.kind as ListingKind) : undefined;
  const page = Math.max(1, Math.min(1000, Number.parseInt(params.page ?? "1", 10) || 1));
  const result = await listLiveListings({ q: params.q, kind, page });
  const pages = Math.max(1, Math.ceil(result.total / result.pageSize));
  const href = (p: Record<string, string | undefined>) => {
    const merged = { q: params.q, kind, ...p };
    const qs = new URLSearchParams(Object.entries(merged).filter((e): e is [string, string] => !!e[1]));
    return `/catalog${qs.size ? `?${qs}` : ""}`;
  };
  return (
    <div className="space-y-6">
      <PageHeader title="Catalog" lede="Boards, hand-wound magnetics and kits, each with a safety sheet a moderator has checked." />
      <form className="flex flex-wrap items-end gap-3" role="search" action="/catalog">
        <label className="flex flex-col text-sm font-semibold">
          Search
          <input name="q" type="search" defaultValue={params.q ?? ""} className="mt-1 h-10 w-72 rounded border border-graphite-300 bg-paper-raised px-3 font-normal" />
        </label>
        {kind ? <input type="hidden" name="kind" value={kind} /> : null}
        <button type="submit" className="h-10 rounded bg-copper-600 px-4 text-sm font-medium text-white hover:bg-copper-700">
          Search
        </button>
      </form>
      <nav aria-label="Kinds" className="flex flex-wrap gap-2 text-sm">
        <Link href={href({ kind: undefined, page: undefined })} aria-current={!kind ? "page" : undefined} className="rounded-full border border-graphite-300 px-3 py-1 no-underline aria-[current=page]:border-copper-600 aria-[current=page]:bg-copper-50">
          All
        </Link>
        {LISTING_KINDS.map((k) => (
          <Link key={k} href={href({ kind: k, page: undefined })} aria-current={kind === k ? "page" : undefined} className="rounded-full border border-graphite-300 px-3 py-1 capitalize no-underline aria-[current=page]:border-copper-600 aria-[current=page]:bg-copper-50">
            {k === "magnetic" ? "Magnetics" : `${k}s`}
          </Link>
        ))}
      </nav>
      <p className="text-sm text-graphite-600" aria-live="polite">
        {result.total} {result.total === 1 ? "listing" : "listings"}
      </p>
      {result.items.length === 0 ? (
        <EmptyState title="Nothing matches">Try a shorter search or another kind.</EmptyState>
      ) : (
        <ul className="grid gap-5 sm:grid-cols-2 lg:grid-cols-3" data-testid="catalog-results">
          {result.items.map((item) => (
            <ListingCard key={item.id} item={item} />
          ))}
        </ul>
      )}
      {pages > 1 ? (
        <nav aria-label="Pages" className="flex gap-3 text-sm">
          {page > 1 ? <Link href={href({ page: String(page - 1) })}>Previous page</Link> : null}
          <span>
            Page {page} of {pages}
          </span>
          {page < pages ? <Link href={href({ page: String(page + 1) })}>Next page</Link> : null}
        </nav>
      ) : null}
    </div>
  );
}
