import type { Metadata } from "next";
import { Suspense } from "react";
import { PageHeader } from "@/components/ui/page-header";
import { lenientCatalogQuery } from "@/lib/validations/catalog";
import { CatalogResults } from "./catalog-results";
import { CatalogResultsSkeleton } from "./catalog-results-skeleton";

export const metadata: Metadata = { title: "Catalog" };
export const dynamic = "force-dynamic";

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

// The header goes out with the first bytes and the results stream in behind it, so the page
// paints its largest text before the search has run (Lighthouse's LCP on a large catalog).
// No key on the boundary: refining a search re-renders the page in a transition, which keeps the
// results on screen instead of the skeleton.
export default async function CatalogPage({ searchParams }: Props) {
  const { query, ignored } = lenientCatalogQuery(await searchParams);
  return (
    <div className="space-y-6">
      <PageHeader title="Catalog" lede="Boards, hand-wound magnetics and kits, each with a safety sheet a moderator has checked." />
      <Suspense fallback={<CatalogResultsSkeleton />}>
        <CatalogResults query={query} ignoredMessages={Object.values(ignored).flat()} />
      </Suspense>
    </div>
  );
}
