"use client";

import { useId, useState, useTransition, type FormEvent } from "react";
import { PhotoUploader, type PhotoValue } from "@/components/uploads/photo-uploader";
import { Button } from "@/components/ui/button";
import { SelectField, TextArea, TextField } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import type { BenchFormResult } from "@/lib/validations/bench";

export type RecordReadingFormProps = {
  checkpoint: { id: string; name: string; unit: string; range: string };
  /** units of the checkpoint's quantity, from unitChoices() on the server */
  units: string[];
  action: (input: unknown) => Promise<BenchFormResult>;
};

const EMPTY = { value: "", instrument: "", note: "" };

/**
 * One reading at one checkpoint: value and unit (converted on the server to the checkpoint's
 * unit), instrument, note and photos. The server classifies it; the page then shows the verdict.
 */
export function RecordReadingForm({ checkpoint, units, action }: RecordReadingFormProps) {
  const formId = useId();
  const [fields, setFields] = useState(EMPTY);
  const [unit, setUnit] = useState(checkpoint.unit);
  const [photos, setPhotos] = useState<PhotoValue[]>([]);
  const [result, setResult] = useState<BenchFormResult | null>(null);
  const [pending, startTransition] = useTransition();
  const errors = result && !result.ok ? result.fieldErrors : {};
  // A refusal already spelled out beside its field is announced here in short, not twice in full.
  const besideField = result !== null && !result.ok && Object.values(errors).some((messages) => messages.includes(result.message));
  const message = besideField ? "Nothing was saved: fix the entry marked above." : result?.message;

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    startTransition(async () => {
      const answer = await action({
        checkpointId: checkpoint.id,
        value: fields.value,
        unit,
        instrument: fields.instrument,
        note: fields.note,
        photos: photos.map((p) => ({ key: p.key, alt: p.alt })),
      });
      setResult(answer);
      if (answer.ok) {
        setFields(EMPTY);
        setUnit(checkpoint.unit);
        setPhotos([]);
      }
    });
  };
  const set = (name: keyof typeof EMPTY) => (event: { currentTarget: { value: string } }) => {
    const value = event.currentTarget.value;
    setFields((f) => ({ ...f, [name]: value }));
  };

  return (
    <form onSubmit={submit} noValidate aria-label={`Record a reading at ${checkpoint.name}`} className="space-y-4" data-testid="record-reading-form">
      <div className="grid gap-4 sm:grid-cols-[2fr_1fr]">
        <TextField
          id={`${formId}-value`}
          label="Reading"
          inputMode="decimal"
          autoComplete="off"
          required
          className="figure font-mono"
          hint={`Expected ${checkpoint.range}. A reading in another unit is converted to ${checkpoint.unit}.`}
          value={fields.value}
          onChange={set("value")}
          error={errors.value}
        />
        <SelectField
          id={`${formId}-unit`}
          label="Unit"
          value={unit}
          onChange={(event) => setUnit(event.currentTarget.value)}
          options={units.map((u) => ({ value: u, label: u }))}
          error={errors.unit}
        />
      </div>
      <TextField
        id={`${formId}-instrument`}
        label="Instrument"
        hint="What you measured with, e.g. a handheld meter on its 600 V range, or a 100 MHz scope with a ×10 probe."
        value={fields.instrument}
        onChange={set("instrument")}
        error={errors.instrument}
        maxLength={120}
      />
      <TextArea id={`${formId}-note`} label="Note" rows={3} value={fields.note} onChange={set("note")} error={errors.note} maxLength={2000} />
      <PhotoUploader endpoint="readingPhoto" label="Photos of this reading" value={photos} onChange={setPhotos} error={errors.photos} disabled={pending} />
      <div data-testid="reading-form-result">
        <FormMessage tone={result?.ok ? (result.outsideRange ? "info" : "success") : "error"} message={message} />
      </div>
      <Button type="submit" disabled={pending}>
        {pending ? "Recording…" : "Record reading"}
      </Button>
    </form>
  );
}
