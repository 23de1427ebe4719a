"use client";

import { useEffect, useRef, useState, type ReactNode } from "react";

export type DeferredDetailsProps = {
  summary: ReactNode;
  /** shown whenever the details are open, rendered on the server (cautions, notes) */
  lead?: ReactNode;
  /** rendered the first time the details open, then kept (a form keeps what was typed when closed) */
  children: ReactNode;
  className?: string;
  summaryClassName?: string;
  bodyClassName?: string;
  testId?: string;
};

/**
 * A closed <details> around a client form. A bring-up log has one reading form and one attach form
 * per checkpoint, almost all closed; hydrating them all is most of the page's main-thread work on a
 * phone (Lighthouse's Total Blocking Time). The body is rendered when first opened instead; the
 * forms need JavaScript to submit anyway, and without it the drawer says so.
 */
export function DeferredDetails({ summary, lead, children, className, summaryClassName, bodyClassName, testId }: DeferredDetailsProps) {
  const ref = useRef<HTMLDetailsElement>(null);
  const [opened, setOpened] = useState(false);
  // Opened before the page was interactive: no toggle event reached React.
  useEffect(() => {
    if (ref.current?.open) setOpened(true);
  }, []);
  return (
    <details ref={ref} className={className} data-testid={testId} onToggle={(event) => event.currentTarget.open && setOpened(true)}>
      <summary className={summaryClassName}>{summary}</summary>
      <div className={bodyClassName}>
        {lead}
        {opened ? (
          children
        ) : (
          // Without JavaScript the body never renders; say so rather than open an empty drawer.
          <noscript>
            <p className="text-sm text-graphite-600">This form needs JavaScript. Turn it on in your browser to use it.</p>
          </noscript>
        )}
      </div>
    </details>
  );
}
