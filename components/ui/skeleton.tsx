import type { ReactNode } from "react";
import { cx } from "./cx";

/** One grey block; hidden from assistive tech, which hears the surrounding `Loading` instead. */
export function Skeleton({ className }: { className?: string }) {
  return <div aria-hidden="true" className={cx("rounded bg-graphite-100 motion-safe:animate-pulse", className)} />;
}

/** Announces that a region is loading; wrap placeholders in it (Suspense fallbacks, loading.tsx). */
export function Loading({ label = "Loading", children, className }: { label?: string; children?: ReactNode; className?: string }) {
  return (
    <div role="status" aria-live="polite" className={className}>
      <span className="sr-only">{label}…</span>
      {children}
    </div>
  );
}

export function SkeletonText({ lines = 3, className }: { lines?: number; className?: string }) {
  return (
    <Loading className={cx("flex max-w-reading flex-col gap-2", className)}>
      {Array.from({ length: lines }, (_, i) => (
        // The last line is shorter, as a paragraph's is.
        <Skeleton key={i} className={cx("h-4", i === lines - 1 && lines > 1 ? "w-2/3" : "w-full")} />
      ))}
    </Loading>
  );
}

export function SkeletonTable({ rows = 5, columns = 4, className }: { rows?: number; columns?: number; className?: string }) {
  return (
    <Loading className={cx("flex flex-col gap-2 rounded border border-graphite-200 bg-paper-raised p-3", className)}>
      {Array.from({ length: rows }, (_, r) => (
        <div key={r} className="flex gap-3">
          {Array.from({ length: columns }, (_, c) => (
            <Skeleton key={c} className="h-5 flex-1" />
          ))}
        </div>
      ))}
    </Loading>
  );
}
