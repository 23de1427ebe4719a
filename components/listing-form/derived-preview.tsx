"use client";

import { useMemo } from "react";
import { EstimateNote } from "@/components/caution";
import { Figure } from "@/components/ui/figure";
import { StateBadge } from "@/components/ui/state-badge";
import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";
import { deriveMagnetic, type FluxVerdict } from "@/lib/listings/derived";
import { magneticFiguresSchema } from "@/lib/validations/listings";
import type { FormValues } from "./form-model";
import { toInput } from "./form-model";

const VERDICTS: Record<FluxVerdict, { label: string; tone: "clear" | "caution" | "stop" }> = {
  "within-design": { label: "Within design maximum", tone: "clear" },
  "above-design-max": { label: "Above design maximum", tone: "caution" },
  saturates: { label: "Saturates", tone: "stop" },
};

const percent = (fraction: number) => `${(fraction * 100).toFixed(0)} %`;

/** The derived figures buyers will see, computed as the seller types. */
export function DerivedPreview({ values }: { values: FormValues }) {
  const derived = useMemo(() => {
    const { input } = toInput(values);
    if (input.kind !== "magnetic") return null;
    const figures = magneticFiguresSchema.safeParse(input.figures);
    if (!figures.success) return null;
    try {
      return deriveMagnetic(values.magneticSubtype, figures.data);
    } catch {
      return null;
    }
  }, [values]);

  if (!derived) {
    return <p className="rounded border border-dashed border-graphite-300 px-3 py-3 text-sm text-graphite-600">The derived figures appear once every figure above is filled in.</p>;
  }
  return (
    <section aria-label="Derived figures" className="space-y-3" data-testid="derived-figures">
      <h3 className="text-sm font-semibold text-graphite-900">Derived figures</h3>
      <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-3">
        <div>
          <dt className="text-graphite-600">Inductance ({derived.inductanceWinding}, from {derived.inductanceBasis === "al" ? "AL" : "the gap"})</dt>
          <dd><Figure value={derived.inductanceH} unit="H" /></dd>
        </div>
        {derived.peakFluxT !== null ? (
          <div>
            <dt className="text-graphite-600">Peak flux density</dt>
            <dd className="flex items-center gap-2">
              <Figure value={derived.peakFluxT} unit="T" />
              {derived.verdict ? <StateBadge label={VERDICTS[derived.verdict].label} tone={VERDICTS[derived.verdict].tone} /> : null}
            </dd>
          </div>
        ) : (
          <div>
            <dt className="text-graphite-600">Peak flux density</dt>
            <dd className="text-graphite-600">{values.magneticSubtype === "transformer" ? "give the primary voltage" : "depends on the burden"}</dd>
          </div>
        )}
        {derived.marginToSaturation !== null ? (
          <div>
            <dt className="text-graphite-600">Margin to saturation ({derived.material.saturationMinT} T)</dt>
            <dd className="font-mono">{percent(derived.marginToSaturation)}</dd>
          </div>
        ) : null}
        {derived.totalCopperLossW !== null ? (
          <div>
            <dt className="text-graphite-600">Copper loss (DC)</dt>
            <dd><Figure value={derived.totalCopperLossW} unit="W" /></dd>
          </div>
        ) : null}
        {derived.turnsRatios.map((r) => (
          <div key={r.secondary}>
            <dt className="text-graphite-600">Turns ratio to {r.secondary}</dt>
            <dd className="font-mono">{r.ratio.toPrecision(3)} : 1</dd>
          </div>
        ))}
      </dl>
      <Table caption="Per winding" >
        <THead>
          <TRow>
            <TH>Winding</TH>
            <TH numeric>Resistance</TH>
            <TH numeric>Copper loss</TH>
            <TH numeric>Current density</TH>
            <TH numeric>Skin depth</TH>
            <TH numeric>Strand radius / δ</TH>
          </TRow>
        </THead>
        <TBody>
          {derived.windings.map((w) => (
            <TRow key={w.name}>
              <TD>{w.name}</TD>
              <TD numeric>{w.resistanceOhm === null ? "—" : <Figure value={w.resistanceOhm} unit="Ω" />}</TD>
              <TD numeric>{w.copperLossW === null ? "—" : <Figure value={w.copperLossW} unit="W" />}</TD>
              <TD numeric>{(w.currentDensityAPerM2 / 1e6).toPrecision(3)} A/mm²</TD>
              <TD numeric><Figure value={w.skinDepthM} unit="m" /></TD>
              <TD numeric>{w.radiusToSkinDepth.toPrecision(2)}{w.radiusToSkinDepth > 1 ? " (AC loss higher)" : ""}</TD>
            </TRow>
          ))}
        </TBody>
      </Table>
      <EstimateNote />
    </section>
  );
}
