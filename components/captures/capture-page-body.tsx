import { formatRange, formatReading } from "@/components/bench/format";
import { VerdictBadge } from "@/components/bench/verdict-badge";
import { MainsCaution } from "@/components/caution";
import { Panel } from "@/components/ui/panel";
import type { CaptureDetail } from "@/db/queries/captures";
import type { CaptureActionResult } from "@/lib/captures/action-schemas";
import { packWindow } from "@/lib/captures/packed-window";
import { probeCautionFor } from "@/lib/captures/probe-caution";
import type { CapturePinView, CaptureStatusView, CaptureWindowView } from "@/lib/captures/types";
import { CaptureCard } from "./capture-card";
import { CaptureWorkspace } from "./capture-workspace";
import { ProbeCautionNote } from "./probe-caution-note";
import { ProposalPanel } from "./proposal-panel";

export type CapturePageBodyProps = {
  detail: CaptureDetail;
  status: CaptureStatusView;
  /** the whole capture's trace, when it is measured */
  initialWindow: CaptureWindowView | null;
  pins: readonly CapturePinView[] | null;
  pin?: (input: unknown) => Promise<CaptureActionResult>;
  confirm?: (input: unknown) => Promise<CaptureActionResult>;
  selfHref: string;
};

/** What the capture pages show under their header: cautions, the reading and its proposal, the viewer. */
export function CapturePageBody({ detail, status, initialWindow, pins, pin, confirm, selfHref }: CapturePageBodyProps) {
  const caution = probeCautionFor(detail.checkpoint);
  const proposal = status.proposal;
  const focus = status.applied?.channel ?? (proposal?.ok ? (proposal.options[0]?.channel ?? 0) : 0);
  const highlight = status.applied
    ? { channel: status.applied.channel, figure: status.applied.figure }
    : proposal?.ok && proposal.options[0]
      ? { channel: proposal.options[0].channel, figure: proposal.options[0].figure }
      : null;
  const { reading, checkpoint } = detail;

  return (
    <div className="space-y-6">
      <div className="space-y-2">
        {caution ? <ProbeCautionNote caution={caution} /> : null}
        <MainsCaution variant="short" />
      </div>

      <Panel title="The reading">
        <div className="flex flex-wrap items-start justify-between gap-4">
          <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
            <dt className="text-graphite-600">Checkpoint</dt>
            <dd className="font-medium">{checkpoint.name}</dd>
            <dt className="text-graphite-600">Measures</dt>
            <dd>{checkpoint.measure}</dd>
            <dt className="text-graphite-600">Expected</dt>
            <dd className="figure font-mono">{formatRange(checkpoint.expectedMin, checkpoint.expectedMax, checkpoint.unit)}</dd>
            <dt className="text-graphite-600">Reading</dt>
            <dd className="flex flex-wrap items-center gap-2">
              <data value={String(reading.value)} className="figure font-mono font-semibold" data-testid="capture-reading-value">
                {formatReading(reading.value, checkpoint.unit)}
              </data>
              <VerdictBadge verdict={reading.verdict} farOutside={reading.farOutside} />
            </dd>
          </dl>
          {status.state === "measured" ? <ProposalPanel initial={status} confirm={detail.canEdit ? confirm : undefined} /> : null}
        </div>
      </Panel>

      {status.state !== "measured" || !initialWindow ? (
        <ul>
          <CaptureCard initial={status} viewerHref={selfHref} confirm={detail.canEdit ? confirm : undefined} refreshWhenDone proposalHeadingLevel={3} />
        </ul>
      ) : (
        <CaptureWorkspace
          captureId={status.id}
          fileName={status.fileName}
          channels={status.channels}
          bounds={{ from: status.startTimeS ?? 0, to: status.endTimeS ?? 0 }}
          sampleIntervalS={status.sampleIntervalS}
          sampleCount={status.sampleCount ?? 0}
          initialWindow={packWindow(initialWindow, status.sampleIntervalS)}
          focusChannel={focus}
          highlight={highlight}
          pins={pins}
          pin={pin}
        />
      )}
    </div>
  );
}
