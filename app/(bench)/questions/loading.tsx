import { SkeletonText } from "@/components/ui/skeleton";

export default function QuestionsLoading() {
  return (
    <div className="space-y-6">
      <SkeletonText lines={2} />
      <SkeletonText lines={8} />
    </div>
  );
}
