import type { Metadata } from "next";
import Link from "next/link";
import { AccessDenied } from "@/components/access/access-denied";
import { defaultValues } from "@/components/listing-form/form-model";
import { ListingForm } from "@/components/listing-form/listing-form";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { getSellerProfile } from "@/db/queries/sellers";
import { checkAccess } from "@/lib/auth/guard";
import { payoutReady } from "@/lib/payments/connect";
import { LISTING_KINDS } from "@/lib/validations/listings";

export const metadata: Metadata = { title: "New listing" };

export default async function NewListingPage({ searchParams }: { searchParams: Promise<{ kind?: string }> }) {
  const access = await checkAccess(["seller"]);
  if (!access.ok) return <AccessDenied decision={access} next="/sell/listings/new" />;
  const { kind } = await searchParams;
  const chosen = LISTING_KINDS.find((k) => k === kind) ?? "kit";
  const profile = await getSellerProfile(access.user.id);
  return (
    <div className="space-y-6">
      <PageHeader eyebrow={<Link href="/sell">Seller desk</Link>} title="New listing" lede="Save a draft at any time; submit it for review once the live safety check is clear." />
      {!payoutReady(profile) ? (
        <Alert tone="caution" title="You can draft, but not submit yet">
          Your payout account is not connected and enabled. <Link href="/sell">Connect it on the seller desk</Link>; your drafts wait here.
        </Alert>
      ) : null}
      <ListingForm listingId={null} initial={defaultValues(chosen)} state={null} payoutReady={payoutReady(profile)} />
    </div>
  );
}
