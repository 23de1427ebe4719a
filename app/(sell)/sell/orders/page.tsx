import type { Metadata } from "next";
import Link from "next/link";
import { AccessDenied } from "@/components/access/access-denied";
import { SellerOrdersTable } from "@/components/orders/seller-orders-table";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { productState } from "@/components/ui/state-badge";
import { listSellerOrders } from "@/db/queries/orders";
import type { OrderState } from "@/db/schema/orders";
import { checkAccess } from "@/lib/auth/guard";
import { sellerOrdersQuerySchema, type SellerOrdersQuery } from "@/lib/validations/orders";

export const metadata: Metadata = { title: "Incoming orders" };
export const dynamic = "force-dynamic";

const FILTERS: (OrderState | undefined)[] = [undefined, "paid", "shipped", "delivered", "refunded", "cancelled"];

function hrefFor(query: SellerOrdersQuery, change: Partial<SellerOrdersQuery>): string {
  const merged = { ...query, ...change };
  const params = new URLSearchParams();
  if (merged.state) params.set("state", merged.state);
  if (merged.sort !== "date") params.set("sort", merged.sort);
  if (merged.dir !== "desc") params.set("dir", merged.dir);
  if (merged.page > 1) params.set("page", String(merged.page));
  return `/sell/orders${params.size ? `?${params}` : ""}`;
}

export default async function SellerOrdersPage({ searchParams }: { searchParams: Promise<Record<string, string | undefined>> }) {
  const access = await checkAccess(["seller"]);
  if (!access.ok) return <AccessDenied decision={access} next="/sell/orders" />;
  const query = sellerOrdersQuerySchema.parse(await searchParams);
  const result = await listSellerOrders(access.user.id, query);
  const pages = Math.max(1, Math.ceil(result.total / result.pageSize));
  const link = (change: Partial<SellerOrdersQuery>) => hrefFor(query, change);
  return (
    <div className="space-y-6">
      <PageHeader
        eyebrow={<Link href="/sell">Seller desk</Link>}
        title="Incoming orders"
        lede="Ship paid orders with a tracking reference, cancel before shipping, refund part of a line, and answer return requests."
      />
      <nav aria-label="Filter by state" className="flex flex-wrap gap-2 text-sm">
        {FILTERS.map((state) => (
          <Link
            key={state ?? "all"}
            href={link({ state, page: 1 })}
            aria-current={query.state === state ? "page" : undefined}
            className="rounded-full border border-graphite-300 px-3 py-1 no-underline aria-[current=page]:border-copper-600 aria-[current=page]:bg-copper-50"
          >
            {state ? productState("order", state).label : "All"}
          </Link>
        ))}
      </nav>
      <p className="text-sm text-graphite-600" aria-live="polite">
        {result.total} {result.total === 1 ? "order" : "orders"}
      </p>
      {result.items.length === 0 ? (
        <EmptyState title={query.state ? `No ${productState("order", query.state).label.toLowerCase()} orders` : "No orders yet"}>
          Orders appear here once the buyer&apos;s payment has been confirmed.
        </EmptyState>
      ) : (
        <SellerOrdersTable rows={result.items} query={query} hrefFor={link} />
      )}
      {pages > 1 ? (
        <nav aria-label="Pages" className="flex gap-3 text-sm">
          {query.page > 1 ? <Link href={link({ page: query.page - 1 })}>Previous page</Link> : null}
          <span>
            Page {query.page} of {pages}
          </span>
          {query.page < pages ? <Link href={link({ page: query.page + 1 })}>Next page</Link> : null}
        </nav>
      ) : null}
    </div>
  );
}
