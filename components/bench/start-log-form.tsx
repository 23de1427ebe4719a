"use client";

import { useState, useTransition, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { SelectField, TextField } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import type { BenchFormResult } from "@/lib/validations/bench";

export type KitOption = { id: string; title: string; checkpoints: number };

export type StartLogFormProps = {
  bought: KitOption[];
  catalog: KitOption[];
  /** redirects to the new log on success */
  action: (input: unknown) => Promise<BenchFormResult>;
};

const optionLabel = (kit: KitOption) => `${kit.title} (${kit.checkpoints} checkpoint${kit.checkpoints === 1 ? "" : "s"})`;

/** Start a log from a kit (the ones bought here first) or for a build of one's own. */
export function StartLogForm({ bought, catalog, action }: StartLogFormProps) {
  const [kitListingId, setKit] = useState(bought[0]?.id ?? "");
  const [title, setTitle] = useState("");
  const [result, setResult] = useState<BenchFormResult | null>(null);
  const [pending, startTransition] = useTransition();
  const errors = result && !result.ok ? result.fieldErrors : {};
  const ownBuild = kitListingId === "";

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    startTransition(async () => {
      // On success the action redirects to the new log, so only a refusal comes back.
      setResult(await action({ kitListingId, title }));
    });
  };

  return (
    <form onSubmit={submit} noValidate aria-label="Start a log" className="space-y-4" data-testid="start-log-form">
      <SelectField
        label="What are you building?"
        hint="A kit's log starts with the seller's checkpoints and expected ranges. For a build of your own you add the checkpoints yourself."
        value={kitListingId}
        onChange={(event) => setKit(event.currentTarget.value)}
        error={errors.kitListingId}
      >
        {bought.length > 0 ? (
          <optgroup label="Kits you bought here">
            {bought.map((kit) => (
              <option key={kit.id} value={kit.id}>
                {optionLabel(kit)}
              </option>
            ))}
          </optgroup>
        ) : null}
        {catalog.length > 0 ? (
          <optgroup label={bought.length > 0 ? "Other kits in the catalog" : "Kits in the catalog"}>
            {catalog.map((kit) => (
              <option key={kit.id} value={kit.id}>
                {optionLabel(kit)}
              </option>
            ))}
          </optgroup>
        ) : null}
        <option value="">No kit — a build of my own</option>
      </SelectField>
      <TextField
        label="Title"
        hint={ownBuild ? "Name your build, e.g. Bench supply, second board." : "Leave empty to use the kit's name, or name this build, e.g. Second board."}
        required={ownBuild}
        maxLength={120}
        value={title}
        onChange={(event) => setTitle(event.currentTarget.value)}
        error={errors.title}
      />
      <FormMessage tone="error" message={result && !result.ok ? result.message : undefined} />
      <Button type="submit" disabled={pending}>
        {pending ? "Starting…" : "Start the log"}
      </Button>
    </form>
  );
}
