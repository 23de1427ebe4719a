import { Loading, SkeletonTable } from "@/components/ui/skeleton";

export default function OrdersLoading() {
  return (
    <Loading label="Loading your orders">
      <SkeletonTable rows={6} columns={5} />
    </Loading>
  );
}
