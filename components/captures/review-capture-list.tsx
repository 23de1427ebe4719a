import Link from "next/link";
import { formatReading } from "@/components/bench/format";
import { StateBadge } from "@/components/ui/state-badge";
import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";
import type { CaptureDetail } from "@/db/queries/captures";
import { figureForCheckpoint } from "@/lib/captures/proposal";
import { figureRow, figureValue, withPulseWidth } from "@/lib/captures/figures";
import { CAPTURE_STATE_WORDS, formatFigure } from "./format";

/** The log's scope captures in a review session, each opening the viewer inside the session. */
export function ReviewCaptureList({ sessionId, captures }: { sessionId: string; captures: readonly CaptureDetail[] }) {
  if (captures.length === 0) return <p className="text-sm text-graphite-600">The builder has attached no scope captures to this log&apos;s readings.</p>;
  return (
    <Table caption="Scope captures on the log's readings" captionHidden data-testid="review-captures">
      <THead>
        <tr>
          <TH>Checkpoint</TH>
          <TH>Capture</TH>
          <TH numeric>Reading</TH>
          <TH numeric>Measured</TH>
          <TH>State</TH>
        </tr>
      </THead>
      <TBody>
        {captures.map((c) => {
          const word = CAPTURE_STATE_WORDS[c.capture.state];
          const figure = figureForCheckpoint(c.checkpoint);
          const first = c.channels[0];
          const value = figure && first ? figureValue(withPulseWidth(first.figures), figure) : null;
          return (
            <TRow key={c.capture.id} data-testid="review-capture">
              <TD>{c.checkpoint.name}</TD>
              <TD>
                <Link href={`/reviews/${sessionId}/captures/${c.capture.id}`} className="break-all">
                  {c.upload.name}
                </Link>
              </TD>
              <TD numeric>{formatReading(c.reading.value, c.checkpoint.unit)}</TD>
              <TD numeric>{figure && first && value !== null ? `${figureRow(figure).label}: ${formatFigure(value, figureRow(figure), first.unit, first.figures.amplitudeV)} (${first.name})` : "—"}</TD>
              <TD>
                <StateBadge label={word.label} tone={word.tone} />
              </TD>
            </TRow>
          );
        })}
      </TBody>
    </Table>
  );
}
