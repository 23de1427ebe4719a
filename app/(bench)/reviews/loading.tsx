import { SkeletonTable, SkeletonText } from "@/components/ui/skeleton";

export default function ReviewsLoading() {
  return (
    <div className="space-y-6">
      <SkeletonText lines={2} />
      <SkeletonTable rows={4} columns={6} />
    </div>
  );
}
