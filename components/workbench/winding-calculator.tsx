"use client";

import { useMemo } from "react";
import { Button } from "@/components/ui/button";
import { NumberField, SelectField, TextField } from "@/components/ui/field";
import { Figure } from "@/components/ui/figure";
import { formatSi } from "@/components/ui/format";
import { CalculatorShell } from "./calculator-shell";
import { ResultList, ResultRow } from "./result-list";
import { useFormValues } from "./use-form-values";
import {
  CURRENT_DENSITY_CAUTION_A_PER_MM2,
  MATERIAL_OPTIONS,
  WINDING_DEFAULTS,
  evaluateWinding,
  type WindingFigures,
} from "./winding-model";

const SIZE_OPTIONS = [
  { value: "diameter", label: "Bare diameter of one strand" },
  { value: "awg", label: "AWG gauge" },
  { value: "area", label: "Cross-section of one strand" },
];

// Areas print in mm² by hand: an SI prefix on m² would square with it (1 µm² is 10⁻¹² m²).
function SquareMillimetres({ areaM2 }: { areaM2: number }) {
  return <Figure value={areaM2 * 1e6} unit="mm²" prefixes={false} />;
}

function Millimetres({ metres }: { metres: number }) {
  return <Figure value={metres * 1e3} unit="mm" prefixes={false} />;
}

export function WindingCalculator() {
  const { values, bind, reset } = useFormValues(WINDING_DEFAULTS);
  const outcome = useMemo(() => evaluateWinding(values), [values]);
  const errors = outcome.ok ? {} : outcome.fieldErrors;

  const inputs = (
    <>
      <SelectField label="Conductor" options={MATERIAL_OPTIONS} {...bind("material")} />
      <SelectField label="Wire size given as" options={SIZE_OPTIONS} {...bind("sizeBy")} />
      <div className="grid gap-4 sm:grid-cols-2">
        {values.sizeBy === "awg" ? (
          <TextField
            label="AWG size"
            hint="For example 18, or 4/0 for the largest."
            {...bind("awg")}
            error={errors.awg}
          />
        ) : values.sizeBy === "area" ? (
          <NumberField label="Strand cross-section" unit="mm²" {...bind("areaMm2")} error={errors.areaMm2} />
        ) : (
          <NumberField label="Strand diameter (bare)" unit="mm" {...bind("diameterMm")} error={errors.diameterMm} />
        )}
        <NumberField label="Strands in parallel" {...bind("strands")} error={errors.strands} />
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        <NumberField
          label="Wire length"
          unit="m"
          hint="Mean turn length × turns."
          {...bind("lengthM")}
          error={errors.lengthM}
        />
        <NumberField
          label="Current (RMS)"
          unit="A"
          hint="Through the winding at full load."
          {...bind("currentA")}
          error={errors.currentA}
        />
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        <NumberField
          label="Winding temperature"
          unit="°C"
          hint="At full load; resistance rises with it."
          {...bind("temperatureC")}
          error={errors.temperatureC}
        />
        <NumberField
          label="Switching frequency"
          unit="kHz"
          hint="Optional, for the skin depth; 0.05 for 50 Hz."
          {...bind("frequencyHz")}
          error={errors.frequencyHz}
        />
      </div>
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
      status={
        outcome.ok
          ? `${formatSi(outcome.result.resistanceOhm, "Ω")} and ${formatSi(outcome.result.copperLossW, "W")} at ${formatSi(outcome.result.currentA, "A")}.`
          : outcome.message
      }
      statusTone={outcome.ok ? "info" : "error"}
      results={
        outcome.ok ? (
          <WindingResults figures={outcome.result} />
        ) : (
          <p className="text-sm text-graphite-600">Results appear once every input is valid.</p>
        )
      }
    />
  );
}

function WindingResults({ figures: f }: { figures: WindingFigures }) {
  const dense = f.currentDensityAPerMm2 > CURRENT_DENSITY_CAUTION_A_PER_MM2;
  const awgText = `AWG ${f.awg.label}, ${formatSi(f.awg.diameterM * 1e3, "mm", 3, { prefixes: false })}`;
  return (
    <div className="flex flex-col gap-5">
      <ResultList>
        <ResultRow
          label="Strand diameter"
          value={<Millimetres metres={f.strandDiameterM} />}
          note={f.awgIsNearest ? `Nearest gauge: ${awgText}.` : `${awgText} (ASTM B258).`}
        />
        <ResultRow
          label={f.strands > 1 ? `Copper area of ${f.strands} strands` : "Conductor area"}
          value={<SquareMillimetres areaM2={f.totalAreaM2} />}
        />
        <ResultRow
          label={`Resistivity at ${formatSi(f.temperatureC, "°C")}`}
          value={<Figure value={f.resistivityOhmM * 1e6} unit="Ω·mm²/m" digits={4} prefixes={false} />}
        />
        <ResultRow label="DC resistance" value={<Figure value={f.resistanceOhm} unit="Ω" />} />
        <ResultRow
          label={`Loss at ${formatSi(f.currentA, "A")}`}
          value={<Figure value={f.copperLossW} unit="W" />}
          note="I²·R with the DC resistance; skin and proximity effects add to it."
        />
        <ResultRow
          label="Current density"
          value={<Figure value={f.currentDensityAPerMm2} unit="A/mm²" prefixes={false} />}
          status={
            dense
              ? { word: `Above ${CURRENT_DENSITY_CAUTION_A_PER_MM2} A/mm²`, tone: "caution" }
              : { word: `Within ${CURRENT_DENSITY_CAUTION_A_PER_MM2} A/mm²`, tone: "clear" }
          }
          note={
            dense
              ? "Common practice is 3–5 A/mm² for continuous duty; more only for short-duty windings with good cooling."
              : undefined
          }
        />
      </ResultList>

      {f.skinDepthM !== null && f.radiusToSkinDepth !== null ? (
        <div>
          <h3 className="text-sm font-semibold text-graphite-900">Skin effect</h3>
          <ResultList>
            <ResultRow label="Skin depth" value={<Millimetres metres={f.skinDepthM} />} />
            <ResultRow
              label="Strand radius"
              value={<Millimetres metres={f.strandDiameterM / 2} />}
              status={
                f.radiusToSkinDepth > 1
                  ? { word: "Exceeds skin depth", tone: "caution" }
                  : { word: "Within skin depth", tone: "clear" }
              }
              note={
                f.radiusToSkinDepth > 1
                  ? "The middle of each strand carries little of the switching current. Common practice: strands no thicker than about twice the skin depth, or litz wire."
                  : undefined
              }
            />
          </ResultList>
        </div>
      ) : null}
    </div>
  );
}
