"use client";

import { useEffect, useState } from "react";
import { CheckboxField, SelectField, TextField } from "@/components/ui/field";
import { Button } from "@/components/ui/button";
import { CATALOG_KINDS, CATALOG_SUBTYPES, majorToMinor, minorToMajor, type CatalogQuery } from "@/lib/validations/catalog-query";
import { useDebouncedValue } from "./use-debounced-value";

export type CatalogSeller = { slug: string; shopName: string };
export type FilterPatch = Partial<Omit<CatalogQuery, "q" | "page" | "sort">>;

const KIND_OPTIONS: Record<(typeof CATALOG_KINDS)[number], string> = { board: "Boards", magnetic: "Magnetics", kit: "Kits" };
const SUBTYPE_OPTIONS: Record<(typeof CATALOG_SUBTYPES)[number], string> = {
  transformer: "Transformers",
  choke: "Chokes",
  "current-transformer": "Current transformers",
};

export function hasFilters(query: CatalogQuery): boolean {
  return Boolean(query.kind || query.subtype || query.mains || query.minPrice !== undefined || query.maxPrice !== undefined || query.inStock || query.seller);
}

export function CatalogFilters({
  query,
  sellers,
  onChange,
  onClear,
}: {
  query: CatalogQuery;
  sellers: readonly CatalogSeller[];
  onChange: (patch: FilterPatch) => void;
  onClear: () => void;
}) {
  return (
    <fieldset className="space-y-4" aria-describedby="catalog-filters-hint">
      <legend className="text-base font-semibold text-graphite-900">Filters</legend>
      <p id="catalog-filters-hint" className="sr-only">
        Results update as you change a filter.
      </p>
      <SelectField
        label="Kind"
        value={query.kind ?? ""}
        // Another kind has no subtypes, so a chosen subtype goes with it.
        onChange={(e) => onChange({ kind: (e.target.value || undefined) as CatalogQuery["kind"], ...(e.target.value !== "magnetic" ? { subtype: undefined } : {}) })}
        placeholder="All kinds"
        options={CATALOG_KINDS.map((k) => ({ value: k, label: KIND_OPTIONS[k] }))}
      />
      {query.kind === "magnetic" || query.subtype ? (
        <SelectField
          label="Magnetic type"
          value={query.subtype ?? ""}
          onChange={(e) => onChange({ subtype: (e.target.value || undefined) as CatalogQuery["subtype"], kind: "magnetic" })}
          placeholder="All magnetics"
          options={CATALOG_SUBTYPES.map((s) => ({ value: s, label: SUBTYPE_OPTIONS[s] }))}
        />
      ) : null}
      <SelectField
        label="Mains connection"
        value={query.mains ?? ""}
        onChange={(e) => onChange({ mains: (e.target.value || undefined) as CatalogQuery["mains"] })}
        placeholder="Either"
        options={[
          { value: "yes", label: "Mains-connected" },
          { value: "no", label: "Not mains-connected" },
        ]}
      />
      <PriceRange minPrice={query.minPrice} maxPrice={query.maxPrice} onChange={onChange} />
      <CheckboxField label="In stock only" checked={query.inStock ?? false} onChange={(e) => onChange({ inStock: e.target.checked || undefined })} />
      {sellers.length > 0 ? (
        <SelectField
          label="Shop"
          value={query.seller ?? ""}
          onChange={(e) => onChange({ seller: e.target.value || undefined })}
          placeholder="All shops"
          options={sellers.map((s) => ({ value: s.slug, label: s.shopName }))}
        />
      ) : null}
      {hasFilters(query) ? (
        <Button variant="secondary" size="sm" onClick={onClear}>
          Clear filters
        </Button>
      ) : null}
    </fieldset>
  );
}

/**
 * Lowest and highest price in major units as typed; the query holds minor units. A bound applies once the
 * typing pauses and the amount reads as one; until then the field says what is wrong.
 */
function PriceRange({ minPrice, maxPrice, onChange }: { minPrice?: number; maxPrice?: number; onChange: (patch: FilterPatch) => void }) {
  const [minText, setMinText] = useState(() => minorToMajor(minPrice));
  const [maxText, setMaxText] = useState(() => minorToMajor(maxPrice));
  // A cleared filter (or a new URL) resets the fields, unless they already say the same amount.
  useEffect(() => setMinText((t) => (majorToMinor(t) === (minPrice ?? null) ? t : minorToMajor(minPrice))), [minPrice]);
  useEffect(() => setMaxText((t) => (majorToMinor(t) === (maxPrice ?? null) ? t : minorToMajor(maxPrice))), [maxPrice]);

  const settledMin = useDebouncedValue(minText, 400);
  const settledMax = useDebouncedValue(maxText, 400);
  const min = majorToMinor(settledMin);
  const max = majorToMinor(settledMax);
  const minError = min === undefined ? "Enter an amount such as 25 or 12.50." : undefined;
  const maxError =
    max === undefined ? "Enter an amount such as 25 or 12.50." : min != null && max != null && max < min ? "The highest price is below the lowest." : undefined;

  useEffect(() => {
    if (minError || maxError) return;
    const next = { minPrice: min ?? undefined, maxPrice: max ?? undefined };
    if (next.minPrice !== minPrice || next.maxPrice !== maxPrice) onChange(next);
    // Only a settled, valid pair of amounts changes the search.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [min, max, minError, maxError]);

  return (
    <div className="grid grid-cols-2 gap-3">
      <TextField label="Lowest price" hint="e.g. 25 or 12.50" inputMode="decimal" autoComplete="off" value={minText} onChange={(e) => setMinText(e.target.value)} error={minError} />
      <TextField label="Highest price" hint="e.g. 250" inputMode="decimal" autoComplete="off" value={maxText} onChange={(e) => setMaxText(e.target.value)} error={maxError} />
    </div>
  );
}
