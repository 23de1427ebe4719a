import type { Metadata } from "next";
import { AccessDenied } from "@/components/access/access-denied";
import { DeskTabs } from "@/components/moderation/desk-tabs";
import { HeldListingsTable } from "@/components/moderation/held-listings-table";
import { RecheckResults } from "@/components/moderation/recheck-results";
import { ReviewQueueTable } from "@/components/moderation/review-queue-table";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { heldListings, moderationCounts, recheckOverview, reviewQueue } from "@/db/queries/moderation";
import { checkAccess } from "@/lib/auth/guard";

export const metadata: Metadata = { title: "Moderation" };
export const dynamic = "force-dynamic";

export default async function ModerationQueuePage() {
  const access = await checkAccess(["moderator"]);
  if (!access.ok) return <AccessDenied decision={access} next="/moderate" />;
  const [queue, held, runs, counts] = await Promise.all([reviewQueue(), heldListings(), recheckOverview(), moderationCounts()]);
  return (
    <div className="space-y-6" data-testid="moderation-desk">
      <PageHeader
        eyebrow="Moderation"
        title="Review queue"
        lede="Each listing is checked against the safety policy in force. Open one to see its hazard profile, its notes per topic and what changed since it was last approved."
      />
      <DeskTabs current="queue" counts={counts} />
      <Panel title="Waiting for review">
        <ReviewQueueTable initial={queue} />
      </Panel>
      <div id="held" className="scroll-mt-4">
        <Panel title="Held listings">
          <HeldListingsTable rows={held} />
        </Panel>
      </div>
      <div id="rechecks" className="scroll-mt-4">
        <Panel title="Policy re-checks">
          <RecheckResults runs={runs} />
        </Panel>
      </div>
    </div>
  );
}
