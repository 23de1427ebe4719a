"use client";

import { useMemo } from "react";
import { LoadLinePlot } from "@/components/charts/load-line-plot";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { NumberField, SelectField } from "@/components/ui/field";
import { Figure } from "@/components/ui/figure";
import { formatSi } from "@/components/ui/format";
import { CalculatorShell } from "./calculator-shell";
import { ResultList, ResultRow } from "./result-list";
import { useFormValues } from "./use-form-values";
import {
  ENVIRONMENT_LABELS,
  PROCESS_LABELS,
  PROCESS_OPTIONS,
  WELDING_DEFAULTS,
  evaluateWeldingOutput,
  type WeldingFigures,
} from "./welding-output-model";

const KIND_OPTIONS = [
  { value: "dc", label: "DC (compared as peak)" },
  { value: "ac", label: "AC (compared as RMS)" },
];
const ENVIRONMENT_OPTIONS = [
  { value: "normal", label: ENVIRONMENT_LABELS.normal },
  { value: "increased-hazard", label: `${ENVIRONMENT_LABELS["increased-hazard"]} (confined, damp, on metal)` },
];

export function WeldingOutputCalculator() {
  const { values, bind, reset } = useFormValues(WELDING_DEFAULTS);
  const outcome = useMemo(() => evaluateWeldingOutput(values), [values]);
  const errors = outcome.ok ? {} : outcome.fieldErrors;

  const inputs = (
    <>
      <SelectField label="Process" options={PROCESS_OPTIONS} {...bind("process")} />
      <SelectField label="Output" options={KIND_OPTIONS} {...bind("ocvKind")} />
      <SelectField label="Where it is used" options={ENVIRONMENT_OPTIONS} {...bind("environment")} />
      <NumberField
        label="Open-circuit voltage"
        unit="V"
        hint={values.ocvKind === "ac" ? "RMS, measured with no arc." : "Peak, measured with no arc."}
        {...bind("openCircuitV")}
        error={errors.openCircuitV}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <NumberField label="Lowest output current" unit="A" {...bind("minCurrentA")} error={errors.minCurrentA} />
        <NumberField label="Highest output current" unit="A" {...bind("maxCurrentA")} error={errors.maxCurrentA} />
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        <NumberField
          label="Rated current"
          unit="A"
          hint="What the duty cycle is stated for."
          {...bind("ratedA")}
          error={errors.ratedA}
        />
        <NumberField
          label="Duty cycle at that current"
          unit="%"
          hint="Of a 10-minute cycle."
          {...bind("ratedDutyPct")}
          error={errors.ratedDutyPct}
        />
      </div>
      <NumberField
        label="Duty cycle to convert to"
        unit="%"
        hint="100 % gives the current it can weld without a break."
        {...bind("targetDutyPct")}
        error={errors.targetDutyPct}
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
      results={
        outcome.ok ? (
          <WeldingResults figures={outcome.result} />
        ) : (
          <p className="text-sm text-graphite-600">Results appear once every input is valid.</p>
        )
      }
      plotTitle="Load line and open-circuit voltage"
      plot={
        outcome.ok ? (
          <LoadLinePlot
            points={outcome.result.loadLine}
            outputRange={outcome.result.outputRange}
            openCircuitV={outcome.result.ocv.declaredV}
            limitV={outcome.result.ocv.limitV}
            limitLabel={outcome.result.limitLabel}
            withinLimit={outcome.result.ocv.withinLimit}
            caption={`${PROCESS_LABELS[outcome.result.process]}: the conventional load voltage the source must hold at each welding current.`}
          />
        ) : (
          <p className="text-sm text-graphite-600">The plot appears once every input is valid.</p>
        )
      }
    />
  );
}

function statusLine(f: WeldingFigures): string {
  const ocv = `Open-circuit ${formatSi(f.ocv.declaredV, "V")}`;
  const limit = `the ${formatSi(f.ocv.limitV, "V")} ${f.ocv.basis === "peak" ? "peak" : "RMS"} limit`;
  return f.ocv.withinLimit ? `${ocv}: within ${limit}.` : `${ocv}: over ${limit}.`;
}

function WeldingResults({ figures: f }: { figures: WeldingFigures }) {
  const basis = f.ocv.basis === "peak" ? "peak" : "RMS";
  const environment = ENVIRONMENT_LABELS[f.ocv.environment].toLowerCase();
  return (
    <div className="flex flex-col gap-5">
      {!f.ocv.withinLimit ? (
        <Alert tone="stop" role="none" title="Open-circuit voltage over the limit">
          A welding source with this open-circuit voltage cannot be listed: its safety sheet is blocked until the
          voltage is brought within the limit for its environment.
        </Alert>
      ) : null}
      <ResultList>
        <ResultRow
          label={`Open-circuit voltage (${basis})`}
          value={<Figure value={f.ocv.declaredV} unit="V" />}
          status={f.ocv.withinLimit ? { word: "Within limit", tone: "clear" } : { word: "Over limit", tone: "stop" }}
        />
        <ResultRow
          label="No-load limit"
          value={<Figure value={f.ocv.limitV} unit="V" />}
          note={
            `${f.ocv.kind.toUpperCase()} output, ${environment} environment, after IEC 60974-1 (figures from memory)` +
            (f.ocv.limitRmsV !== null ? `; the peak must also stay under ${formatSi(f.ocv.limitPeakV, "V")}.` : ".")
          }
        />
        <ResultRow
          label={f.ocv.marginV >= 0 ? "Margin to the limit" : "Over the limit by"}
          value={<Figure value={Math.abs(f.ocv.marginV)} unit="V" />}
          status={f.ocv.withinLimit ? null : { word: "Over limit", tone: "stop" }}
        />
      </ResultList>

      <div>
        <h3 className="text-sm font-semibold text-graphite-900">Conventional load, {PROCESS_LABELS[f.process]}</h3>
        <ResultList>
          <ResultRow
            label={`Load voltage at ${formatSi(f.minCurrentA, "A")}`}
            value={<Figure value={f.minLoadV} unit="V" />}
          />
          <ResultRow
            label={`Load voltage at ${formatSi(f.maxCurrentA, "A")}`}
            value={<Figure value={f.maxLoadV} unit="V" />}
          />
          <ResultRow
            label={`Load voltage at the rated ${formatSi(f.dutyCycle.ratedA, "A")}`}
            value={<Figure value={f.ratedLoadV} unit="V" />}
            note="The source must hold this voltage at that current to be rated for it."
          />
        </ResultList>
      </div>

      <div>
        <h3 className="text-sm font-semibold text-graphite-900">Duty cycle</h3>
        <ResultList>
          <ResultRow
            label={`Current at ${formatSi(f.dutyCycle.targetDutyPct, "%")} duty`}
            value={<Figure value={f.dutyCycle.currentA} unit="A" />}
            status={f.dutyAboveOutput ? { word: "Beyond the output range", tone: "caution" } : null}
            note={
              f.dutyAboveOutput
                ? `Equal heating allows this, but the source delivers at most ${formatSi(f.maxCurrentA, "A")}.`
                : "Equal heating: I² × duty stays constant."
            }
          />
          <ResultRow label="Continuous current (100 %)" value={<Figure value={f.dutyCycle.continuousA} unit="A" />} />
        </ResultList>
      </div>
    </div>
  );
}
