import type { Metadata } from "next";
import { AccessDenied } from "@/components/access/access-denied";
import { MainsCaution } from "@/components/caution";
import { CartGroups, CartTotals } from "@/components/cart/cart-groups";
import { CheckoutForm, type AcknowledgementItem } from "@/components/checkout/checkout-form";
import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { listCartLines } from "@/db/queries/cart";
import { sheetsForAcknowledgement } from "@/db/queries/checkout";
import { currentPolicyRevision } from "@/db/queries/policy";
import { checkAccess } from "@/lib/auth/guard";
import { mixedCurrencyMessage, summariseCart } from "@/lib/checkout/cart-summary";
import { acknowledgementHazards, acknowledgementText, needsAcknowledgement } from "@/lib/checkout/hazards";
import { hazardProfile } from "@/lib/policy";

export const metadata: Metadata = { title: "Checkout" };
export const dynamic = "force-dynamic";

export default async function CheckoutPage() {
  const decision = await checkAccess();
  if (!decision.ok) return <AccessDenied decision={decision} next="/checkout" />;
  const [lines, policy] = await Promise.all([listCartLines({ userId: decision.user.id }), currentPolicyRevision()]);
  const summary = summariseCart(lines);

  if (lines.length === 0) {
    return (
      <section className="space-y-6">
        <PageHeader title="Checkout" />
        <EmptyState title="Your cart is empty" action={<ButtonLink href="/catalog">Browse the catalog</ButtonLink>} />
      </section>
    );
  }

  const sheets = await sheetsForAcknowledgement(lines.map((l) => l.listingId));
  const acknowledgements: AcknowledgementItem[] = sheets
    .filter((s) => needsAcknowledgement(s.declaration))
    .map((s) => {
      const profile = hazardProfile(s.declaration, policy);
      return {
        listingId: s.listingId,
        title: s.title,
        sheetRevision: s.sheetRevision,
        text: acknowledgementText(s, acknowledgementHazards(s.declaration, policy)),
        sheetHref: `/listings/${s.slug}#topic-${profile.requiredTopics[0] ?? "codes-and-competence"}`,
      };
    });
  const total = summary.totals[0];
  const blocked = summary.mixedCurrencies || !summary.ready;

  return (
    <section className="space-y-8" data-testid="checkout-page">
      <PageHeader title="Checkout" lede="One payment for everything; each seller ships their own part and gets their share once you have paid." />
      <CartGroups groups={summary.groups} />
      <div className="flex justify-end">
        <CartTotals totals={summary.totals} />
      </div>
      {summary.mixedCurrencies ? (
        <Alert tone="stop" title="More than one currency">
          {mixedCurrencyMessage(summary.totals.map((t) => t.currency))} <a href="/cart">Change your cart</a>
        </Alert>
      ) : null}
      {!summary.ready && !summary.mixedCurrencies ? (
        <Alert tone="stop" title="Some items cannot be bought as they are">
          Stock changed since you added them. <a href="/cart">Review your cart</a> before paying.
        </Alert>
      ) : null}
      {acknowledgements.length > 0 ? <MainsCaution variant="full" /> : null}
      {!blocked && total ? <CheckoutForm items={acknowledgements} totalMinor={total.totalMinor} currency={total.currency} /> : null}
    </section>
  );
}
