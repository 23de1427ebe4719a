import { ProductStateBadge } from "@/components/ui/state-badge";
import type { ReadingVerdict } from "@/db/schema/bench";

/** Within / Low / High as a word; "far outside" is spelled out too, never left to colour. */
export function VerdictBadge({ verdict, farOutside }: { verdict: ReadingVerdict; farOutside: boolean }) {
  return (
    <span className="inline-flex items-center gap-1.5" data-testid="reading-verdict" data-verdict={verdict} data-far-outside={farOutside}>
      <ProductStateBadge kind="reading" state={verdict} className={farOutside ? "border-signal-300 bg-signal-50 text-signal-700" : undefined} />
      {farOutside ? <span className="text-xs font-semibold text-signal-700">far outside the range</span> : null}
    </span>
  );
}
