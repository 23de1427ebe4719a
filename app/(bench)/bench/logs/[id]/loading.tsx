import { Loading, Skeleton, SkeletonTable } from "@/components/ui/skeleton";

export default function LogLoading() {
  return (
    <Loading label="Loading the log" className="space-y-6">
      <Skeleton className="h-10 w-80" />
      <Skeleton className="h-24 w-full" />
      <SkeletonTable rows={4} columns={5} />
    </Loading>
  );
}
