import { useId, type ReactNode } from "react";
import { cx } from "./cx";

export type PanelProps = {
  title: ReactNode;
  /** Heading level within the page; pages own their h1, so panels start at h2. */
  level?: 2 | 3 | 4;
  actions?: ReactNode;
  className?: string;
  children: ReactNode;
};

/** A titled region of a page (figures, checks, a queue); named by its heading for landmarks. */
export function Panel({ title, level = 2, actions, className, children }: PanelProps) {
  const headingId = `panel${useId().replace(/[^A-Za-z0-9_-]/g, "")}`;
  const Heading = `h${level}` as const;
  return (
    <section aria-labelledby={headingId} className={cx("rounded-md border border-graphite-200 bg-paper-raised", className)}>
      <header className="flex flex-wrap items-center justify-between gap-2 border-b border-graphite-200 px-4 py-3">
        <Heading id={headingId} className="text-base font-semibold text-graphite-900">
          {title}
        </Heading>
        {actions != null ? <div className="flex items-center gap-2">{actions}</div> : null}
      </header>
      <div className="p-4">{children}</div>
    </section>
  );
}
