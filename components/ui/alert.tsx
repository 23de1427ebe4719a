import type { ReactNode } from "react";
import { cx } from "./cx";

export type AlertTone = "info" | "caution" | "stop";

export type AlertProps = {
  tone?: AlertTone;
  title?: ReactNode;
  children?: ReactNode;
  /**
   * "alert" interrupts a screen reader, so by default only `stop` uses it; `info` and `caution`
   * are polite `status` regions. Pass "none" for a note that is part of the page's content.
   */
  role?: "alert" | "status" | "none";
  className?: string;
};

// The tone is also spelled out as a word, so it never rests on colour alone.
const tones: Record<AlertTone, { word: string; box: string; wordClass: string }> = {
  info: { word: "Note", box: "border-graphite-400 bg-paper-sunken text-graphite-900", wordClass: "text-graphite-700" },
  caution: { word: "Caution", box: "border-amber-500 bg-amber-50 text-graphite-900", wordClass: "text-amber-700" },
  stop: { word: "Stop", box: "border-signal-700 bg-signal-50 text-graphite-900", wordClass: "text-signal-700" },
};

export function Alert({ tone = "info", title, children, role, className }: AlertProps) {
  const style = tones[tone];
  const effectiveRole = role ?? (tone === "stop" ? "alert" : "status");
  return (
    <div
      role={effectiveRole === "none" ? undefined : effectiveRole}
      data-tone={tone}
      className={cx("rounded border-l-4 px-4 py-3", style.box, className)}
    >
      <p className="font-semibold">
        <span className={cx("text-xs tracking-wide uppercase", style.wordClass)}>{style.word}</span>
        {title != null ? <span className="ml-2">{title}</span> : null}
      </p>
      {children != null ? <div className="mt-1 text-sm">{children}</div> : null}
    </div>
  );
}
