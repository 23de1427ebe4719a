import type { Metadata } from "next";
import { AccessDenied } from "@/components/access/access-denied";
import { MainsCaution } from "@/components/caution";
import { EmptyState } from "@/components/ui/empty-state";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { checkAccess } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "Seller desk" };

export default async function SellerDeskPage() {
  const access = await checkAccess(["seller"]);
  if (!access.ok) return <AccessDenied decision={access} next="/sell" />;
  return (
    <div className="space-y-6" data-testid="seller-desk">
      <PageHeader
        eyebrow="Seller desk"
        title={`Your shop, ${access.user.name ?? access.user.email ?? ""}`}
        lede="Boards, magnetics and kits you list here reach the catalog once a moderator has checked their safety sheet."
      />
      <Panel title="Your listings">
        <EmptyState title="No listings yet">
          Each listing carries a mains safety sheet. The sheet&apos;s live check shows the hazard profile computed from your
          figures and which topics it must cover before you can submit it for review.
        </EmptyState>
      </Panel>
      <MainsCaution variant="full" />
    </div>
  );
}
