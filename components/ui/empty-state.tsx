import type { ReactNode } from "react";
import { cx } from "./cx";

export type EmptyStateProps = {
  title: ReactNode;
  children?: ReactNode;
  /** What the person can do next, e.g. a ButtonLink to create the first listing. */
  action?: ReactNode;
  className?: string;
};

export function EmptyState({ title, children, action, className }: EmptyStateProps) {
  return (
    <div className={cx("rounded-md border border-dashed border-graphite-300 bg-paper-sunken px-6 py-10 text-center", className)}>
      <p className="text-lg font-semibold text-graphite-900">{title}</p>
      {children != null ? <div className="mx-auto mt-2 max-w-reading text-graphite-600">{children}</div> : null}
      {action != null ? <div className="mt-4 flex justify-center">{action}</div> : null}
    </div>
  );
}
