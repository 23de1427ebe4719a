import type { ComponentProps } from "react";
import { cx } from "./cx";

/** A raised sheet of paper on the bench: one listing, one order, one checkpoint. */
export function Card({ className, ...props }: ComponentProps<"div">) {
  return <div className={cx("rounded-md border border-graphite-200 bg-paper-raised p-4 shadow-sm", className)} {...props} />;
}
