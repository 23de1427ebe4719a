import type { Metadata } from "next";
import Link from "next/link";
import { redirect } from "next/navigation";
import { AccessDenied } from "@/components/access/access-denied";
import { ShopForm } from "@/components/sell/shop-form";
import { PageHeader } from "@/components/ui/page-header";
import { getSellerProfile } from "@/db/queries/sellers";
import { checkAccess } from "@/lib/auth/guard";
import { countryOptions } from "@/lib/validations/sellers";
import { openShop } from "./actions";

export const metadata: Metadata = { title: "Open your shop" };

/** For a seller whose role was given directly by staff: the shop details an application would have carried. */
export default async function OpenShopPage() {
  const access = await checkAccess(["seller"]);
  if (!access.ok) return <AccessDenied decision={access} next="/sell/shop" />;
  if (await getSellerProfile(access.user.id)) redirect("/sell");
  return (
    <div className="max-w-reading space-y-6">
      <PageHeader eyebrow={<Link href="/sell">Seller desk</Link>} title="Open your shop" lede="Buyers see your shop name, profile and returns policy beside every listing." />
      <ShopForm action={openShop} submitLabel="Open the shop" countries={countryOptions()} />
    </div>
  );
}
