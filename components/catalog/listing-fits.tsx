import "server-only";
import Link from "next/link";
import { Figure } from "@/components/ui/figure";
import { Panel } from "@/components/ui/panel";
import { KITS_PER_MAGNETIC, kitsFittedByMagnetic, magneticsFittingKit } from "@/db/queries/catalog";
import type { ListingKind } from "@/db/schema/listings";
import { formatMoney } from "@/lib/format/money";
import { subtypeLabel } from "@/lib/listings/labels";

const stockWords = (stock: number) => (stock > 0 ? `${stock} in stock` : "out of stock");

/** "Kits this part fits" on a magnetic's page; nothing when no live kit asks for it. */
export async function KitsThisPartFits({ listingId }: { listingId: string }) {
  const found = await kitsFittedByMagnetic(listingId);
  if (found.length === 0) return null;
  const kits = found.slice(0, KITS_PER_MAGNETIC);
  const more = found.length > KITS_PER_MAGNETIC;
  return (
    <Panel title="Kits this part fits">
      <p className="mb-3 max-w-reading text-sm text-graphite-700">Live kits whose stated need this part meets, by its subtype, inductance and rated current.</p>
      <ul className="space-y-2 text-sm" data-testid="kits-this-part-fits">
        {kits.map((kit) => (
          <li key={kit.id} className="flex flex-wrap items-baseline gap-x-3">
            <Link href={`/listings/${kit.slug}`} className="font-semibold">
              {kit.title}
            </Link>
            <span className="text-graphite-600">as its {kit.requirementLabel.toLowerCase()}</span>
            <span className="font-mono">{formatMoney(kit.priceMinor, kit.currency)}</span>
            <span className="text-graphite-600">{stockWords(kit.stock)}</span>
          </li>
        ))}
      </ul>
      {more ? (
        <p className="mt-3 text-sm text-graphite-600">
          More kits ask for a part like this one; <Link href="/catalog?kind=kit">browse the kits in the catalog</Link>.
        </p>
      ) : null}
    </Panel>
  );
}

/** "Magnetics that fit this kit": each of the kit's needs with the live magnetics that meet it. */
export async function MagneticsThatFitKit({ listingId }: { listingId: string }) {
  const requirements = await magneticsFittingKit(listingId);
  if (requirements.length === 0) return null;
  return (
    <Panel title="Magnetics that fit this kit">
      <div className="space-y-4 text-sm" data-testid="magnetics-that-fit">
        {requirements.map((r) => (
          <section key={r.requirementId} aria-label={r.label}>
            <h3 className="font-semibold text-graphite-900">
              {r.label} <span className="font-normal text-graphite-600">({subtypeLabel(r.subtype).toLowerCase()}</span>
              {r.minInductanceH !== null ? (
                <span className="font-normal text-graphite-600">
                  , at least <Figure value={r.minInductanceH} unit="H" />
                </span>
              ) : null}
              {r.atCurrentA !== null ? (
                <span className="font-normal text-graphite-600">
                  {" "}at <Figure value={r.atCurrentA} unit="A" />
                </span>
              ) : null}
              <span className="font-normal text-graphite-600">)</span>
            </h3>
            {r.magnetics.length === 0 ? (
              <p className="mt-1 text-graphite-600">No live listing meets this yet.</p>
            ) : (
              <ul className="mt-1 space-y-1">
                {r.magnetics.map((m) => (
                  <li key={m.id} className="flex flex-wrap items-baseline gap-x-3">
                    <Link href={`/listings/${m.slug}`}>{m.title}</Link>
                    {m.inductanceH !== null ? <Figure value={m.inductanceH} unit="H" /> : null}
                    {m.ratedCurrentA !== null ? <Figure value={m.ratedCurrentA} unit="A" /> : null}
                    <span className="font-mono">{formatMoney(m.priceMinor, m.currency)}</span>
                    <span className="text-graphite-600">
                      {stockWords(m.stock)}
                      {m.shopName ? ` · from ${m.shopName}` : ""}
                    </span>
                  </li>
                ))}
              </ul>
            )}
          </section>
        ))}
      </div>
    </Panel>
  );
}

/** The fit section a listing's kind calls for, if any. */
export function ListingFits({ listingId, kind }: { listingId: string; kind: ListingKind }) {
  if (kind === "magnetic") return <KitsThisPartFits listingId={listingId} />;
  if (kind === "kit") return <MagneticsThatFitKit listingId={listingId} />;
  return null;
}
