import type { ReactNode } from "react";
import { cx } from "./cx";

export type PageHeaderProps = {
  title: ReactNode;
  lede?: ReactNode;
  /** A short line above the title, e.g. the listing kind or the queue's name. */
  eyebrow?: ReactNode;
  actions?: ReactNode;
  className?: string;
};

/** The page's one h1, with its lede and the page's main actions. */
export function PageHeader({ title, lede, eyebrow, actions, className }: PageHeaderProps) {
  return (
    <header className={cx("flex flex-wrap items-end justify-between gap-4 border-b border-graphite-200 pb-4", className)}>
      <div className="max-w-reading">
        {eyebrow != null ? <p className="text-sm font-medium text-graphite-600">{eyebrow}</p> : null}
        <h1 className="text-3xl font-semibold text-graphite-900">{title}</h1>
        {lede != null ? <p className="mt-2 text-lg text-graphite-600">{lede}</p> : null}
      </div>
      {actions != null ? <div className="flex flex-wrap items-center gap-2">{actions}</div> : null}
    </header>
  );
}
