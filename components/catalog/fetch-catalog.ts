import type { CatalogResult } from "@/db/queries/catalog";

export class CatalogFetchError extends Error {}

/** One page of the catalog from GET /api/listings; `search` is a catalogSearchString. */
export async function fetchCatalog(search: string, signal?: AbortSignal): Promise<CatalogResult> {
  const response = await fetch(`/api/listings${search ? `?${search}` : ""}`, { signal, headers: { accept: "application/json" } });
  if (!response.ok) throw new CatalogFetchError(`The catalog answered ${response.status}.`);
  return (await response.json()) as CatalogResult;
}
