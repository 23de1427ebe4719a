import Link from "next/link";
import type { ComponentProps, ReactNode } from "react";
import { cx } from "./cx";

export type TableProps = ComponentProps<"table"> & {
  /** Names the table for assistive tech; pass `captionHidden` when a heading already shows it. */
  caption?: ReactNode;
  captionHidden?: boolean;
};

/** Dense data table for sellers and moderators; scrolls sideways on narrow screens. */
export function Table({ caption, captionHidden = false, className, children, ...table }: TableProps) {
  return (
    <div className="overflow-x-auto rounded border border-graphite-200 bg-paper-raised">
      <table {...table} className={cx("w-full border-collapse text-left text-sm", className)}>
        {caption != null ? (
          <caption className={cx("px-3 py-2 text-left font-semibold text-graphite-900", captionHidden && "sr-only")}>
            {caption}
          </caption>
        ) : null}
        {children}
      </table>
    </div>
  );
}

export function THead({ className, ...props }: ComponentProps<"thead">) {
  return <thead className={cx("border-b border-graphite-300 bg-paper-sunken", className)} {...props} />;
}

export function TBody({ className, ...props }: ComponentProps<"tbody">) {
  return <tbody className={cx("divide-y divide-graphite-100", className)} {...props} />;
}

export function TRow({ className, ...props }: ComponentProps<"tr">) {
  return <tr className={cx("hover:bg-paper-sunken/60", className)} {...props} />;
}

export type SortDirection = "ascending" | "descending" | "none";

export type THProps = ComponentProps<"th"> & {
  numeric?: boolean;
  /** The column's current sort; only the column the rows are sorted by should say asc/desc. */
  sort?: SortDirection;
  /** URL that sorts by this column (sorting lives in the URL, so it is a plain link). */
  sortHref?: ComponentProps<typeof Link>["href"];
};

const arrows: Record<SortDirection, string> = { ascending: "↑", descending: "↓", none: "" };

export function TH({ numeric = false, sort, sortHref, scope = "col", className, children, ...props }: THProps) {
  const arrow = sort ? arrows[sort] : "";
  const label = (
    <>
      {children}
      {/* aria-sort already tells assistive tech; the arrow is for the eye, not colour alone. */}
      {arrow !== "" ? (
        <span aria-hidden="true" className="ml-1 font-mono">
          {arrow}
        </span>
      ) : null}
    </>
  );
  return (
    <th
      scope={scope}
      aria-sort={sort}
      className={cx(
        "px-3 py-cell text-xs font-semibold tracking-wide text-graphite-700 uppercase whitespace-nowrap",
        numeric && "text-right",
        className,
      )}
      {...props}
    >
      {sortHref !== undefined ? (
        <Link href={sortHref} className="text-graphite-900 no-underline hover:underline">
          {label}
        </Link>
      ) : (
        label
      )}
    </th>
  );
}

export type TDProps = ComponentProps<"td"> & {
  /** Right-aligned mono figures with tabular digits, so columns of values line up. */
  numeric?: boolean;
};

export function TD({ numeric = false, className, ...props }: TDProps) {
  return (
    <td
      className={cx(
        "px-3 py-cell align-top text-graphite-900",
        numeric && "figure text-right font-mono whitespace-nowrap",
        className,
      )}
      {...props}
    />
  );
}
