"use client";

import { useState, useTransition, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import type { BenchFormResult } from "@/lib/validations/bench";

export type AddCheckpointFormProps = {
  stages: { value: string; label: string }[];
  action: (input: unknown) => Promise<BenchFormResult>;
};

const EMPTY = { stage: "", name: "", measure: "", unit: "", expectedMin: "", expectedMax: "" };
type Name = keyof typeof EMPTY;

/** A checkpoint of the builder's own: a stage, what to measure, the unit and the range they expect. */
export function AddCheckpointForm({ stages, action }: AddCheckpointFormProps) {
  const [fields, setFields] = useState(EMPTY);
  const [result, setResult] = useState<BenchFormResult | null>(null);
  const [pending, startTransition] = useTransition();
  const errors = result && !result.ok ? result.fieldErrors : {};
  const bind = (name: Name) => ({
    name,
    value: fields[name],
    error: errors[name],
    onChange: (event: { currentTarget: { value: string } }) => {
      const value = event.currentTarget.value;
      setFields((f) => ({ ...f, [name]: value }));
    },
  });

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    startTransition(async () => {
      const answer = await action(fields);
      setResult(answer);
      if (answer.ok) setFields(EMPTY);
    });
  };

  return (
    <form onSubmit={submit} noValidate aria-label="Add a checkpoint" className="space-y-4" data-testid="add-checkpoint-form">
      <div className="grid gap-4 sm:grid-cols-2">
        <SelectField label="Stage" placeholder="Choose a stage" options={stages} required {...bind("stage")} />
        <TextField label="Checkpoint" hint="A short name, e.g. Auxiliary rail." required maxLength={120} {...bind("name")} />
      </div>
      <TextField label="What to measure" hint="Where and how, e.g. 12 V rail at the fan header, meter on DC." required maxLength={300} {...bind("measure")} />
      <div className="grid gap-4 sm:grid-cols-3">
        <TextField label="Unit" hint="V, mA, kHz, °C …" required maxLength={12} className="font-mono" {...bind("unit")} />
        <TextField label="Lowest expected" inputMode="decimal" required className="figure font-mono" {...bind("expectedMin")} />
        <TextField label="Highest expected" inputMode="decimal" required className="figure font-mono" {...bind("expectedMax")} />
      </div>
      <FormMessage tone={result?.ok ? "success" : "error"} message={result?.message} />
      <Button type="submit" variant="secondary" disabled={pending}>
        {pending ? "Adding…" : "Add checkpoint"}
      </Button>
    </form>
  );
}
