import { Loading, Skeleton, SkeletonTable } from "@/components/ui/skeleton";

// At least a screen tall: the log always is, so the footer is below the fold from the first paint
// and does not jump when the log replaces this (layout shift, CLS).
export default function LogLoading() {
  return (
    <Loading label="Loading the log" className="min-h-screen space-y-6">
      <Skeleton className="h-10 w-80" />
      <Skeleton className="h-24 w-full" />
      <SkeletonTable rows={4} columns={5} />
    </Loading>
  );
}
