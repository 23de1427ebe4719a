import type { Metadata } from "next";
import Link from "next/link";
import { notFound, redirect } from "next/navigation";
import { AccessDenied } from "@/components/access/access-denied";
import { CheckpointCard } from "@/components/bench/checkpoint-card";
import { MainsCaution } from "@/components/caution";
import { ReportForm } from "@/components/reviews/report-form";
import { Markdown } from "@/components/markdown";
import { PageHeader } from "@/components/ui/page-header";
import { getLogForViewer } from "@/db/queries/bench";
import { sessionForViewer } from "@/db/queries/reviews";
import { checkAccess } from "@/lib/auth/guard";
import { STAGE_LABELS } from "@/lib/listings/labels";
import { formatWhen } from "@/lib/reviews/format";
import { availableActions, deliverBy } from "@/lib/reviews/transitions";
import { deliverReportAction } from "./actions";

export const metadata: Metadata = { title: "Write the report" };
export const dynamic = "force-dynamic";

export default async function WriteReportPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const access = await checkAccess(["reviewer"]);
  if (!access.ok) return <AccessDenied decision={access} next={`/reviews/${id}/report`} />;
  const session = await sessionForViewer(access.user, id);
  if (!session || session.viewerRole !== "reviewer") notFound();
  if (!availableActions(session, { kind: "user", id: access.user.id, roles: access.user.roles }, new Date()).includes("deliver")) redirect(`/reviews/${id}`);
  const log = await getLogForViewer(access.user, session.logId);
  if (!log) notFound();
  const inScope = log.checkpoints.filter((c) => session.stages.includes(c.stage));
  return (
    <div className="max-w-4xl space-y-6">
      <PageHeader
        eyebrow={<Link href={`/reviews/${id}`}>Review of “{session.logTitle}”</Link>}
        title="Write the report"
        lede={`A verdict for each of the ${inScope.length} checkpoints in the booked stages, then a summary. Due by ${formatWhen(deliverBy(session))}.`}
      />
      <MainsCaution />
      {log.notesMd.trim() !== "" ? (
        <section>
          <h2 className="mb-1 font-semibold">The builder&apos;s notes</h2>
          <Markdown minHeadingLevel={3}>{log.notesMd}</Markdown>
        </section>
      ) : null}
      {session.message !== "" ? (
        <p className="text-sm">
          <span className="font-semibold">The builder&apos;s note to you:</span> {session.message}
        </p>
      ) : null}
      <ReportForm
        action={deliverReportAction.bind(null, session.id)}
        checkpoints={inScope.map((c) => ({ id: c.id, name: c.name, stageLabel: STAGE_LABELS[c.stage], card: <CheckpointCard checkpoint={c} /> }))}
      />
    </div>
  );
}
