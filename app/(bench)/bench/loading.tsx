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
