"use client";

import { useState } from "react";
import { Markdown } from "@/components/markdown";
import { Button } from "@/components/ui/button";
import { NumberField, SelectField, TextArea, TextField } from "@/components/ui/field";
import type { ShopFieldName } from "@/lib/validations/sellers";

export type ShopFieldValues = Partial<Record<ShopFieldName, string>>;
export type ShopFieldErrors = Partial<Record<ShopFieldName, string[]>>;

/** A Markdown field with a preview through the one renderer, so what the seller sees is what buyers will. */
function MarkdownField({ label, name, hint, defaultValue, error }: { label: string; name: string; hint: string; defaultValue: string; error?: string[] }) {
  const [text, setText] = useState(defaultValue);
  const [preview, setPreview] = useState(false);
  return (
    <div className="space-y-2">
      {/* The textarea stays in the form while previewing, so the text is always submitted. */}
      <div className={preview ? "hidden" : undefined}>
        <TextArea label={label} name={name} rows={6} hint={hint} value={text} onChange={(e) => setText(e.target.value)} error={error} />
      </div>
      {preview ? (
        <div className="rounded border border-graphite-200 bg-paper-raised p-3" data-testid={`${name}-preview`}>
          <p className="mb-2 text-sm font-semibold">{label} (preview)</p>
          {text.trim() ? <Markdown minHeadingLevel={3}>{text}</Markdown> : <p className="text-sm text-graphite-600">Nothing written yet.</p>}
        </div>
      ) : null}
      <Button size="sm" variant="quiet" onClick={() => setPreview((p) => !p)} aria-pressed={preview}>
        {preview ? `Edit the ${label.toLowerCase()}` : `Preview the ${label.toLowerCase()}`}
      </Button>
    </div>
  );
}

export function ShopFields({ values, errors, countries }: { values: ShopFieldValues; errors: ShopFieldErrors; countries: { value: string; label: string }[] }) {
  return (
    <div className="space-y-4">
      <TextField label="Shop name" name="shopName" required defaultValue={values.shopName ?? ""} error={errors.shopName} hint="How buyers will see you, 3 to 60 characters." />
      <MarkdownField
        label="Profile"
        name="profileMd"
        hint="A few sentences in Markdown: what you make or wind, and how."
        defaultValue={values.profileMd ?? ""}
        error={errors.profileMd}
      />
      <SelectField label="Country you ship from" name="country" required placeholder="Choose a country" options={countries} defaultValue={values.country ?? ""} error={errors.country} />
      <MarkdownField
        label="Returns policy"
        name="returnsPolicyMd"
        hint="In Markdown: what can come back, in what state, and who pays the postage."
        defaultValue={values.returnsPolicyMd ?? ""}
        error={errors.returnsPolicyMd}
      />
      <div className="max-w-xs">
        <NumberField label="Returns window" name="returnsWindowDays" unit="days" step="1" min={0} max={365} defaultValue={values.returnsWindowDays ?? "30"} error={errors.returnsWindowDays} />
      </div>
    </div>
  );
}
