import { Loading, SkeletonTable } from "@/components/ui/skeleton";

export default function SellerOrdersLoading() {
  return (
    <Loading label="Loading your orders">
      <SkeletonTable rows={8} columns={8} />
    </Loading>
  );
}
