import type { Metadata } from "next";
import Link from "next/link";
import { AccessDenied } from "@/components/access/access-denied";
import { ApplicationStatus } from "@/components/sell/application-status";
import { ShopForm } from "@/components/sell/shop-form";
import { ButtonLink } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { getSellerProfile, latestApplication } from "@/db/queries/sellers";
import { checkAccess } from "@/lib/auth/guard";
import { hasRole } from "@/lib/auth/access";
import { countryOptions } from "@/lib/validations/sellers";
import { applyToSell } from "./actions";

export const metadata: Metadata = { title: "Become a seller" };

export default async function BecomeASellerPage() {
  const access = await checkAccess();
  if (!access.ok) return <AccessDenied decision={access} next="/account/become-a-seller" />;
  const [application, profile] = await Promise.all([latestApplication(access.user.id), getSellerProfile(access.user.id)]);
  const seller = hasRole(access.user, "seller");
  const canApply = !profile && !seller && application?.status !== "pending";
  return (
    <div className="max-w-reading space-y-6">
      <PageHeader
        eyebrow={<Link href="/account">Your account</Link>}
        title="Become a seller"
        lede="Sell boards, hand-wound magnetics and kits to other builders. A moderator reads each application before a shop opens."
      />
      {profile || seller ? (
        <Panel title="You already sell here">
          <p className="mb-3 text-sm">{profile ? `Your shop “${profile.shopName}” is open.` : "You hold the seller role; open your shop from the seller desk."}</p>
          <ButtonLink href={profile ? "/sell" : "/sell/shop"}>{profile ? "Go to the seller desk" : "Open your shop"}</ButtonLink>
        </Panel>
      ) : null}
      {application ? <ApplicationStatus application={application} /> : null}
      {canApply ? (
        <Panel title={application ? "Apply again" : "Your application"}>
          <ShopForm action={applyToSell} submitLabel="Send the application" countries={countryOptions()} />
        </Panel>
      ) : null}
    </div>
  );
}
