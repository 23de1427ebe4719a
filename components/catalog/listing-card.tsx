import Link from "next/link";
import type { CatalogCard } from "@/db/queries/catalog";
import { StateBadge } from "@/components/ui/state-badge";
import { formatMoney } from "@/lib/format/money";
import { kindLabel } from "@/lib/listings/labels";

export function ListingCard({ item }: { item: CatalogCard }) {
  return (
    <li className="overflow-hidden rounded-md border border-graphite-200 bg-paper-raised shadow-sm">
      <Link href={`/listings/${item.slug}`} className="block no-underline hover:bg-paper-sunken" data-testid={`listing-card-${item.slug}`}>
        {item.coverUrl ? (
          // eslint-disable-next-line @next/next/no-img-element -- uploads come from the provider's host
          <img src={item.coverUrl} alt={item.coverAlt ?? ""} className="aspect-[4/3] w-full object-cover" loading="lazy" width={480} height={360} />
        ) : (
          <div className="aspect-[4/3] w-full bg-graphite-100" aria-hidden="true" />
        )}
        <div className="space-y-2 p-4">
          <div className="flex flex-wrap gap-1">
            <StateBadge label={kindLabel(item.kind, item.magneticSubtype)} />
            {item.mainsConnected ? <StateBadge label="mains-connected" tone="caution" /> : null}
          </div>
          <h3 className="text-base font-semibold text-graphite-900">{item.title}</h3>
          <p className="flex items-baseline justify-between text-sm">
            <span className="font-mono text-lg text-graphite-900" data-price-minor={item.priceMinor}>
              {formatMoney(item.priceMinor, item.currency)}
            </span>
            <span className={item.stock > 0 ? "text-graphite-600" : "font-medium text-signal-700"}>{item.stock > 0 ? `${item.stock} in stock` : "out of stock"}</span>
          </p>
          {item.shopName ? <p className="text-xs text-graphite-600">from {item.shopName}</p> : null}
        </div>
      </Link>
    </li>
  );
}
