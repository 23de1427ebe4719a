import { Loading, Skeleton } from "@/components/ui/skeleton";

// At least a screen tall: the capture page always is, so the footer is below the fold from the
// first paint and does not jump when the page replaces this (layout shift, CLS).
export default function CaptureLoading() {
  return (
    <Loading label="Loading the capture" className="min-h-screen space-y-6">
      <Skeleton className="h-10 w-80" />
      <Skeleton className="h-16 w-full" />
      <Skeleton className="h-96 w-full" />
    </Loading>
  );
}
