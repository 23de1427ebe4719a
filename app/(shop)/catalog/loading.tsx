import { Skeleton } from "@/components/ui/skeleton";
import { CatalogResultsSkeleton } from "./catalog-results-skeleton";

// The results skeleton carries the one "Loading the catalog" status; the header blocks are silent.
export default function CatalogLoading() {
  return (
    <div className="space-y-6">
      <div className="space-y-3 border-b border-graphite-200 pb-4">
        <Skeleton className="h-9 w-48" />
        <Skeleton className="h-5 w-full max-w-xl" />
      </div>
      <CatalogResultsSkeleton />
    </div>
  );
}
