// Only the desk itself shows a skeleton: a log or a capture page is sent whole, so its heading is in
// the first HTML (largest contentful paint) and a foreign id answers 404, not a streamed not-found.
import { Loading, Skeleton } from "@/components/ui/skeleton";

export default function BenchLoading() {
  return (
    <Loading label="Loading your bench" className="space-y-6">
      <Skeleton className="h-10 w-64" />
      <Skeleton className="h-48 w-full" />
      <Skeleton className="h-48 w-full" />
    </Loading>
  );
}
