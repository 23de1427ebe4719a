"use client";

import { Button } from "@/components/ui/button";
import { NumberField, SelectField, TextField } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { STAGE_LABELS, subtypeLabel } from "@/lib/listings/labels";
import { BRING_UP_STAGES, MAGNETIC_SUBTYPES } from "@/lib/validations/listings";
import type { SectionProps } from "./form-context";
import { emptyCheckpoint, emptyRequirement } from "./form-model";

const STAGE_OPTIONS = BRING_UP_STAGES.map((s) => ({ value: s, label: STAGE_LABELS[s] }));
const SUBTYPE_OPTIONS = MAGNETIC_SUBTYPES.map((s) => ({ value: s, label: subtypeLabel(s) }));

function rowField(set: SectionProps["set"], errors: SectionProps["errors"], base: string, values: Record<string, string>) {
  return (key: string) => ({
    name: `${base}.${key}`,
    value: values[key] ?? "",
    onChange: (e: { target: { value: string } }) => set(`${base}.${key}`, e.target.value),
    error: errors[`${base}.${key}`],
  });
}

export function CheckpointsEditor({ values, set, errors }: SectionProps) {
  const rows = values.checkpoints;
  return (
    <Panel title="Bring-up checkpoints">
      <div className="space-y-3">
        <p className="text-sm text-graphite-600">
          What a builder measures at each stage of the first power-up, and the range you expect. Builders&apos; logs mark each reading
          within, low or high against these.
        </p>
        {rows.length === 0 ? <p className="text-sm text-graphite-600">No checkpoints yet.</p> : null}
        {rows.map((row, i) => {
          const field = rowField(set, errors, `checkpoints.${i}`, row);
          return (
            <fieldset key={i} className="grid gap-3 rounded border border-graphite-200 p-3 sm:grid-cols-6" data-testid={`checkpoint-${i}`}>
              <legend className="px-1 text-sm font-semibold">Checkpoint {i + 1}</legend>
              <div className="sm:col-span-2"><SelectField label="Stage" options={STAGE_OPTIONS} {...field("stage")} /></div>
              <div className="sm:col-span-2"><TextField label="Name" {...field("name")} /></div>
              <div className="sm:col-span-2"><TextField label="What to measure, where" {...field("measure")} /></div>
              <TextField label="Unit" {...field("unit")} />
              <NumberField label="Lowest expected" unit={row.unit || undefined} {...field("expectedMin")} />
              <NumberField label="Highest expected" unit={row.unit || undefined} {...field("expectedMax")} />
              <div className="flex items-end">
                <Button variant="quiet" size="sm" onClick={() => set("checkpoints", rows.filter((_, j) => j !== i))}>
                  Remove checkpoint {i + 1}
                </Button>
              </div>
            </fieldset>
          );
        })}
        <Button variant="secondary" size="sm" disabled={rows.length >= 40} onClick={() => set("checkpoints", [...rows, emptyCheckpoint()])}>
          Add a checkpoint
        </Button>
      </div>
    </Panel>
  );
}

export function RequirementsEditor({ values, set, errors }: SectionProps) {
  const rows = values.requirements;
  return (
    <Panel title="Magnetics the kit needs">
      <div className="space-y-3">
        <p className="text-sm text-graphite-600">
          State what each wound part must reach, e.g. an output choke of at least 40 µH at 120 A. Magnetics listings that meet it show
          that they fit this kit.
        </p>
        {rows.length === 0 ? <p className="text-sm text-graphite-600">No requirements yet.</p> : null}
        {rows.map((row, i) => {
          const field = rowField(set, errors, `requirements.${i}`, row);
          return (
            <fieldset key={i} className="grid gap-3 rounded border border-graphite-200 p-3 sm:grid-cols-5" data-testid={`requirement-${i}`}>
              <legend className="px-1 text-sm font-semibold">Requirement {i + 1}</legend>
              <SelectField label="Kind of magnetic" options={SUBTYPE_OPTIONS} {...field("subtype")} />
              <TextField label="Part" {...field("label")} />
              <NumberField label="At least" unit="µH" {...field("minInductanceH")} />
              <NumberField label="At current" unit="A" {...field("atCurrentA")} />
              <div className="flex items-end">
                <Button variant="quiet" size="sm" onClick={() => set("requirements", rows.filter((_, j) => j !== i))}>
                  Remove requirement {i + 1}
                </Button>
              </div>
            </fieldset>
          );
        })}
        <Button variant="secondary" size="sm" disabled={rows.length >= 12} onClick={() => set("requirements", [...rows, emptyRequirement()])}>
          Add a requirement
        </Button>
      </div>
    </Panel>
  );
}
