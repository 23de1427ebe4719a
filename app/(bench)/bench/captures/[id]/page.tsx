import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { CapturePageBody } from "@/components/captures/capture-page-body";
import { formatFileSize } from "@/components/captures/format";
import { PageHeader } from "@/components/ui/page-header";
import { captureForViewer, pinsFor } from "@/db/queries/captures";
import { getSessionUser } from "@/lib/auth/guard";
import { pinScope } from "@/lib/captures/pin-rules";
import { captureStatusView } from "@/lib/captures/status-view";
import { captureWindow } from "@/lib/captures/window";
import { DEFAULT_POINTS } from "@/lib/captures/window-params";
import { confirmProposalAction } from "../../logs/[id]/capture-actions";

export const metadata: Metadata = { title: "Scope capture" };
export const dynamic = "force-dynamic";

/**
 * A capture's trace and figures. Whoever may read its log may read it (the owner, a reviewer of
 * an accepted session, moderators, anyone for a public log); the same page as a missing capture
 * for everyone else. The owner confirms the proposed value here too; the pins of every review
 * session on the log show for the owner and moderators.
 */
export default async function CapturePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const viewer = await getSessionUser();
  const detail = await captureForViewer(viewer, id);
  if (!detail) notFound();
  const status = captureStatusView(detail);
  const { capture } = detail;
  const measured = capture.state === "measured" && capture.startTimeS !== null && capture.endTimeS !== null;
  const [initialWindow, pins] = await Promise.all([
    measured ? captureWindow(detail, { from: capture.startTimeS!, to: capture.endTimeS! }, DEFAULT_POINTS) : null,
    pinScope(detail.access) === "none" ? null : pinsFor(capture.id, viewer, detail.access),
  ]);

  return (
    <article className="space-y-6" data-testid="capture-page" data-access={detail.access}>
      <PageHeader
        eyebrow={
          <>
            <Link href={`/bench/logs/${detail.log.id}`}>{detail.log.title}</Link> · {detail.checkpoint.name}
          </>
        }
        title={status.fileName}
        lede={
          <>
            A scope capture of {formatFileSize(status.bytes)}, kept as uploaded. <a href={status.fileUrl} download={status.fileName}>Download the original</a>
          </>
        }
      />
      <CapturePageBody
        detail={detail}
        status={status}
        initialWindow={initialWindow}
        pins={pins}
        confirm={detail.canEdit ? confirmProposalAction.bind(null, detail.log.id, capture.id) : undefined}
        selfHref={`/bench/captures/${capture.id}`}
      />
    </article>
  );
}
