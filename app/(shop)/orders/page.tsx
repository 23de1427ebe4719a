import type { Metadata } from "next";
import Link from "next/link";
import { AccessDenied } from "@/components/access/access-denied";
import { BuyerOrdersTable } from "@/components/orders/buyer-orders-table";
import { ButtonLink } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { listBuyerOrders } from "@/db/queries/orders";
import { checkAccess } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "Your orders" };
export const dynamic = "force-dynamic";

export default async function OrdersPage({ searchParams }: { searchParams: Promise<{ page?: string }> }) {
  const access = await checkAccess();
  if (!access.ok) return <AccessDenied decision={access} next="/orders" />;
  const page = Math.max(1, Math.min(1000, Number.parseInt((await searchParams).page ?? "1", 10) || 1));
  const result = await listBuyerOrders(access.user.id, { page });
  const pages = Math.max(1, Math.ceil(result.total / result.pageSize));
  return (
    <div className="space-y-6">
      <PageHeader title="Your orders" lede="Every order is one seller's part of a checkout: each ships, and is refunded, on its own." />
      {result.items.length === 0 ? (
        <EmptyState title="No orders yet" action={<ButtonLink href="/catalog">Browse the catalog</ButtonLink>}>
          Boards, magnetics and kits you buy show up here with their tracking and refunds.
        </EmptyState>
      ) : (
        <BuyerOrdersTable rows={result.items} />
      )}
      {pages > 1 ? (
        <nav aria-label="Pages" className="flex gap-3 text-sm">
          {page > 1 ? <Link href={`/orders?page=${page - 1}`}>Newer orders</Link> : null}
          <span>
            Page {page} of {pages}
          </span>
          {page < pages ? <Link href={`/orders?page=${page + 1}`}>Older orders</Link> : null}
        </nav>
      ) : null}
    </div>
  );
}
