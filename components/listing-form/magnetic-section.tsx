"use client";

import { Button } from "@/components/ui/button";
import { NumberField, SelectField, TextField } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { CONDUCTOR_MATERIALS, CORE_MATERIALS } from "@/lib/engineering/materials";
import { WINDING_ROLES } from "@/lib/validations/listings";
import type { SectionProps } from "./form-context";
import { emptyWinding } from "./form-model";
import { DerivedPreview } from "./derived-preview";

const CORE_OPTIONS = Object.values(CORE_MATERIALS).map((m) => ({ value: m.id, label: m.label }));
const WIRE_OPTIONS = Object.values(CONDUCTOR_MATERIALS).map((m) => ({ value: m.id, label: m.label }));
const ROLE_LABELS = { primary: "Primary", secondary: "Secondary", winding: "Only winding" } as const;
const ROLE_OPTIONS = WINDING_ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }));

export function MagneticSection({ values, set, errors }: SectionProps) {
  const f = values.figures;
  const bind = (key: keyof typeof f & string) => ({
    name: `figures.${key}`,
    value: f[key] as string,
    onChange: (e: { target: { value: string } }) => set(`figures.${key}`, e.target.value),
    error: errors[`figures.${key}`],
  });
  const transformer = values.magneticSubtype === "transformer";
  return (
    <Panel title="Core and windings">
      <div className="space-y-4">
        <p className="text-sm text-graphite-600">
          Give the figures as you would read them off the datasheet and the winding sheet; the platform converts them and computes
          inductance, flux density, copper loss and skin depth below. A draft may leave some out.
        </p>
        <div className="grid gap-4 sm:grid-cols-3">
          <SelectField label="Core material" options={CORE_OPTIONS} {...bind("coreMaterial")} />
          <NumberField label="Core area Ae" unit="mm²" {...bind("coreAreaM2")} />
          <NumberField label="Path length le" unit="mm" {...bind("pathLengthM")} />
          <NumberField label="Air gap lg" unit="mm" hint="Total gap; 0 for an ungapped core." {...bind("gapM")} />
          <NumberField label="AL (if known)" unit="nH" hint="nH per turn²; used instead of the gap when given." {...bind("alNh")} />
          <NumberField label="Mean turn length" unit="mm" hint="Needed for winding resistance." {...bind("meanTurnLengthM")} />
          <NumberField label="Rated current" unit="A" hint={transformer ? "Of the secondary." : values.magneticSubtype === "choke" ? "Peak current." : "Primary current."} {...bind("ratedCurrentA")} />
          <NumberField label="Switching frequency" unit="kHz" {...bind("switchingFrequencyHz")} />
          {transformer ? <NumberField label="Primary voltage" unit="V" hint="Square-wave amplitude across the primary." {...bind("primaryVoltageV")} /> : null}
        </div>

        <fieldset className="space-y-3">
          <legend className="text-sm font-semibold text-graphite-900">Windings</legend>
          {errors["figures.windings"] ? <p className="text-sm font-medium text-signal-700">{errors["figures.windings"].join(" ")}</p> : null}
          {f.windings.map((w, i) => {
            const at = (key: string) => `figures.windings.${i}.${key}`;
            const field = (key: keyof typeof w & string) => ({
              name: at(key),
              value: w[key],
              onChange: (e: { target: { value: string } }) => set(at(key), e.target.value),
              error: errors[at(key)],
            });
            return (
              <div key={i} className="grid gap-3 rounded border border-graphite-200 p-3 sm:grid-cols-4" data-testid={`winding-${i}`}>
                <TextField label="Name" {...field("name")} />
                <SelectField label="Role" options={ROLE_OPTIONS} {...field("role")} />
                <NumberField label="Turns" step="1" {...field("turns")} />
                <SelectField label="Wire" options={WIRE_OPTIONS} {...field("material")} />
                <NumberField label="Cross-section (all strands)" unit="mm²" {...field("areaM2")} />
                <NumberField label="Strands" step="1" {...field("strands")} />
                <NumberField label="RMS current" unit="A" {...field("currentA")} />
                <div className="flex items-end">
                  <Button variant="quiet" size="sm" disabled={f.windings.length <= 1} onClick={() => set("figures.windings", f.windings.filter((_, j) => j !== i))}>
                    Remove winding {i + 1}
                  </Button>
                </div>
              </div>
            );
          })}
          <Button
            variant="secondary"
            size="sm"
            disabled={f.windings.length >= 8}
            onClick={() => set("figures.windings", [...f.windings, emptyWinding(transformer || values.magneticSubtype === "current-transformer" ? "secondary" : "winding")])}
          >
            Add a winding
          </Button>
        </fieldset>
        <DerivedPreview values={values} />
      </div>
    </Panel>
  );
}
