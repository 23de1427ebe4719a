import { sampleEvenly } from "@/components/charts/scale";
import type { WindowTrace } from "@/lib/captures/types";
import { formatLevel, formatTime } from "./format";
import { nearestIndex, type Span } from "./viewer-math";

const ROWS = 24;

/** The visible window as a table of evenly spaced times, for people who cannot see the plot. */
export function WindowTable({ traces, view }: { traces: readonly WindowTrace[]; view: Span }) {
  const base = traces[0];
  if (!base) return null;
  const inside = base.timeS.map((t, i) => ({ t, i })).filter(({ t }) => t >= view.from && t <= view.to);
  const rows = sampleEvenly(inside, ROWS);
  return (
    <details className="rounded border border-graphite-200 bg-paper-raised px-3 py-2" data-testid="capture-window-table">
      <summary className="cursor-pointer text-sm font-medium text-copper-700">The visible trace as a table</summary>
      <div className="overflow-x-auto pt-2">
        <table className="w-full text-sm">
          <caption className="pb-1 text-left text-graphite-700">
            {rows.length} evenly spaced points from {formatTime(view.from)} to {formatTime(view.to)}
          </caption>
          <thead>
            <tr className="border-b border-graphite-300 text-left text-xs text-graphite-700">
              <th scope="col" className="py-1 pr-4">
                Time
              </th>
              {traces.map((t) => (
                <th key={t.index} scope="col" className="py-1 pr-4 text-right">
                  {t.name}
                </th>
              ))}
            </tr>
          </thead>
          <tbody className="divide-y divide-graphite-100">
            {rows.map(({ t, i }) => (
              <tr key={i}>
                <th scope="row" className="figure py-0.5 pr-4 text-left font-mono font-normal">
                  {formatTime(t, 5)}
                </th>
                {traces.map((trace) => {
                  const j = trace === base ? i : nearestIndex(trace.timeS, t);
                  return (
                    <td key={trace.index} className="figure py-0.5 pr-4 text-right font-mono">
                      {j >= 0 ? formatLevel(trace.values[j] ?? 0, trace.unit) : "—"}
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </details>
  );
}
