import { SkeletonText } from "@/components/ui/skeleton";

export default function ReviewersLoading() {
  return (
    <div className="space-y-6">
      <SkeletonText lines={2} />
      <SkeletonText lines={6} />
    </div>
  );
}
