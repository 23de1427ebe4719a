import { SkeletonTable, SkeletonText } from "@/components/ui/skeleton";

export default function ModerationLoading() {
  return (
    <div className="space-y-6">
      <SkeletonText lines={2} />
      <SkeletonTable rows={6} columns={5} />
    </div>
  );
}
