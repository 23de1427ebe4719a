import { Loading, Skeleton } from "@/components/ui/skeleton";

/** The filters and result cards while the search runs; the page header is already there. */
export function CatalogResultsSkeleton() {
  return (
    <Loading label="Loading the catalog" className="grid gap-8 lg:grid-cols-[16rem_1fr]">
      <div className="space-y-4">
        {Array.from({ length: 5 }, (_, i) => (
          <Skeleton key={i} className="h-16 w-full" />
        ))}
      </div>
      <div className="space-y-5">
        <Skeleton className="h-16 w-full" />
        <div className="grid gap-5 sm:grid-cols-2 xl:grid-cols-3">
          {Array.from({ length: 6 }, (_, i) => (
            <div key={i} className="overflow-hidden rounded-md border border-graphite-200 bg-paper-raised">
              <Skeleton className="aspect-[4/3] w-full rounded-none" />
              <div className="space-y-2 p-4">
                <Skeleton className="h-4 w-24" />
                <Skeleton className="h-5 w-full" />
                <Skeleton className="h-6 w-20" />
              </div>
            </div>
          ))}
        </div>
      </div>
    </Loading>
  );
}
