import Link from "next/link";
import { ProductStateBadge } from "@/components/ui/state-badge";
import { Table, TBody, TD, TH, THead, TRow, type SortDirection } from "@/components/ui/table";
import type { SellerListingRow } from "@/db/queries/listings";
import { formatMoney } from "@/lib/format/money";
import { kindLabel } from "@/lib/listings/labels";
import type { ListingSort } from "@/lib/validations/listings";
import { StockEditor } from "./stock-editor";

type Sort = { sort: ListingSort; dir: "asc" | "desc" };

// A first click sorts text ascending and figures and dates from the largest or newest.
const FIRST_DIRECTION: Record<ListingSort, "asc" | "desc"> = { title: "asc", state: "asc", price: "desc", stock: "desc", updated: "desc" };

function header(column: ListingSort, current: Sort): { sort: SortDirection; sortHref: string } {
  const active = current.sort === column;
  const dir = active ? (current.dir === "asc" ? "desc" : "asc") : FIRST_DIRECTION[column];
  return {
    sort: active ? (current.dir === "asc" ? "ascending" : "descending") : "none",
    sortHref: `/sell?sort=${column}&dir=${dir}`,
  };
}

const dateFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "short", year: "numeric", timeZone: "UTC" });

/** The seller's listings, sortable by the URL, with inline stock edits and the latest word from moderation. */
export function ListingsTable({ rows, sort }: { rows: SellerListingRow[]; sort: Sort }) {
  return (
    <Table caption="Your listings" captionHidden data-testid="seller-listings">
      <THead>
        <TRow>
          <TH {...header("title", sort)}>Title</TH>
          <TH {...header("state", sort)}>State</TH>
          <TH numeric {...header("price", sort)}>Price</TH>
          <TH numeric {...header("stock", sort)}>Stock</TH>
          <TH>Latest from moderation</TH>
          <TH {...header("updated", sort)}>Updated</TH>
        </TRow>
      </THead>
      <TBody>
        {rows.map((row) => (
          <TRow key={row.id} data-testid={`listing-row-${row.id}`}>
            <TD>
              <Link href={`/sell/listings/${row.id}`} className="font-medium">
                {row.title}
              </Link>
              <div className="text-xs text-graphite-600">
                {kindLabel(row.kind, row.magneticSubtype)} · {row.photoCount} {row.photoCount === 1 ? "photo" : "photos"}
              </div>
            </TD>
            <TD>
              <ProductStateBadge kind="listing" state={row.state} />
            </TD>
            <TD numeric>{formatMoney(row.priceMinor, row.currency)}</TD>
            <TD numeric>
              <StockEditor listingId={row.id} title={row.title} stock={row.stock} disabled={row.state === "retired"} />
            </TD>
            <TD className="max-w-xs text-sm">
              {row.moderatorMessage ? <p className="line-clamp-3 whitespace-pre-line">{row.moderatorMessage}</p> : <span className="text-graphite-500">—</span>}
            </TD>
            <TD className="whitespace-nowrap text-sm">
              <time dateTime={row.updatedAt.toISOString()}>{dateFormat.format(row.updatedAt)}</time>
            </TD>
          </TRow>
        ))}
      </TBody>
    </Table>
  );
}
