import { EstimateNote } from "@/components/caution";
import { Figure } from "@/components/ui/figure";
import { Panel } from "@/components/ui/panel";
import { StateBadge, type StateTone } from "@/components/ui/state-badge";
import { Table, TBody, TD, TH, THead, TRow } from "@/components/ui/table";
import type { MagneticSubtype } from "@/db/schema/listings";
import { conductorLabel, deriveMagnetic, type FluxVerdict } from "@/lib/listings/derived";
import { magneticFiguresSchema } from "@/lib/validations/listings";

const VERDICTS: Record<FluxVerdict, { label: string; tone: StateTone }> = {
  "within-design": { label: "Within the design limit", tone: "clear" },
  "above-design-max": { label: "Above the design limit, below saturation", tone: "caution" },
  saturates: { label: "Past saturation", tone: "stop" },
};

const ROLE_LABELS = { primary: "Primary", secondary: "Secondary", winding: "Winding" } as const;

const percent = (fraction: number) => <Figure value={fraction * 100} unit="%" digits={3} />;

/**
 * What a magnetic's own figures imply (lib/listings/derived.ts), for a buyer checking it against
 * a design. Nothing is shown when the stored figures are incomplete.
 */
export function MagneticDerivedFigures({ subtype, figures }: { subtype: MagneticSubtype; figures: unknown }) {
  const parsed = magneticFiguresSchema.safeParse(figures);
  if (!parsed.success) return null;
  let derived;
  try {
    derived = deriveMagnetic(subtype, parsed.data);
  } catch {
    return null;
  }
  const verdict = derived.verdict ? VERDICTS[derived.verdict] : null;

  return (
    <Panel title="Derived figures">
      <div className="space-y-4" data-testid="derived-figures">
        <dl className="grid gap-x-8 gap-y-2 text-sm sm:grid-cols-[auto_1fr]">
          <dt className="font-semibold">Inductance ({derived.inductanceWinding})</dt>
          <dd>
            <Figure value={derived.inductanceH} unit="H" /> <span className="text-graphite-600">{derived.inductanceBasis === "al" ? "from turns and AL" : "from the gap geometry"}</span>
          </dd>
          <dt className="font-semibold">Core material</dt>
          <dd>
            {derived.material.label}: saturates from <Figure value={derived.material.saturationMinT} unit="T" />, designed to <Figure value={derived.material.designMaxT} unit="T" />
          </dd>
          {derived.peakFluxT !== null ? (
            <>
              <dt className="font-semibold">Peak flux density</dt>
              <dd>
                <Figure value={derived.peakFluxT} unit="T" />{" "}
                <span className="text-graphite-600">{derived.fluxBasis === "rated-current" ? "at the rated current" : "from the primary volt-seconds"}</span>
              </dd>
            </>
          ) : null}
          {derived.marginToSaturation !== null ? (
            <>
              <dt className="font-semibold">Margin to saturation</dt>
              <dd>
                {percent(derived.marginToSaturation)} {verdict ? <StateBadge label={verdict.label} tone={verdict.tone} className="ml-2" /> : null}
              </dd>
            </>
          ) : null}
          {derived.totalCopperLossW !== null ? (
            <>
              <dt className="font-semibold">Copper loss (DC resistance)</dt>
              <dd>
                <Figure value={derived.totalCopperLossW} unit="W" />
              </dd>
            </>
          ) : null}
          {derived.turnsRatios.map((r) => (
            <div key={r.secondary} className="contents">
              <dt className="font-semibold">Turns ratio to {r.secondary}</dt>
              <dd>
                <Figure value={r.ratio} unit="" /> : 1
              </dd>
            </div>
          ))}
        </dl>

        <Table caption="Windings">
          <THead>
            <TRow>
              <TH>Winding</TH>
              <TH numeric>Turns</TH>
              <TH numeric>Current density</TH>
              <TH numeric>DC resistance</TH>
              <TH numeric>Copper loss</TH>
              <TH numeric>Skin depth</TH>
              <TH numeric>Strand radius ÷ skin depth</TH>
            </TRow>
          </THead>
          <TBody>
            {derived.windings.map((w) => (
              <TRow key={w.name}>
                <TD>
                  {w.name} <span className="text-graphite-600">({ROLE_LABELS[w.role]}, {conductorLabel(w.material).toLowerCase()})</span>
                </TD>
                <TD numeric>{w.turns}</TD>
                <TD numeric>
                  <Figure value={w.currentDensityAPerM2 / 1e6} unit="A/mm²" prefixes={false} />
                </TD>
                <TD numeric>{w.resistanceOhm === null ? "—" : <Figure value={w.resistanceOhm} unit="Ω" />}</TD>
                <TD numeric>{w.copperLossW === null ? "—" : <Figure value={w.copperLossW} unit="W" />}</TD>
                <TD numeric>
                  <Figure value={w.skinDepthM} unit="m" />
                </TD>
                <TD numeric>
                  <Figure value={w.radiusToSkinDepth} unit="" digits={2} />
                  {w.radiusToSkinDepth > 1 ? <StateBadge label="AC loss rises" tone="caution" className="ml-2" /> : null}
                </TD>
              </TRow>
            ))}
          </TBody>
        </Table>
        <EstimateNote />
      </div>
    </Panel>
  );
}
