"use client";

import { useMemo } from "react";
import { Button } from "@/components/ui/button";
import { NumberField, SelectField } from "@/components/ui/field";
import { Figure } from "@/components/ui/figure";
import { formatSi } from "@/components/ui/format";
import type { TransformerResult } from "@/lib/engineering/calculators";
import { CalculatorShell } from "./calculator-shell";
import { ResultList, ResultRow } from "./result-list";
import { TRANSFORMER_DEFAULTS, evaluateTransformer } from "./transformer-model";
import { useFormValues } from "./use-form-values";

const MODE_OPTIONS = [
  { value: "square", label: "Square wave (half or full bridge)" },
  { value: "sine", label: "Sine wave (e.g. a mains transformer)" },
  { value: "forward", label: "Forward converter (volt-seconds)" },
];

export function TransformerCalculator() {
  const { values, bind, reset } = useFormValues(TRANSFORMER_DEFAULTS);
  const outcome = useMemo(() => evaluateTransformer(values), [values]);
  const errors = outcome.ok ? {} : outcome.fieldErrors;
  const forward = values.mode === "forward";

  const inputs = (
    <>
      <SelectField label="Drive waveform" options={MODE_OPTIONS} {...bind("mode")} />
      {forward ? (
        <>
          <NumberField
            label="Voltage across the primary"
            unit="V"
            hint="The bus voltage while the switch conducts; use the highest."
            {...bind("busVolts")}
            error={errors.busVolts}
          />
          <div className="grid gap-4 sm:grid-cols-2">
            <NumberField
              label="Longest on-time"
              unit="µs"
              hint="The volt-seconds are largest at the longest on-time."
              {...bind("onTimeS")}
              error={errors.onTimeS}
            />
            <NumberField
              label="Flux swing ΔB"
              unit="T"
              hint="A forward core swings one way only, from remanence up."
              {...bind("fluxSwingT")}
              error={errors.fluxSwingT}
            />
          </div>
        </>
      ) : (
        <>
          <NumberField
            label={values.mode === "sine" ? "Primary voltage (RMS)" : "Primary voltage (amplitude)"}
            unit="V"
            hint={
              values.mode === "sine"
                ? "RMS of the sine across the winding."
                : "The square wave's amplitude across the winding: half the bus for a half bridge."
            }
            {...bind("primaryV")}
            error={errors.primaryV}
          />
          <div className="grid gap-4 sm:grid-cols-2">
            <NumberField
              label="Frequency"
              unit="kHz"
              hint="0.05 for 50 Hz mains."
              {...bind("frequencyHz")}
              error={errors.frequencyHz}
            />
            <NumberField
              label="Peak flux density"
              unit="T"
              hint="Common practice: 0.1–0.2 T for ferrite at tens of kHz, 1.2–1.6 T for 50 Hz laminations."
              {...bind("peakFluxT")}
              error={errors.peakFluxT}
            />
          </div>
        </>
      )}
      <NumberField label="Core area Ae" unit="mm²" {...bind("coreAreaM2")} error={errors.coreAreaM2} />
      <NumberField
        label="Secondary voltage"
        unit="V"
        hint="Optional, on the same basis as the primary; gives the secondary turns and the ratio."
        {...bind("secondaryV")}
        error={errors.secondaryV}
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
      status={
        outcome.ok
          ? `Wind ${outcome.result.primaryTurnsRounded} primary turns${
              outcome.result.secondaryTurnsRounded !== null
                ? ` and ${outcome.result.secondaryTurnsRounded} secondary turns`
                : ""
            }.`
          : outcome.message
      }
      statusTone={outcome.ok ? "info" : "error"}
      results={
        outcome.ok ? (
          <TransformerResults result={outcome.result} />
        ) : (
          <p className="text-sm text-graphite-600">Results appear once every input is valid.</p>
        )
      }
    />
  );
}

function TransformerResults({ result: r }: { result: TransformerResult }) {
  const formula =
    r.mode === "forward"
      ? "N = V·ton / (ΔB·Ae), from the volt-seconds across the winding."
      : `N = V / (Kf·f·Ae·B) with Kf = ${r.waveformFactor?.toFixed(2)} for a ${r.mode} wave.`;
  const fluxName = r.mode === "forward" ? "Flux swing" : "Peak flux density";
  return (
    <ResultList>
      {r.voltSecondsVs !== null ? (
        <ResultRow label="Volt-seconds per on-time" value={<Figure value={r.voltSecondsVs} unit="V·s" />} />
      ) : null}
      <ResultRow
        label="Primary turns (exact)"
        value={<Figure value={r.primaryTurns} unit="" digits={4} />}
        note={formula}
      />
      <ResultRow
        label="Primary turns to wind"
        value={<Figure value={r.primaryTurnsRounded} unit="" digits={6} />}
        note="Rounded up, so the flux stays at or under the design figure."
      />
      <ResultRow label={`${fluxName} with those turns`} value={<Figure value={r.fluxAtRoundedTurnsT} unit="T" />} />
      {r.secondaryTurns !== null && r.secondaryTurnsRounded !== null ? (
        <>
          <ResultRow label="Secondary turns (exact)" value={<Figure value={r.secondaryTurns} unit="" digits={4} />} />
          <ResultRow
            label="Secondary turns to wind"
            value={<Figure value={r.secondaryTurnsRounded} unit="" digits={6} />}
            note="Rounded up. Common practice: allow a little more for the rectifier and winding drop under load."
          />
        </>
      ) : null}
      {r.turnsRatio !== null ? (
        <ResultRow
          label="Turns ratio Np : Ns"
          value={<span className="figure font-mono whitespace-nowrap">{formatSi(r.turnsRatio, "", 3)} : 1</span>}
        />
      ) : null}
    </ResultList>
  );
}
