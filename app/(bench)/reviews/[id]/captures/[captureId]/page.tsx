import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { AccessDenied } from "@/components/access/access-denied";
import { CapturePageBody } from "@/components/captures/capture-page-body";
import { Alert } from "@/components/ui/alert";
import { PageHeader } from "@/components/ui/page-header";
import { captureForViewer, pinsFor } from "@/db/queries/captures";
import { sessionForViewer } from "@/db/queries/reviews";
import { checkAccess } from "@/lib/auth/guard";
import { PIN_STATES } from "@/lib/captures/pin-rules";
import { captureStatusView } from "@/lib/captures/status-view";
import { captureWindow } from "@/lib/captures/window";
import { DEFAULT_POINTS } from "@/lib/captures/window-params";
import type { ReviewState } from "@/db/schema/reviews";
import { confirmProposalAction } from "../../../../bench/logs/[id]/capture-actions";
import { addPinAction } from "./actions";

export const metadata: Metadata = { title: "Capture in a review" };
export const dynamic = "force-dynamic";

/**
 * A capture of the log under review, inside the session: the same viewer the builder has, with
 * this session's pinned comments; its reviewer pins new ones while the session is accepted or
 * delivered. The session's two parties and moderators only, and only captures of its log.
 */
export default async function ReviewCapturePage({ params }: { params: Promise<{ id: string; captureId: string }> }) {
  const { id, captureId } = await params;
  const access = await checkAccess();
  if (!access.ok) return <AccessDenied decision={access} next={`/reviews/${id}/captures/${captureId}`} />;
  const session = await sessionForViewer(access.user, id);
  if (!session) notFound();
  const detail = await captureForViewer(access.user, captureId);
  if (!detail || detail.log.id !== session.logId) notFound();
  const { capture } = detail;
  const status = captureStatusView(detail);
  const measured = capture.state === "measured" && capture.startTimeS !== null && capture.endTimeS !== null;
  const mayPin = session.viewerRole === "reviewer" && (PIN_STATES as readonly ReviewState[]).includes(session.state);
  const [initialWindow, allPins] = await Promise.all([
    measured ? captureWindow(detail, { from: capture.startTimeS!, to: capture.endTimeS! }, DEFAULT_POINTS) : null,
    pinsFor(capture.id, access.user, detail.access),
  ]);
  const pins = allPins.filter((p) => p.sessionId === session.id);

  return (
    <article className="space-y-6" data-testid="review-capture-page">
      <PageHeader
        eyebrow={
          <>
            <Link href={`/reviews/${session.id}`}>Review of “{session.logTitle}”</Link> · {detail.checkpoint.name}
          </>
        }
        title={status.fileName}
        lede={
          session.viewerRole === "reviewer"
            ? `${session.builderName}'s capture. Click the trace where something deserves a word and pin your comment there.`
            : `The capture as ${session.reviewerName} reads it in this review, with their comments.`
        }
      />
      {session.viewerRole === "reviewer" && !mayPin ? (
        <Alert tone="info" title="Comments are closed">
          Comments can be pinned while the review is accepted or delivered; this one is {session.state}.
        </Alert>
      ) : null}
      <CapturePageBody
        detail={detail}
        status={status}
        initialWindow={initialWindow}
        pins={pins}
        pin={mayPin ? addPinAction.bind(null, session.id) : undefined}
        confirm={detail.canEdit ? confirmProposalAction.bind(null, detail.log.id, capture.id) : undefined}
        selfHref={`/reviews/${session.id}/captures/${capture.id}`}
      />
    </article>
  );
}
