import { Alert } from "@/components/ui/alert";
import { ButtonLink } from "@/components/ui/button";
import { Panel } from "@/components/ui/panel";
import { StateBadge } from "@/components/ui/state-badge";
import type { ReviewerProfileRow } from "@/db/queries/reviews";
import { formatMoney } from "@/lib/format/money";
import { PAYMENTS_UNAVAILABLE_MESSAGE } from "@/lib/payments/connect";
import type { FormResult } from "@/lib/validations/auth";
import { ExpertiseTags } from "./expertise-tags";
import { AvailabilityForm, ConnectReviewerPayoutForm } from "./reviewer-desk-forms";

type Action = (previous: FormResult | null, form: FormData) => Promise<FormResult>;

/** The reviewer's own standing: price, areas, whether builders can book them, and the payout account. */
export function ReviewerDeskPanel({ profile, payout, connect, availability }: { profile: ReviewerProfileRow | null; payout?: string; connect: Action; availability: Action }) {
  if (!profile) {
    return (
      <Panel title="Your reviewer profile">
        <p className="mb-3 text-sm">You hold the reviewer role but have no profile yet; send an application so a moderator can set it up.</p>
        <ButtonLink href="/reviewers/apply">Apply</ButtonLink>
      </Panel>
    );
  }
  const bookable = profile.available && profile.payoutsEnabled;
  return (
    <Panel
      title="Your reviewer profile"
      actions={bookable ? <StateBadge label="Taking bookings" tone="clear" /> : <StateBadge label={profile.payoutsEnabled ? "Paused" : "Not bookable yet"} tone="caution" />}
    >
      <div className="space-y-3 text-sm" data-testid="reviewer-desk" data-payouts={profile.payoutsEnabled ? "enabled" : "none"}>
        {payout === "unavailable" ? <Alert tone="caution" title="Payment provider unavailable">{PAYMENTS_UNAVAILABLE_MESSAGE}</Alert> : null}
        {payout === "enabled" && profile.payoutsEnabled ? <Alert tone="info" title="Payout account connected">Builders can now book you.</Alert> : null}
        <p>
          <span className="font-mono font-semibold">{formatMoney(profile.priceMinor, profile.currency)}</span> per review; the platform fee comes out of it.
        </p>
        <ExpertiseTags expertise={profile.expertise} />
        {profile.payoutsEnabled ? (
          <>
            <p>
              Payout account <code className="font-mono text-xs">{profile.payoutAccountId}</code> is enabled: your share is sent there when you deliver a report.
            </p>
            <AvailabilityForm action={availability} available={profile.available} />
          </>
        ) : (
          <>
            <p>
              {profile.payoutAccountId
                ? "The payment provider still needs your details; builders cannot book you until the account is enabled."
                : "Connect a payout account at the payment provider to be paid; builders can book you once it is enabled."}
            </p>
            <ConnectReviewerPayoutForm action={connect} label={profile.payoutAccountId ? "Finish payout setup" : "Connect payout account"} />
          </>
        )}
      </div>
    </Panel>
  );
}
