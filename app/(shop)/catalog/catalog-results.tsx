import { CatalogBrowser } from "@/components/catalog/catalog-browser";
import { QueryProvider } from "@/components/query-provider";
import { Alert } from "@/components/ui/alert";
import { listCatalogSellers, searchListings } from "@/db/queries/catalog";
import type { CatalogQuery } from "@/lib/validations/catalog";

/** The part of the catalog that waits for the database: streamed in after the page header. */
export async function CatalogResults({ query, ignoredMessages }: { query: CatalogQuery; ignoredMessages: string[] }) {
  const [result, sellers] = await Promise.all([searchListings(query), listCatalogSellers()]);
  return (
    <>
      {ignoredMessages.length > 0 ? (
        <Alert tone="caution" title="Part of this address was not understood">
          Those filters were left out: {ignoredMessages.join(" ")}
        </Alert>
      ) : null}
      <QueryProvider>
        <CatalogBrowser initialQuery={query} initialResult={result} sellers={sellers} />
      </QueryProvider>
    </>
  );
}
