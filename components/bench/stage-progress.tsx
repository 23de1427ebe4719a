import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";
import type { StageProgress as Progress } from "@/lib/bench/progress";

/**
 * Stage by stage in bring-up order: checkpoints read, and how the newest reading of each stands.
 * Counts are words and numbers in their own columns, so nothing rests on colour.
 */
export function StageProgress({ progress, caption = "Progress by stage", captionHidden = false }: { progress: Progress[]; caption?: string; captionHidden?: boolean }) {
  return (
    <Table caption={caption} captionHidden={captionHidden} data-testid="stage-progress">
      <THead>
        <tr>
          <TH>Stage</TH>
          <TH numeric>Read</TH>
          <TH numeric>Within</TH>
          <TH numeric>Low</TH>
          <TH numeric>High</TH>
        </tr>
      </THead>
      <TBody>
        {progress.map((row, index) => (
          <TRow key={row.stage} data-stage={row.stage} data-testid="stage-progress-row">
            <th scope="row" className="px-3 py-cell text-left font-normal text-graphite-900">
              <span className="figure font-mono text-graphite-600">{index + 1}.</span> {row.label}
            </th>
            <TD numeric>{row.checkpoints === 0 ? <span className="text-graphite-600">no checkpoints</span> : `${row.read} of ${row.checkpoints}`}</TD>
            <TD numeric>{row.within}</TD>
            <TD numeric className={row.low > 0 ? "font-semibold text-amber-700" : undefined}>
              {row.low}
            </TD>
            <TD numeric className={row.high > 0 ? "font-semibold text-amber-700" : undefined}>
              {row.high}
            </TD>
          </TRow>
        ))}
      </TBody>
    </Table>
  );
}
