"use client";

import { useMemo } from "react";
import { DischargePlot } from "@/components/charts/discharge-plot";
import { Alert } from "@/components/ui/alert";
import { Button } from "@/components/ui/button";
import { NumberField, SelectField } from "@/components/ui/field";
import { Figure } from "@/components/ui/figure";
import { formatSi } from "@/components/ui/format";
import { CalculatorShell } from "./calculator-shell";
import {
  CUSTOM_PRESET,
  MAINS_DEFAULTS,
  MAINS_PRESETS,
  evaluateMains,
  presetFor,
  type MainsFigures,
} from "./mains-model";
import { ResultList, ResultRow } from "./result-list";
import { useFormValues } from "./use-form-values";

const PRESET_OPTIONS = [
  ...MAINS_PRESETS.map((p) => ({ value: p.id, label: p.label })),
  { value: CUSTOM_PRESET, label: "Other voltage or tolerance" },
];

export function MainsCalculator() {
  const { values, setValues, bind, reset } = useFormValues(MAINS_DEFAULTS);
  const outcome = useMemo(() => evaluateMains(values), [values]);
  const errors = outcome.ok ? {} : outcome.fieldErrors;

  const choosePreset = (id: string) => {
    const preset = MAINS_PRESETS.find((p) => p.id === id);
    setValues((v) =>
      preset ? { ...v, preset: id, mainsVrms: preset.vrms, tolerance: preset.tolerancePct } : { ...v, preset: id },
    );
  };
  const typeSupply = (key: "mainsVrms" | "tolerance", text: string) =>
    setValues((v) => {
      const next = { ...v, [key]: text };
      return { ...next, preset: presetFor(next.mainsVrms, next.tolerance) };
    });

  const inputs = (
    <>
      <SelectField
        label="Mains supply"
        hint="Nominal voltages of IEC 60038."
        options={PRESET_OPTIONS}
        value={values.preset}
        onChange={(e) => choosePreset(e.target.value)}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <NumberField
          label="Mains voltage (RMS)"
          unit="V"
          hint="Line to line for a three-phase bridge."
          value={values.mainsVrms}
          onChange={(e) => typeSupply("mainsVrms", e.target.value)}
          error={errors.mainsVrms}
        />
        <NumberField
          label="Upper tolerance"
          unit="%"
          hint="The bus is charged to the top of the band."
          value={values.tolerance}
          onChange={(e) => typeSupply("tolerance", e.target.value)}
          error={errors.tolerance}
        />
      </div>
      <NumberField
        label="Bulk capacitance on the bus"
        unit="µF"
        {...bind("capacitanceF")}
        error={errors.capacitanceF}
      />
      <NumberField
        label="Bleeder resistance"
        unit="kΩ"
        hint="Leave empty if no bleeder is fitted."
        {...bind("bleederOhm")}
        error={errors.bleederOhm}
      />
      <NumberField
        label="Target time to reach 60 V"
        unit="s"
        hint="The fitted bleeder is checked against it, and the suggested one meets it. Shorter needs a smaller resistor, which runs hotter."
        {...bind("targetDischargeS")}
        error={errors.targetDischargeS}
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
      results={outcome.ok ? <MainsResults figures={outcome.result} /> : <NoResults />}
      plotTitle="Discharge after switch-off"
      plot={outcome.ok ? <MainsPlot figures={outcome.result} /> : <NoResults />}
    />
  );
}

function NoResults() {
  return <p className="text-sm text-graphite-600">Results appear once every input is valid.</p>;
}

function statusLine(f: MainsFigures): string {
  const peak = `Bus peak ${formatSi(f.busPeakV, "V")}`;
  if (!f.aboveSafeVoltage) return `${peak}: at or below the ${formatSi(f.safeV, "V")} safe level.`;
  if (f.dischargeS === null) return `${peak}. No bleeder: the bus stays charged until it is discharged by hand.`;
  const wait = `${formatSi(f.dischargeS, "s")} to reach ${formatSi(f.safeV, "V")}`;
  return f.waitTooLong
    ? `${peak}; ${wait}, longer than the ${formatSi(f.targetDischargeS, "s")} target.`
    : `${peak}; ${wait}, within the ${formatSi(f.targetDischargeS, "s")} target.`;
}

function MainsResults({ figures: f }: { figures: MainsFigures }) {
  const safe = formatSi(f.safeV, "V");
  return (
    <div className="flex flex-col gap-5">
      <ResultList>
        <ResultRow
          label="DC bus peak"
          value={<Figure value={f.busPeakV} unit="V" digits={4} />}
          status={
            f.aboveSafeVoltage
              ? { word: `Above ${safe}`, tone: "caution" }
              : { word: `At or below ${safe}`, tone: "clear" }
          }
          note="√2 × mains RMS × (1 + tolerance), behind a bridge rectifier."
        />
        <ResultRow label="Stored energy" value={<Figure value={f.energyJ} unit="J" />} />
        <ResultRow
          label="Stored charge"
          value={<Figure value={f.chargeC} unit="C" />}
          status={
            f.chargeAboveThreshold ? { word: "Above 45 µC", tone: "caution" } : { word: "45 µC or less", tone: "clear" }
          }
          note={
            f.chargeAboveThreshold && f.aboveSafeVoltage
              ? "Over 60 V with more than 45 µC: a listing's safety sheet needs a stored-charge note giving the wait, or the hand-discharge method when there is no bleeder."
              : undefined
          }
        />
      </ResultList>

      {f.dischargeS !== null && f.timeConstantS !== null ? (
        <div>
          <h3 className="text-sm font-semibold text-graphite-900">With the fitted bleeder</h3>
          <ResultList>
            <ResultRow label="Time constant R·C" value={<Figure value={f.timeConstantS} unit="s" />} />
            <ResultRow
              label={`Time to reach ${safe}`}
              value={<Figure value={f.dischargeS} unit="s" />}
              status={
                f.waitTooLong
                  ? { word: "Longer than target", tone: "caution" }
                  : { word: "Within target", tone: "clear" }
              }
              note={f.waitTooLong ? `Longer than the ${formatSi(f.targetDischargeS, "s")} you asked for.` : undefined}
            />
            {f.declaredBleederWatts !== null ? (
              <ResultRow
                label="Bleeder dissipation at the bus peak"
                value={<Figure value={f.declaredBleederWatts} unit="W" />}
                note="It dissipates this all the time the bus is up."
              />
            ) : null}
          </ResultList>
        </div>
      ) : f.aboveSafeVoltage ? (
        <div className="flex flex-col gap-3">
          <ResultList>
            <ResultRow
              label={`Time to reach ${safe}`}
              value={<Figure value={Number.POSITIVE_INFINITY} unit="s" />}
              status={{ word: "Unbounded", tone: "caution" }}
            />
          </ResultList>
          <Alert tone="caution" role="none" title="No bleeder: the wait is unbounded">
            <p>
              Without a bleeder nothing but the capacitors&apos; own leakage drains the bus, which can stay above {safe}{" "}
              for hours. Discharge it by hand every time: with the supply unplugged, hold a resistor probe — a power
              resistor of a few kΩ on insulated leads — across the bus terminals, and watch a meter until it reads below{" "}
              {safe}. Never short the terminals with a screwdriver.
            </p>
          </Alert>
        </div>
      ) : null}

      {f.suggestedBleeder !== null ? (
        <div>
          <h3 className="text-sm font-semibold text-graphite-900">
            Suggested bleeder for {formatSi(f.targetDischargeS, "s")}
          </h3>
          <ResultList>
            <ResultRow
              label="Largest E12 value that meets the time"
              value={<Figure value={f.suggestedBleeder.ohms} unit="Ω" />}
            />
            <ResultRow
              label="Dissipation at the bus peak"
              value={<Figure value={f.suggestedBleeder.watts} unit="W" />}
              note="Common practice: choose a part rated for at least twice this, and for the full bus voltage — several resistors in series if one is not."
            />
            <ResultRow
              label={`Time to reach ${safe}`}
              value={<Figure value={f.suggestedBleeder.dischargeS} unit="s" />}
            />
          </ResultList>
        </div>
      ) : (
        <p className="text-sm text-graphite-700">The bus never exceeds {safe}, so no bleeder is needed to reach it.</p>
      )}
    </div>
  );
}

function MainsPlot({ figures: f }: { figures: MainsFigures }) {
  const curve = f.curve;
  if (curve === null) {
    return (
      <p className="text-sm text-graphite-700">
        The bus peak is at or below {formatSi(f.safeV, "V")}, so there is nothing to wait for.
      </p>
    );
  }
  const declared = curve.source === "declared";
  const wait = declared ? f.dischargeS : (f.suggestedBleeder?.dischargeS ?? null);
  const ohms = formatSi(curve.bleederOhm, "Ω");
  return (
    <DischargePlot
      points={curve.points}
      safeV={f.safeV}
      dischargeS={wait}
      through={declared ? `through the ${ohms} bleeder` : `through the suggested ${ohms}`}
      caption={
        declared
          ? undefined
          : `No bleeder is fitted, so the curve shows the suggested ${ohms}. Without one the bus does not come down on its own.`
      }
    />
  );
}
