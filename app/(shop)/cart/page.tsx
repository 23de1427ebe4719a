import type { Metadata } from "next";
import { CartGroups, CartTotals } from "@/components/cart/cart-groups";
import { CartLineControls } from "@/components/cart/cart-line-controls";
import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { listCartLines } from "@/db/queries/cart";
import { getSessionUser } from "@/lib/auth/guard";
import { mixedCurrencyMessage, summariseCart } from "@/lib/checkout/cart-summary";
import { currentCartOwner } from "@/lib/checkout/cart-owner";

export const metadata: Metadata = { title: "Your cart" };
export const dynamic = "force-dynamic";

export default async function CartPage({ searchParams }: { searchParams: Promise<{ cancelled?: string }> }) {
  const [{ cancelled }, user] = await Promise.all([searchParams, getSessionUser()]);
  const owner = await currentCartOwner(user);
  const lines = owner ? await listCartLines(owner) : [];
  const summary = summariseCart(lines);

  return (
    <section className="space-y-6" data-testid="cart-page">
      <PageHeader title="Your cart" lede="Prices and stock are read fresh every time; nothing is held for you until you pay." />
      {cancelled ? (
        <Alert tone="info" title="Payment cancelled" role="status">
          You came back without paying. Nothing was charged and your cart is as you left it.
        </Alert>
      ) : null}
      {lines.length === 0 ? (
        <EmptyState title="Your cart is empty" action={<ButtonLink href="/catalog">Browse the catalog</ButtonLink>}>
          Boards, magnetics and kits from the cooperative&apos;s sellers.
        </EmptyState>
      ) : (
        <>
          <CartGroups
            groups={summary.groups}
            controls={(line) => <CartLineControls listingId={line.listingId} title={line.title} quantity={line.quantity} stock={line.stock} />}
          />
          <div className="flex flex-col items-end gap-4">
            <CartTotals totals={summary.totals} />
            {summary.mixedCurrencies ? (
              <Alert tone="caution" title="More than one currency" className="max-w-reading">
                {mixedCurrencyMessage(summary.totals.map((t) => t.currency))}
              </Alert>
            ) : null}
            {!summary.ready && !summary.mixedCurrencies ? (
              <Alert tone="caution" title="Some items need your attention" className="max-w-reading">
                Fix the lines marked above before checking out.
              </Alert>
            ) : null}
            {summary.ready && !summary.mixedCurrencies ? (
              <ButtonLink href="/checkout" size="lg">
                {user ? "Go to checkout" : "Sign in and check out"}
              </ButtonLink>
            ) : null}
          </div>
        </>
      )}
    </section>
  );
}
