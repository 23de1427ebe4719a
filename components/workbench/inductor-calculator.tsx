"use client";

import { useMemo } from "react";
import { FluxPlot } from "@/components/charts/flux-plot";
import { Button } from "@/components/ui/button";
import { NumberField, SelectField } from "@/components/ui/field";
import { Figure } from "@/components/ui/figure";
import { formatSi } from "@/components/ui/format";
import { CalculatorShell } from "./calculator-shell";
import {
  CORE_MATERIAL_OPTIONS,
  FLUX_MARGIN_CAUTION,
  INDUCTOR_DEFAULTS,
  coreMaterial,
  evaluateInductor,
  fluxStatus,
  type InductorFigures,
} from "./inductor-model";
import { ResultList, ResultRow, type ResultStatus } from "./result-list";
import { useFormValues } from "./use-form-values";

const METHOD_OPTIONS = [
  { value: "al", label: "From the core's AL value" },
  { value: "gap", label: "From the gap and core geometry" },
];

export function InductorCalculator() {
  const { values, bind, reset } = useFormValues(INDUCTOR_DEFAULTS);
  const outcome = useMemo(() => evaluateInductor(values), [values]);
  const errors = outcome.ok ? {} : outcome.fieldErrors;
  const material = coreMaterial(values.material);

  const inputs = (
    <>
      <SelectField label="Inductance from" options={METHOD_OPTIONS} {...bind("method")} />
      <SelectField
        label="Core material"
        options={CORE_MATERIAL_OPTIONS}
        hint={
          material
            ? `Saturates from ${formatSi(material.saturationT.min, "T")}; design to ${formatSi(material.designMaxT, "T")}.`
            : undefined
        }
        {...bind("material")}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <NumberField label="Turns" {...bind("turns")} error={errors.turns} />
        <NumberField label="Core area Ae" unit="mm²" {...bind("coreAreaM2")} error={errors.coreAreaM2} />
      </div>
      {values.method === "gap" ? (
        <>
          <div className="grid gap-4 sm:grid-cols-2">
            <NumberField
              label="Total air gap"
              unit="mm"
              hint="A spacer under all legs counts twice."
              {...bind("gapM")}
              error={errors.gapM}
            />
            <NumberField
              label="Magnetic path length le"
              unit="mm"
              hint="From the core's data."
              {...bind("pathM")}
              error={errors.pathM}
            />
          </div>
          <NumberField
            label="Relative permeability of the core"
            hint={
              material
                ? `Leave empty for the typical ${material.typicalRelativePermeability} of ${material.label}.`
                : undefined
            }
            {...bind("relativePermeability")}
            error={errors.relativePermeability}
          />
        </>
      ) : (
        <NumberField label="AL of the gapped core" unit="nH/N²" {...bind("alNh")} error={errors.alNh} />
      )}
      <NumberField label="Rated peak current" unit="A" {...bind("ratedCurrentA")} error={errors.ratedCurrentA} />
      <NumberField
        label="Target inductance"
        unit="µH"
        hint="Optional: the whole turns that reach it on this core and gap."
        {...bind("targetInductanceH")}
        error={errors.targetInductanceH}
      />
    </>
  );

  return (
    <CalculatorShell
      inputs={inputs}
      actions={
        <Button variant="quiet" size="sm" onClick={reset}>
          Back to the example
        </Button>
      }
      status={outcome.ok ? statusLine(outcome.result) : outcome.message}
      statusTone={outcome.ok ? "info" : "error"}
      results={outcome.ok ? <InductorResults figures={outcome.result} /> : <NoResults />}
      plotTitle="Flux density against current"
      plot={
        outcome.ok ? (
          <FluxPlot
            points={outcome.result.curve}
            ratedCurrentA={outcome.result.ratedCurrentA}
            designMaxT={outcome.result.material.designMaxT}
            saturationT={outcome.result.material.saturationT.min}
            materialLabel={outcome.result.material.label}
            caption="A linear model (constant inductance). Past saturation the real inductance collapses and the current rises steeply."
          />
        ) : (
          <NoResults />
        )
      }
    />
  );
}

function NoResults() {
  return <p className="text-sm text-graphite-600">Results appear once every input is valid.</p>;
}

function statusLine(f: InductorFigures): string {
  const status = fluxStatus(f.peakFluxT, f.material);
  return `${formatSi(f.inductanceH, "H")}; ${formatSi(f.peakFluxT, "T")} at ${formatSi(f.ratedCurrentA, "A")}: ${status.word.toLowerCase()}.`;
}

function marginStatus(margin: number, caution: number): ResultStatus {
  if (margin < 0) return { word: "Exceeded", tone: "stop" };
  if (margin < caution) return { word: "Tight", tone: "caution" };
  return { word: "Enough", tone: "clear" };
}

function percent(fraction: number) {
  return <Figure value={fraction * 100} unit="%" />;
}

function InductorResults({ figures: f }: { figures: InductorFigures }) {
  const flux = fluxStatus(f.peakFluxT, f.material);
  return (
    <div className="flex flex-col gap-5">
      <ResultList>
        <ResultRow
          label="Inductance"
          value={<Figure value={f.inductanceH} unit="H" />}
          note={
            f.method === "gap"
              ? `Effective AL ${formatSi(f.effectiveAlNh, "nH/N²", 3, { prefixes: false })}${f.relativePermeability !== null ? `, with μr = ${f.relativePermeability}` : ""}.`
              : undefined
          }
        />
        <ResultRow
          label={`Peak flux density at ${formatSi(f.ratedCurrentA, "A")}`}
          value={<Figure value={f.peakFluxT} unit="T" />}
          status={flux}
          note="B = L·I / (N·Ae)."
        />
        <ResultRow
          label={`Margin to the design maximum (${formatSi(f.material.designMaxT, "T")})`}
          value={percent(f.marginToDesignMax)}
          status={marginStatus(f.marginToDesignMax, FLUX_MARGIN_CAUTION)}
        />
        <ResultRow
          label={`Margin to saturation (from ${formatSi(f.material.saturationT.min, "T")})`}
          value={percent(f.marginToSaturation)}
          status={marginStatus(f.marginToSaturation, FLUX_MARGIN_CAUTION)}
          note="Ferrite loses part of its saturation flux density when hot; the lower end of the range is used."
        />
        <ResultRow
          label={`Stored energy at ${formatSi(f.ratedCurrentA, "A")}`}
          value={<Figure value={f.storedEnergyJ} unit="J" />}
        />
        <ResultRow label="Current at the design maximum" value={<Figure value={f.designMaxCurrentA} unit="A" />} />
        <ResultRow label="Current at saturation" value={<Figure value={f.saturationCurrentA} unit="A" />} />
      </ResultList>

      {f.target !== null ? (
        <div>
          <h3 className="text-sm font-semibold text-graphite-900">
            For {formatSi(f.target.inductanceH, "H")} on this core
          </h3>
          <ResultList>
            <ResultRow
              label="Turns needed"
              value={<Figure value={f.target.turns} unit="" digits={6} />}
              note={`Gives ${formatSi(f.target.reachedH, "H")} with whole turns.`}
            />
            <ResultRow
              label={`Peak flux density at ${formatSi(f.ratedCurrentA, "A")}`}
              value={<Figure value={f.target.peakFluxT} unit="T" />}
              status={fluxStatus(f.target.peakFluxT, f.material)}
            />
          </ResultList>
        </div>
      ) : null}
    </div>
  );
}
