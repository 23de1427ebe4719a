import { cx } from "@/components/ui/cx";

export type ElectricityWarningSignProps = { size?: number; className?: string };

/**
 * The "Warning; electricity" sign of ISO 7010 (W012): a yellow triangle with a black band and
 * a black lightning arrow pointing down. Drawn here from that description, not copied from an
 * artwork file. Colours are the hazard tokens of tailwind.config.ts, written out because SVG
 * presentation attributes cannot take utility classes.
 */
export function ElectricityWarningSign({ size = 24, className }: ElectricityWarningSignProps) {
  return (
    <svg
      role="img"
      aria-label="Warning: electricity"
      viewBox="0 0 100 90"
      width={size}
      height={(size * 90) / 100}
      className={cx("inline-block shrink-0", className)}
      xmlns="http://www.w3.org/2000/svg"
    >
      {/* Rounded corners come from the round stroke join of the black band. */}
      <path d="M50 6 L95 84 H5 Z" fill="#F9A800" stroke="#000000" strokeWidth="8" strokeLinejoin="round" />
      <polyline
        points="58,26 44,52 57,49 49.4,66.2"
        fill="none"
        stroke="#000000"
        strokeWidth="5"
        strokeLinejoin="miter"
        strokeMiterlimit="10"
      />
      <polygon points="45,77 54.8,67.9 43.8,63" fill="#000000" />
    </svg>
  );
}

export type MainsCautionProps = {
  /** "short" is the footer's one line; "full" goes on listing pages, sheets, logs and calculators. */
  variant?: "short" | "full";
  className?: string;
};

export function MainsCaution({ variant = "full", className }: MainsCautionProps) {
  if (variant === "short") {
    return (
      <p className={cx("flex items-center gap-2 text-sm", className)}>
        <ElectricityWarningSign size={18} />
        <span>
          Mains and charged capacitors can kill. Local electrical codes and licensed practice take precedence.
        </span>
      </p>
    );
  }
  return (
    <aside
      aria-label="Mains safety"
      className={cx("flex gap-3 rounded border-l-4 border-amber-500 bg-amber-50 px-4 py-3 text-graphite-900", className)}
    >
      <ElectricityWarningSign size={36} className="mt-0.5" />
      <div className="max-w-reading">
        <p className="font-semibold">Mains and charged capacitors can kill.</p>
        <ul className="mt-1 list-disc space-y-0.5 pl-5 text-sm">
          <li>Work only de-energised and discharged — verify with a meter.</li>
          <li>Use an isolation transformer or a series lamp for first power-up.</li>
          <li>Local electrical codes and licensed practice take precedence over anything on this site.</li>
        </ul>
      </div>
    </aside>
  );
}

/** The line every calculator carries under its results. */
export function EstimateNote({ className }: { className?: string }) {
  return (
    <p className={cx("text-sm text-graphite-600", className)}>
      Results are estimates for checking a design, not a certification.
    </p>
  );
}
