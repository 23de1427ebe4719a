/** Upload progress as a bar and as a number, so it never rests on the bar alone. */
export function ProgressBar({ value, label }: { value: number; label: string }) {
  const percent = Math.max(0, Math.min(100, Math.round(value)));
  return (
    <div className="flex items-center gap-2">
      <div
        role="progressbar"
        aria-label={label}
        aria-valuemin={0}
        aria-valuemax={100}
        aria-valuenow={percent}
        className="h-2 flex-1 overflow-hidden rounded-full bg-graphite-100"
      >
        <div className="h-full bg-copper-600 transition-[width]" style={{ width: `${percent}%` }} />
      </div>
      <span className="figure w-12 text-right font-mono text-xs text-graphite-700">{percent} %</span>
    </div>
  );
}
