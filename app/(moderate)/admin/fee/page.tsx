import type { Metadata } from "next";
import { AccessDenied } from "@/components/access/access-denied";
import { FeeForm } from "@/components/orders/fee-form";
import { formatOrderDateTime } from "@/components/orders/format";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { getPlatformFee } from "@/db/queries/orders";
import { checkAccess } from "@/lib/auth/guard";
import { basisPointsToPercent } from "@/lib/orders/amount-input";
import { setPlatformFeeAction } from "./actions";

export const metadata: Metadata = { title: "Platform fee" };
export const dynamic = "force-dynamic";

export default async function PlatformFeePage() {
  const access = await checkAccess(["admin"]);
  if (!access.ok) return <AccessDenied decision={access} next="/admin/fee" />;
  const fee = await getPlatformFee();
  const percent = basisPointsToPercent(fee.feeBps);
  return (
    <div className="space-y-6">
      <PageHeader title="Platform fee" lede="The share of each seller's subtotal the platform keeps; the rest is transferred to the seller." />
      <Panel title={`Now: ${percent} %`}>
        <div className="space-y-4">
          <p className="text-sm text-graphite-700" data-testid="fee-current">
            <span className="figure font-mono">{fee.feeBps}</span> basis points
            {fee.updatedByName && fee.updatedAt ? ` — set by ${fee.updatedByName} on ${formatOrderDateTime(fee.updatedAt)}` : ""}.
          </p>
          <Alert tone="info" title="Applies to new orders only">
            Each checkout records the fee when it starts, so orders already placed — and checkouts already open — keep the fee they were
            placed with. Every change is written to the audit log with your name.
          </Alert>
          <FeeForm action={setPlatformFeeAction} currentPercent={percent} />
        </div>
      </Panel>
    </div>
  );
}
