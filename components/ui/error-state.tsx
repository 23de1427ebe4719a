import type { ReactNode } from "react";
import { cx } from "./cx";

export type ErrorStateProps = {
  title?: ReactNode;
  children?: ReactNode;
  /** Next's error digest; shown so a person can quote it, never the error's own message. */
  digest?: string;
  /** A retry control; error boundaries pass a client button that calls `reset()`. */
  action?: ReactNode;
  className?: string;
};

export function ErrorState({ title = "This part of the page could not be loaded", children, digest, action, className }: ErrorStateProps) {
  return (
    <div role="alert" className={cx("rounded-md border border-signal-200 bg-signal-50 px-6 py-8", className)}>
      <p className="text-lg font-semibold text-signal-800">{title}</p>
      {children != null ? <div className="mt-2 max-w-reading text-graphite-800">{children}</div> : null}
      {digest ? (
        <p className="mt-3 text-sm text-graphite-600">
          Reference: <code className="figure font-mono">{digest}</code>
        </p>
      ) : null}
      {action != null ? <div className="mt-4">{action}</div> : null}
    </div>
  );
}
