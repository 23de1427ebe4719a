import type { ReactNode } from "react";
import { Figure } from "@/components/ui/figure";
import { formatSi } from "@/components/ui/format";
import { StateBadge } from "@/components/ui/state-badge";
import { topicLabel, type HazardProfile, type SafetyDeclaration } from "@/lib/policy";

function Row({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div className="contents">
      <dt className="text-sm text-graphite-600">{label}</dt>
      <dd>{children}</dd>
    </div>
  );
}

const yesNo = (v: boolean) => (v ? "yes" : "no");

/** What the seller declared, and what the platform computes from it. */
export function HazardProfilePanel({ declaration: d, profile: p }: { declaration: SafetyDeclaration; profile: HazardProfile }) {
  return (
    <div className="grid gap-6 md:grid-cols-2" data-testid="hazard-profile">
      <div>
        <h3 className="mb-2 font-semibold">Declared</h3>
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
          <Row label="Mains-connected">{yesNo(d.mainsConnected)}</Row>
          {d.mainsConnected && d.mainsVrms !== undefined ? (
            <Row label="Mains">
              <Figure value={d.mainsVrms} unit="V" /> RMS, +{formatSi((d.mainsTolerance ?? 0.1) * 100, "%")}
            </Row>
          ) : null}
          <Row label="Bus capacitance">{d.busCapacitanceF ? <Figure value={d.busCapacitanceF} unit="F" /> : "none declared"}</Row>
          <Row label="Bleeder">{d.bleederOhm ? <Figure value={d.bleederOhm} unit="Ω" /> : "none fitted"}</Row>
          <Row label="Heatsinks at bus potential">{yesNo(d.liveHeatsinks)}</Row>
          <Row label="Welding power source">{yesNo(d.weldingSource)}</Row>
          {d.weldingSource ? (
            <Row label="Open-circuit voltage">
              {d.openCircuitV !== undefined ? <Figure value={d.openCircuitV} unit="V" /> : "not declared"} {(d.ocvKind ?? "dc").toUpperCase()},{" "}
              {d.environment === "increased-hazard" ? "increased hazard of electric shock" : "normal environment"}
            </Row>
          ) : null}
        </dl>
      </div>
      <div>
        <h3 className="mb-2 font-semibold">Computed</h3>
        <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1">
          <Row label="DC bus peak">
            <Figure value={p.busPeakV} unit="V" />
          </Row>
          <Row label="Stored energy">
            <Figure value={p.storedEnergyJ} unit="J" />
          </Row>
          <Row label="Stored charge">
            <Figure value={p.storedChargeC} unit="C" />
          </Row>
          <Row label={`Discharge to ${formatSi(p.safeVoltageV, "V")}`}>
            {p.busPeakV <= p.safeVoltageV || p.capacitanceF === 0 ? (
              "no charged bus"
            ) : p.dischargeS === null ? (
              <StateBadge label="No bleeder: stays charged" tone="caution" />
            ) : (
              <Figure value={p.dischargeS} unit="s" />
            )}
          </Row>
          {p.ocv ? (
            <Row label="Open-circuit limit">
              {p.ocvLimitV !== null ? <Figure value={p.ocvLimitV} unit="V" /> : "—"} {p.ocv.basis}
              {p.ocv.withinLimit === false ? <StateBadge className="ml-2" label="Over the limit" tone="stop" /> : null}
              {p.ocv.withinLimit === true ? <StateBadge className="ml-2" label="Within the limit" tone="clear" /> : null}
            </Row>
          ) : null}
        </dl>
        <p className="mt-3 text-sm text-graphite-600">Required topics:</p>
        <ul className="mt-1 flex flex-wrap gap-1" aria-label="Required topics">
          {p.requiredTopics.map((t) => (
            <li key={t}>
              <StateBadge label={topicLabel(t)} tone="active" />
            </li>
          ))}
        </ul>
      </div>
    </div>
  );
}
