import type { Metadata } from "next";
import { CatalogBrowser } from "@/components/catalog/catalog-browser";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { listCatalogSellers, searchListings } from "@/db/queries/catalog";
import { lenientCatalogQuery } from "@/lib/validations/catalog";

export const metadata: Metadata = { title: "Catalog" };
export const dynamic = "force-dynamic";

type Props = { searchParams: Promise<Record<string, string | string[] | undefined>> };

export default async function CatalogPage({ searchParams }: Props) {
  const { query, ignored } = lenientCatalogQuery(await searchParams);
  const [result, sellers] = await Promise.all([searchListings(query), listCatalogSellers()]);
  const ignoredMessages = Object.values(ignored).flat();
  return (
    <div className="space-y-6">
      <PageHeader title="Catalog" lede="Boards, hand-wound magnetics and kits, each with a safety sheet a moderator has checked." />
      {ignoredMessages.length > 0 ? (
        <Alert tone="caution" title="Part of this address was not understood">
          Those filters were left out: {ignoredMessages.join(" ")}
        </Alert>
      ) : null}
      <CatalogBrowser initialQuery={query} initialResult={result} sellers={sellers} />
    </div>
  );
}
