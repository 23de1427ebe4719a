import type { ReactNode } from "react";
import { CONDUCTOR_MATERIALS, CORE_MATERIALS } from "@/lib/engineering";
import { deriveMagnetic, type MagneticDerived } from "@/lib/listings/derived";
import { magneticFiguresSchema } from "@/lib/validations/listings";
import type { MagneticSubtype } from "@/db/schema";
import { Figure } from "@/components/ui/figure";
import { formatSi } from "@/components/ui/format";
import { StateBadge } from "@/components/ui/state-badge";
import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";

// The listing's own figures as the seller entered them (SI), and for magnetics what they imply.

type Known = { label: string; show: (v: number) => ReactNode };

const si = (unit: string) => (v: number) => <Figure value={v} unit={unit} />;
// Areas stay in mm²: an SI prefix on m² would read as a prefix of the metre, not of the square metre.
const mm2 = (v: number) => <span className="figure font-mono">{formatSi(v * 1e6, "mm²", 3, { prefixes: false })}</span>;

const KNOWN: Record<string, Known> = {
  coreAreaM2: { label: "Core area Ae", show: mm2 },
  pathLengthM: { label: "Path length le", show: si("m") },
  gapM: { label: "Air gap lg", show: si("m") },
  alNh: { label: "AL", show: (v) => <span className="figure font-mono">{formatSi(v, "nH/turn²", 3, { prefixes: false })}</span> },
  meanTurnLengthM: { label: "Mean turn length", show: si("m") },
  ratedCurrentA: { label: "Rated current", show: si("A") },
  switchingFrequencyHz: { label: "Switching frequency", show: si("Hz") },
  primaryVoltageV: { label: "Primary voltage", show: si("V") },
  mainsVrms: { label: "Mains voltage", show: si("V") },
  busCapacitanceF: { label: "Bus capacitance", show: si("F") },
  bleederOhm: { label: "Bleeder", show: si("Ω") },
  openCircuitV: { label: "Open-circuit voltage", show: si("V") },
};

// Unknown keys still get a unit when their name ends in one (the figures are SI throughout).
const SUFFIX_UNITS: [RegExp, string][] = [
  [/M2$/, "mm²"],
  [/Hz$/, "Hz"],
  [/Ohm$/, "Ω"],
  [/Vrms$/, "V"],
  [/V$/, "V"],
  [/A$/, "A"],
  [/F$/, "F"],
  [/H$/, "H"],
  [/T$/, "T"],
  [/W$/, "W"],
  [/M$/, "m"],
  [/S$/, "s"],
  [/G$/, "g"],
];

function humanise(key: string): string {
  const words = key.replace(/(M2|Hz|Ohm|Vrms|[VAFHTWMSG])$/, "").replace(/([a-z])([A-Z])/g, "$1 $2").toLowerCase();
  return words.charAt(0).toUpperCase() + words.slice(1);
}

function showValue(key: string, value: unknown): ReactNode {
  const known = KNOWN[key];
  if (typeof value === "number" && known) return known.show(value);
  if (typeof value === "number") {
    const unit = SUFFIX_UNITS.find(([re]) => re.test(key))?.[1];
    if (unit === "mm²") return mm2(value);
    return unit ? <Figure value={value} unit={unit} /> : <span className="figure font-mono">{value}</span>;
  }
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (key === "coreMaterial" && typeof value === "string") return CORE_MATERIALS[value as keyof typeof CORE_MATERIALS]?.label ?? value;
  if (typeof value === "string") return value;
  return <code className="font-mono text-xs">{JSON.stringify(value)}</code>;
}

export function figureLabel(key: string): string {
  if (key === "coreMaterial") return "Core material";
  return KNOWN[key]?.label ?? humanise(key);
}

export { showValue as figureValue };

type WindingRow = { name?: unknown; role?: unknown; turns?: unknown; material?: unknown; areaM2?: unknown; strands?: unknown; currentA?: unknown };

function WindingsTable({ windings }: { windings: WindingRow[] }) {
  return (
    <Table caption="Windings">
      <THead>
        <TRow>
          <TH>Winding</TH>
          <TH>Role</TH>
          <TH numeric>Turns</TH>
          <TH>Conductor</TH>
          <TH numeric>Cross-section</TH>
          <TH numeric>Strands</TH>
          <TH numeric>Current (RMS)</TH>
        </TRow>
      </THead>
      <TBody>
        {windings.map((w, i) => (
          <TRow key={i}>
            <TD>{String(w.name ?? `#${i + 1}`)}</TD>
            <TD>{String(w.role ?? "—")}</TD>
            <TD numeric>{String(w.turns ?? "—")}</TD>
            <TD>{CONDUCTOR_MATERIALS[w.material as keyof typeof CONDUCTOR_MATERIALS]?.label ?? String(w.material ?? "—")}</TD>
            <TD numeric>{typeof w.areaM2 === "number" ? mm2(w.areaM2) : "—"}</TD>
            <TD numeric>{String(w.strands ?? 1)}</TD>
            <TD numeric>{typeof w.currentA === "number" ? <Figure value={w.currentA} unit="A" /> : "—"}</TD>
          </TRow>
        ))}
      </TBody>
    </Table>
  );
}

const VERDICTS: Record<NonNullable<MagneticDerived["verdict"]>, { label: string; tone: "clear" | "caution" | "stop" }> = {
  "within-design": { label: "Within the material's design flux", tone: "clear" },
  "above-design-max": { label: "Above design flux, below saturation", tone: "caution" },
  saturates: { label: "Saturates at rated current", tone: "stop" },
};

const percent = (v: number) => <span className="figure font-mono">{formatSi(v * 100, "%", 3)}</span>;

function DerivedMagnetic({ d }: { d: MagneticDerived }) {
  const rows: [string, ReactNode][] = [
    [`Inductance (${d.inductanceWinding}, from ${d.inductanceBasis === "al" ? "AL" : "the gap"})`, <Figure key="l" value={d.inductanceH} unit="H" />],
    ["Core material", `${d.material.label} (saturation from ${formatSi(d.material.saturationMinT, "T")}, design ${formatSi(d.material.designMaxT, "T")})`],
  ];
  if (d.peakFluxT !== null) rows.push([d.fluxBasis === "rated-current" ? "Peak flux at rated current" : "Peak flux from primary volt-seconds", <Figure key="b" value={d.peakFluxT} unit="T" />]);
  if (d.marginToSaturation !== null) rows.push(["Margin to saturation", percent(d.marginToSaturation)]);
  if (d.totalCopperLossW !== null) rows.push(["Copper loss (DC, all windings)", <Figure key="p" value={d.totalCopperLossW} unit="W" />]);
  for (const r of d.turnsRatios) rows.push([`Turns ratio to ${r.secondary}`, <span key={r.secondary} className="figure font-mono">{formatSi(r.ratio, "", 3)} : 1</span>]);
  return (
    <div className="space-y-3">
      <h3 className="font-semibold">Derived figures</h3>
      {d.verdict ? <StateBadge label={VERDICTS[d.verdict].label} tone={VERDICTS[d.verdict].tone} /> : null}
      <dl className="grid grid-cols-1 gap-x-6 gap-y-1 sm:grid-cols-[auto_1fr]">
        {rows.map(([label, value]) => (
          <div key={label} className="contents">
            <dt className="text-sm text-graphite-600">{label}</dt>
            <dd>{value}</dd>
          </div>
        ))}
      </dl>
      <Table caption="Per winding">
        <THead>
          <TRow>
            <TH>Winding</TH>
            <TH numeric>Resistance</TH>
            <TH numeric>Copper loss</TH>
            <TH numeric>Current density</TH>
            <TH numeric>Skin depth</TH>
            <TH numeric title="Strand radius over skin depth; above 1 the AC resistance climbs">r / δ</TH>
          </TRow>
        </THead>
        <TBody>
          {d.windings.map((w) => (
            <TRow key={w.name}>
              <TD>{w.name}</TD>
              <TD numeric>{w.resistanceOhm === null ? "—" : <Figure value={w.resistanceOhm} unit="Ω" />}</TD>
              <TD numeric>{w.copperLossW === null ? "—" : <Figure value={w.copperLossW} unit="W" />}</TD>
              <TD numeric>{formatSi(w.currentDensityAPerM2 / 1e6, "A/mm²", 3, { prefixes: false })}</TD>
              <TD numeric>
                <Figure value={w.skinDepthM} unit="m" />
              </TD>
              <TD numeric>{formatSi(w.radiusToSkinDepth, "", 3)}</TD>
            </TRow>
          ))}
        </TBody>
      </Table>
      <p className="text-sm text-graphite-600">Computed from the seller&apos;s figures: estimates for checking the design, not a certification.</p>
    </div>
  );
}

function safeDerive(subtype: MagneticSubtype | null, figures: Record<string, unknown>): MagneticDerived | null {
  if (!subtype) return null;
  const parsed = magneticFiguresSchema.safeParse(figures);
  if (!parsed.success) return null;
  try {
    return deriveMagnetic(subtype, parsed.data);
  } catch {
    return null;
  }
}

export function ListingFigures({ kind, subtype, figures }: { kind: string; subtype: MagneticSubtype | null; figures: Record<string, unknown> }) {
  const { windings, ...flat } = figures as { windings?: unknown } & Record<string, unknown>;
  const entries = Object.entries(flat).filter(([, v]) => v !== undefined && v !== null);
  const derived = kind === "magnetic" ? safeDerive(subtype, figures) : null;
  if (entries.length === 0 && !Array.isArray(windings)) {
    return <p className="text-graphite-600">No kind-specific figures; the electrical figures of this {kind} are in its safety declaration below.</p>;
  }
  return (
    <div className="space-y-4" data-testid="listing-figures">
      <dl className="grid grid-cols-1 gap-x-6 gap-y-1 sm:grid-cols-[auto_1fr]">
        {entries.map(([key, value]) => (
          <div key={key} className="contents">
            <dt className="text-sm text-graphite-600">{figureLabel(key)}</dt>
            <dd>{showValue(key, value)}</dd>
          </div>
        ))}
      </dl>
      {Array.isArray(windings) && windings.length > 0 ? <WindingsTable windings={windings as WindingRow[]} /> : null}
      {derived ? <DerivedMagnetic d={derived} /> : kind === "magnetic" ? <p className="text-sm text-graphite-600">The figures are not complete enough to derive inductance and flux.</p> : null}
    </div>
  );
}
