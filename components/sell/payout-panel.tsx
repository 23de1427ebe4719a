import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { StateBadge } from "@/components/ui/state-badge";
import { PAYMENTS_UNAVAILABLE_MESSAGE } from "@/lib/payments/connect";
import { ConnectPayoutForm } from "./connect-payout-form";

export type PayoutProfile = { payoutAccountId: string | null; chargesEnabled: boolean; payoutsEnabled: boolean } | null;

/** Where the seller's payout account stands, and the one next step. */
export function PayoutPanel({ profile, returned }: { profile: PayoutProfile; returned?: string }) {
  const enabled = profile !== null && profile.chargesEnabled && profile.payoutsEnabled;
  const status = profile === null ? null : enabled ? "enabled" : profile.payoutAccountId ? "incomplete" : "none";
  const badge = {
    enabled: <StateBadge label="Payouts enabled" tone="clear" />,
    incomplete: <StateBadge label="Onboarding not finished" tone="caution" />,
    none: <StateBadge label="Not connected" tone="neutral" />,
  };
  return (
    <Panel title="Payout account" actions={status ? badge[status] : null}>
      <div className="space-y-3" data-testid="payout-panel" data-status={status ?? "no-shop"}>
        {returned === "unavailable" ? <Alert tone="caution" title="Payment provider unavailable">{PAYMENTS_UNAVAILABLE_MESSAGE}</Alert> : null}
        {returned === "enabled" && enabled ? <Alert tone="info" title="Payout account connected">You can now submit listings for review.</Alert> : null}
        {profile === null ? (
          <>
            <p className="text-sm">Open your shop first: the payout account belongs to it.</p>
            <ButtonLink href="/sell/shop">Open your shop</ButtonLink>
          </>
        ) : enabled ? (
          <p className="text-sm">
            Buyers&apos; payments reach your account at the payment provider after the platform fee.
            {profile.payoutAccountId ? (
              <>
                {" "}
                Account <code className="font-mono text-xs">{profile.payoutAccountId}</code>.
              </>
            ) : null}
          </p>
        ) : (
          <>
            <p className="text-sm">
              {status === "incomplete"
                ? "The payment provider still needs your details. Until the account is enabled you can draft listings but not submit them."
                : "Connect a payout account at the payment provider to be paid. Until it is enabled you can draft listings but not submit them."}
            </p>
            <ConnectPayoutForm label={status === "incomplete" ? "Finish payout setup" : "Connect payout account"} />
          </>
        )}
      </div>
    </Panel>
  );
}
