"use client";

import { useState } from "react";
import { Markdown } from "@/components/markdown";
import { Button } from "@/components/ui/button";
import { NumberField, SelectField, TextArea, TextField } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { CURRENCIES, LISTING_KINDS, MAGNETIC_SUBTYPES } from "@/lib/validations/listings";
import { kindLabel, subtypeLabel } from "@/lib/listings/labels";
import type { SectionProps } from "./form-context";

const KIND_OPTIONS = LISTING_KINDS.map((k) => ({ value: k, label: kindLabel(k) }));
const SUBTYPE_OPTIONS = MAGNETIC_SUBTYPES.map((s) => ({ value: s, label: subtypeLabel(s) }));
const CURRENCY_OPTIONS = CURRENCIES.map((c) => ({ value: c, label: c }));

export function BasicsSection({ values, set, errors, editing }: SectionProps) {
  const [preview, setPreview] = useState(false);
  return (
    <Panel title="Basics">
      <div className="space-y-4">
        <div className="grid gap-4 sm:grid-cols-2">
          <SelectField
            label="Kind"
            name="kind"
            options={KIND_OPTIONS}
            value={values.kind}
            disabled={editing}
            hint={editing ? "The kind of a listing stays as it was created." : "A board, a wound magnetic, or a complete kit."}
            onChange={(e) => set("kind", e.target.value)}
            error={errors.kind}
          />
          {values.kind === "magnetic" ? (
            <SelectField
              label="Magnetic subtype"
              name="magneticSubtype"
              options={SUBTYPE_OPTIONS}
              value={values.magneticSubtype}
              onChange={(e) => set("magneticSubtype", e.target.value)}
              error={errors.magneticSubtype}
            />
          ) : null}
        </div>
        <TextField label="Title" name="title" required value={values.title} onChange={(e) => set("title", e.target.value)} error={errors.title} hint="5 to 120 characters." />
        <div className="space-y-2">
          {preview ? (
            <div className="rounded border border-graphite-200 bg-paper-raised p-3" aria-label="Description preview">
              <p className="mb-2 text-sm font-semibold text-graphite-900">Description (preview)</p>
              {values.descriptionMd.trim() ? <Markdown minHeadingLevel={3}>{values.descriptionMd}</Markdown> : <p className="text-sm text-graphite-600">Nothing written yet.</p>}
            </div>
          ) : (
            <TextArea
              label="Description"
              name="descriptionMd"
              rows={8}
              value={values.descriptionMd}
              onChange={(e) => set("descriptionMd", e.target.value)}
              error={errors.descriptionMd}
              hint="Markdown: headings, lists, links. What is in the box, what the builder needs besides."
            />
          )}
          <Button size="sm" variant="quiet" onClick={() => setPreview((p) => !p)} aria-pressed={preview}>
            {preview ? "Edit the description" : "Preview the description"}
          </Button>
        </div>
        <div className="grid gap-4 sm:grid-cols-4">
          <div className="sm:col-span-2">
            <TextField
              label="Price"
              name="price"
              inputMode="decimal"
              required
              value={values.price}
              onChange={(e) => set("price", e.target.value)}
              error={errors.price}
              hint="In major units with a point, e.g. 48.50."
              className="font-mono"
            />
          </div>
          <SelectField label="Currency" name="currency" options={CURRENCY_OPTIONS} value={values.currency} onChange={(e) => set("currency", e.target.value)} error={errors.currency} />
          <NumberField label="Stock" name="stock" step="1" min={0} value={values.stock} onChange={(e) => set("stock", e.target.value)} error={errors.stock} />
        </div>
        <div className="max-w-xs">
          <NumberField label="Shipping weight" name="shippingWeightG" unit="g" step="1" min={0} value={values.shippingWeightG} onChange={(e) => set("shippingWeightG", e.target.value)} error={errors.shippingWeightG} />
        </div>
      </div>
    </Panel>
  );
}
