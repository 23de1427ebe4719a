import type { Metadata } from "next";
import { AccessDenied } from "@/components/access/access-denied";
import { AskQuestionForm } from "@/components/qa/ask-question-form";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { countApprovedPosts, listingChoices, ownLogs } from "@/db/queries/qa";
import { checkAccess } from "@/lib/auth/guard";
import { needsPreModeration, TRUSTED_AFTER_APPROVED_POSTS } from "@/lib/qa/rules";
import { questionFiltersSchema } from "@/lib/validations/qa";
import { askQuestionAction } from "../actions";

export const metadata: Metadata = { title: "Ask a question" };
export const dynamic = "force-dynamic";

type Props = { searchParams: Promise<{ listing?: string }> };

export default async function AskQuestionPage({ searchParams }: Props) {
  const { listing } = await searchParams;
  const access = await checkAccess();
  if (!access.ok) return <AccessDenied decision={access} next={listing ? `/questions/new?listing=${encodeURIComponent(listing)}` : "/questions/new"} />;
  const user = access.user;
  const [listings, logs, approvedPosts] = await Promise.all([listingChoices(), ownLogs(user.id), countApprovedPosts(user.id)]);
  const preselected = questionFiltersSchema.parse({ listing }).listing;
  return (
    <div className="space-y-6">
      <PageHeader
        eyebrow="Bench help"
        title="Ask a question"
        lede="Say what you are building, what you measured and what you expected. Photos of the board and scope captures help others help you."
      />
      {needsPreModeration({ roles: user.roles, approvedPosts }) ? (
        <Alert tone="info" title="A moderator reads it first">
          Your first posts wait for a moderator before others can see them. Once {TRUSTED_AFTER_APPROVED_POSTS} of your posts have been
          approved, new ones appear at once.
        </Alert>
      ) : null}
      <Alert tone="caution" title="Before you measure again">
        Unplug the build and check with a meter that the bus capacitors are discharged before you touch the board or move a probe.
      </Alert>
      <AskQuestionForm
        action={askQuestionAction}
        listings={listings}
        logs={logs}
        defaultListingId={preselected && listings.some((l) => l.id === preselected) ? preselected : undefined}
      />
    </div>
  );
}
