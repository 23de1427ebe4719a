import Link from "next/link";
import type { MouseEvent } from "react";

// Pages around the current one, plus the first and last, so a long catalog stays one line.
function pageList(page: number, pages: number): (number | "gap")[] {
  const wanted = new Set([1, pages, page - 1, page, page + 1].filter((p) => p >= 1 && p <= pages));
  const sorted = [...wanted].sort((a, b) => a - b);
  const out: (number | "gap")[] = [];
  sorted.forEach((p, i) => {
    if (i > 0 && p - (sorted[i - 1] ?? p) > 1) out.push("gap");
    out.push(p);
  });
  return out;
}

/** Real links (they work without JavaScript and open in a new tab); `onPage` turns a plain click into a client update. */
export function CatalogPagination({
  page,
  pages,
  hrefFor,
  onPage,
}: {
  page: number;
  pages: number;
  hrefFor: (page: number) => string;
  onPage?: (page: number) => void;
}) {
  if (pages <= 1) return null;
  const follow = (target: number) => (event: MouseEvent<HTMLAnchorElement>) => {
    if (!onPage || event.button !== 0 || event.metaKey || event.ctrlKey || event.shiftKey || event.altKey) return;
    event.preventDefault();
    onPage(target);
  };
  const link = "inline-flex h-9 min-w-9 items-center justify-center rounded border border-graphite-300 px-3 no-underline hover:bg-graphite-50";
  return (
    <nav aria-label="Pages" className="flex flex-wrap items-center gap-2 text-sm">
      {page > 1 ? (
        <Link href={hrefFor(page - 1)} onClick={follow(page - 1)} className={link} rel="prev">
          Previous page
        </Link>
      ) : null}
      {pageList(page, pages).map((p, i) =>
        p === "gap" ? (
          <span key={`gap-${i}`} aria-hidden="true" className="px-1 text-graphite-500">
            …
          </span>
        ) : p === page ? (
          <span key={p} aria-current="page" className={`${link} border-copper-600 bg-copper-50 font-semibold`}>
            <span className="sr-only">Page </span>
            {p}
          </span>
        ) : (
          <Link key={p} href={hrefFor(p)} onClick={follow(p)} className={link}>
            <span className="sr-only">Page </span>
            {p}
          </Link>
        ),
      )}
      {page < pages ? (
        <Link href={hrefFor(page + 1)} onClick={follow(page + 1)} className={link} rel="next">
          Next page
        </Link>
      ) : null}
    </nav>
  );
}
