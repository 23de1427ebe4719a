import type { Metadata } from "next";
import { AccessDenied } from "@/components/access/access-denied";
import { PaymentStatus } from "@/components/checkout/payment-status";
import { QueryProvider } from "@/components/query-provider";
import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";
import { buyerCheckoutBySession } from "@/db/queries/checkout";
import { checkAccess } from "@/lib/auth/guard";
import { checkoutStatusQuerySchema } from "@/lib/validations/checkout";

export const metadata: Metadata = { title: "Payment" };
export const dynamic = "force-dynamic";

export default async function CheckoutDonePage({ searchParams }: { searchParams: Promise<{ session?: string }> }) {
  const params = await searchParams;
  const decision = await checkAccess();
  const parsed = checkoutStatusQuerySchema.safeParse(params);
  if (!decision.ok) return <AccessDenied decision={decision} next={parsed.success ? `/checkout/done?session=${encodeURIComponent(parsed.data.session)}` : "/orders"} />;
  const checkout = parsed.success ? await buyerCheckoutBySession(parsed.data.session, decision.user.id) : null;
  return (
    <section className="max-w-reading space-y-6" data-testid="checkout-done">
      <PageHeader title="Your payment" />
      {checkout ? (
        <QueryProvider>
          <PaymentStatus sessionId={parsed.data!.session} initial={checkout} />
        </QueryProvider>
      ) : (
        <>
          <Alert tone="caution" title="No such checkout">
            We found no checkout of yours for this link. Your orders list everything you have paid for.
          </Alert>
          <ButtonLink href="/orders" variant="secondary">
            Your orders
          </ButtonLink>
        </>
      )}
    </section>
  );
}
