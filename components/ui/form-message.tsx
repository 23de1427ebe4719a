import type { ReactNode } from "react";
import { cx } from "./cx";

export type FormMessageTone = "success" | "error" | "info";

export type FormMessageProps = {
  tone?: FormMessageTone;
  /** The result's message; nothing is shown while it is empty, but the region stays mounted. */
  message?: ReactNode;
  className?: string;
};

const tones: Record<FormMessageTone, string> = {
  success: "border-verdigris-600 bg-verdigris-50 text-verdigris-800",
  error: "border-signal-700 bg-signal-50 text-signal-800",
  info: "border-graphite-300 bg-paper-sunken text-graphite-800",
};

/**
 * The live region a form announces its result in. Render it on first paint, before any
 * result exists: screen readers only announce changes to a region they already know about.
 */
export function FormMessage({ tone = "info", message, className }: FormMessageProps) {
  const hasMessage = message !== undefined && message !== null && message !== "";
  return (
    <div aria-live="polite" aria-atomic="true" className={className}>
      {hasMessage ? (
        <p className={cx("rounded border-l-4 px-3 py-2 text-sm", tones[tone])}>{message}</p>
      ) : null}
    </div>
  );
}
