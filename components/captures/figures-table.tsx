import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";
import { FIGURE_ROWS, figureValue, withPulseWidth } from "@/lib/captures/figures";
import type { CaptureChannelView } from "@/lib/captures/types";
import { formatFigure } from "./format";

/**
 * The measured figures of each channel side by side, in IEEE Std 181's terms, with why a figure
 * is missing where it is. Renders on the server and in the browser.
 */
export function FiguresTable({ channels, caption = "Measured figures", highlight }: { channels: readonly CaptureChannelView[]; caption?: string; highlight?: { channel: number; figure: string } | null }) {
  const withWidth = channels.map((c) => ({ ...c, all: withPulseWidth(c.figures) }));
  const reasons = withWidth.filter((c) => c.figures.reason);
  return (
    <div className="space-y-2" data-testid="capture-figures">
      <Table caption={caption}>
        <THead>
          <tr>
            <TH>Figure</TH>
            {withWidth.map((c) => (
              <TH key={c.index} numeric>
                {c.name}
              </TH>
            ))}
          </tr>
        </THead>
        <TBody>
          {FIGURE_ROWS.map((row) => (
            <TRow key={row.key} data-figure={row.key}>
              <th scope="row" className="px-3 py-cell text-left align-top text-sm font-medium text-graphite-900">
                {row.label}
              </th>
              {withWidth.map((c) => {
                const value = figureValue(c.all, row.key);
                const marked = highlight?.channel === c.index && highlight.figure === row.key;
                return (
                  <TD key={c.index} numeric className={marked ? "bg-copper-50 font-semibold" : undefined} data-channel={c.index}>
                    {value === null ? <span aria-label="not measured">—</span> : <data value={String(value)}>{formatFigure(value, row, c.unit, c.figures.amplitudeV)}</data>}
                  </TD>
                );
              })}
            </TRow>
          ))}
          <TRow>
            <th scope="row" className="px-3 py-cell text-left align-top text-sm font-medium text-graphite-900">
              Complete pulses averaged
            </th>
            {withWidth.map((c) => (
              <TD key={c.index} numeric>
                {c.figures.pulseCount}
              </TD>
            ))}
          </TRow>
        </TBody>
      </Table>
      <details className="text-sm text-graphite-700">
        <summary className="cursor-pointer font-medium text-copper-700">How each figure is measured</summary>
        <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-3 gap-y-1">
          {FIGURE_ROWS.map((row) => (
            <div key={row.key} className="contents">
              <dt className="font-medium text-graphite-900">{row.label}</dt>
              <dd>{row.note}</dd>
            </div>
          ))}
        </dl>
        <p className="mt-2">In the terms of IEEE Std 181, averaged over every complete pulse of the capture.</p>
      </details>
      {reasons.length > 0 ? (
        <ul className="space-y-1 text-sm text-graphite-700" aria-label="Why some figures are missing">
          {reasons.map((c) => (
            <li key={c.index}>
              <span className="font-semibold">{c.name}:</span> {c.figures.reason}
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}
