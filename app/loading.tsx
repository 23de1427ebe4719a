import { Loading, SkeletonText } from "@/components/ui/skeleton";

export default function RootLoading() {
  return (
    <Loading label="Loading the page">
      <SkeletonText lines={4} />
    </Loading>
  );
}
