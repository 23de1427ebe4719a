import { Loading, Skeleton } from "@/components/ui/skeleton";

export default function CaptureLoading() {
  return (
    <Loading label="Loading the capture" className="space-y-6">
      <Skeleton className="h-10 w-80" />
      <Skeleton className="h-16 w-full" />
      <Skeleton className="h-96 w-full" />
    </Loading>
  );
}
