import { groupThousands } from "@/lib/format/plain";

/**
 * How deep the catalog looks. A text search considers the newest matching listings up to
 * CATALOG_DEPTH and sorts those; every view counts up to CATALOG_DEPTH and then says "more
 * than". Past that depth a broad word would make each search read a fifth of the catalog, so
 * its cost would grow with the catalog instead of with the page.
 */
export const CATALOG_DEPTH = 1000;

/** "1,000+"-style wording of a capped total. */
export function catalogCountText(total: number, capped: boolean): string {
  if (capped) return `More than ${groupThousands(total)} listings`;
  if (total === 0) return "No listings";
  return total === 1 ? "1 listing" : `${groupThousands(total)} listings`;
}
