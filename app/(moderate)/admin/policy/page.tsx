import type { Metadata } from "next";
import { AccessDenied } from "@/components/access/access-denied";
import { PolicyFigures, PolicyHistoryTable, PolicyTopicsTable } from "@/components/moderation/policy-rules";
import { PolicyRevisionForm } from "@/components/moderation/policy-revision-form";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { Panel } from "@/components/ui/panel";
import { publishedPolicyRevisions } from "@/db/queries/moderation";
import { currentPolicyRevision } from "@/db/queries/policy";
import { checkAccess } from "@/lib/auth/guard";
import { topicMinWordsOf } from "@/lib/moderation/publish-policy";
import { SAFETY_TOPICS } from "@/lib/policy";
import { publishPolicyAction } from "./actions";

export const metadata: Metadata = { title: "Safety policy" };
export const dynamic = "force-dynamic";

export default async function PolicyRevisionsPage({ searchParams }: { searchParams: Promise<{ published?: string }> }) {
  const access = await checkAccess(["admin"]);
  if (!access.ok) return <AccessDenied decision={access} next="/admin/policy" />;
  const [{ published }, current, history] = await Promise.all([searchParams, currentPolicyRevision(), publishedPolicyRevisions()]);
  const latestGrace = history[0]?.graceDays ?? 14;
  return (
    <div className="space-y-6" data-testid="policy-admin">
      <PageHeader
        eyebrow="Admin"
        title="Safety-sheet policy"
        lede="The rules every listing's safety sheet is checked against. A new revision applies at once to submissions; live listings are re-checked and given a grace period."
      />
      {published ? (
        <Alert tone="info" title={`Revision ${published} is published.`}>
          Every live listing is being re-checked against it; the results appear on the moderation desk.
        </Alert>
      ) : null}
      <Panel title={`In force: revision ${current.revision}`}>
        <div className="space-y-4">
          <p className="max-w-reading text-graphite-700">{current.summary}</p>
          <PolicyFigures rules={current} />
          <PolicyTopicsTable rules={current} />
        </div>
      </Panel>
      <Panel title={`Publish revision ${current.revision + 1}`}>
        <PolicyRevisionForm
          action={publishPolicyAction}
          nextRevision={current.revision + 1}
          topics={SAFETY_TOPICS.map((t) => ({ key: t.key, label: t.label }))}
          defaults={{
            minWords: current.minWords,
            topicMinWords: topicMinWordsOf(current),
            safeVoltageV: current.safeVoltageV,
            // µC in the form; rounding keeps 45.00000000000001 out of the field.
            storedChargeThresholdMicroC: Number((current.storedChargeThresholdC * 1e6).toPrecision(12)),
            waitMarginFactor: current.waitMarginFactor,
            graceDays: latestGrace,
          }}
        />
      </Panel>
      <Panel title="History">
        <PolicyHistoryTable published={history} />
      </Panel>
    </div>
  );
}
