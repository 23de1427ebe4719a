import { ElectricityWarningSign } from "@/components/caution";
import { cx } from "@/components/ui/cx";
import type { ProbeCaution } from "@/lib/captures/probe-caution";

/** The short probing caution beside a gate-drive or mains-side trace. */
export function ProbeCautionNote({ caution, className }: { caution: ProbeCaution; className?: string }) {
  return (
    <aside aria-label="Probing caution" className={cx("flex gap-2 rounded border-l-4 border-amber-500 bg-amber-50 px-3 py-2 text-sm text-graphite-900", className)} data-testid="probe-caution" data-kind={caution.kind}>
      <ElectricityWarningSign size={20} className="mt-0.5" />
      <p>
        <span className="font-semibold">{caution.title}.</span> {caution.text}
      </p>
    </aside>
  );
}
