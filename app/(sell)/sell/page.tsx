import type { Metadata } from "next";
import { AccessDenied } from "@/components/access/access-denied";
import { MainsCaution } from "@/components/caution";
import { ListingsTable } from "@/components/sell/listings-table";
import { PayoutPanel } from "@/components/sell/payout-panel";
import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { listSellerListings } from "@/db/queries/listings";
import { getSellerProfile } from "@/db/queries/sellers";
import { checkAccess } from "@/lib/auth/guard";
import { listingSortSchema } from "@/lib/validations/listings";

export const metadata: Metadata = { title: "Seller desk" };

type Search = { sort?: string; dir?: string; payout?: string; submitted?: string; retired?: string };

export default async function SellerDeskPage({ searchParams }: { searchParams: Promise<Search> }) {
  const access = await checkAccess(["seller"]);
  if (!access.ok) return <AccessDenied decision={access} next="/sell" />;
  const search = await searchParams;
  const sort = listingSortSchema.parse({ sort: search.sort, dir: search.dir });
  const [profile, rows] = await Promise.all([getSellerProfile(access.user.id), listSellerListings(access.user.id, sort)]);
  const submitted = search.submitted ? rows.find((r) => r.id === search.submitted) : undefined;
  const retired = search.retired ? rows.find((r) => r.id === search.retired) : undefined;
  return (
    <div className="space-y-6" data-testid="seller-desk">
      <PageHeader
        eyebrow="Seller desk"
        title={profile?.shopName ?? `Your shop, ${access.user.name ?? access.user.email ?? ""}`}
        lede="Boards, magnetics and kits you list here reach the catalog once a moderator has checked their safety sheet."
        actions={
          <>
            <ButtonLink href="/sell/orders" variant="secondary">
              Incoming orders
            </ButtonLink>
            {rows.length > 0 ? <ButtonLink href="/sell/listings/new">New listing</ButtonLink> : null}
          </>
        }
      />
      {submitted ? (
        <Alert tone="info" title="Submitted for review">
          “{submitted.title}” is in review. A moderator checks its safety sheet; you will get an e-mail with the decision.
        </Alert>
      ) : null}
      {retired ? <Alert tone="info" title="Retired">“{retired.title}” is withdrawn from the catalog.</Alert> : null}
      <PayoutPanel profile={profile} returned={search.payout} />
      <Panel title="Your listings">
        {rows.length === 0 ? (
          <EmptyState title="No listings yet" action={<ButtonLink href="/sell/listings/new">List your first part</ButtonLink>}>
            Each listing carries a mains safety sheet. The sheet&apos;s live check shows the hazard profile computed from your figures and
            which topics it must cover before you can submit it for review.
          </EmptyState>
        ) : (
          <ListingsTable rows={rows} sort={sort} />
        )}
      </Panel>
      <MainsCaution variant="full" />
    </div>
  );
}
