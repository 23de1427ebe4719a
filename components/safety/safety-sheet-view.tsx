import { DischargePlot } from "@/components/charts/discharge-plot";
import { Markdown } from "@/components/markdown";
import { Figure } from "@/components/ui/figure";
import { productState, StateBadge } from "@/components/ui/state-badge";
import { dischargeCurve } from "@/lib/engineering";
import { SAFETY_TOPICS, type SafetyDeclaration, type SafetyNote, type SafetySheetCheck } from "@/lib/policy";

/** A listing's safety sheet as a buyer or moderator reads it: the declaration, the computed hazards, every note. */
export function SafetySheetView({
  declaration,
  notes,
  check,
  imageOrigins,
}: {
  declaration: SafetyDeclaration;
  notes: SafetyNote[];
  check: SafetySheetCheck;
  imageOrigins?: string[];
}) {
  const { profile } = check;
  const status = productState("policy", check.status);
  const byTopic = new Map(notes.map((n) => [n.topic, n]));
  const curve =
    profile.bleederOhm && profile.capacitanceF > 0 && profile.busPeakV > profile.safeVoltageV
      ? dischargeCurve({ resistanceOhm: profile.bleederOhm, capacitanceF: profile.capacitanceF, fromV: profile.busPeakV, toV: profile.safeVoltageV, points: 80 })
      : [];
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center gap-3">
        <StateBadge label={`Policy check: ${status.label}`} tone={status.tone} />
        <span className="text-sm text-graphite-600">against policy revision {check.revision}</span>
      </div>
      <dl className="grid grid-cols-2 gap-x-6 gap-y-2 text-sm sm:grid-cols-3" data-testid="hazard-profile">
        <Item label="Mains-connected" value={declaration.mainsConnected ? `yes, ${declaration.mainsVrms ?? "?"} V ±${Math.round((declaration.mainsTolerance ?? 0.1) * 100)} %` : "no"} />
        <Item label="DC bus peak" value={<Figure value={profile.busPeakV} unit="V" />} />
        <Item label="Bus capacitance" value={<Figure value={profile.capacitanceF} unit="F" />} />
        <Item label="Stored energy" value={<Figure value={profile.storedEnergyJ} unit="J" />} />
        <Item label="Stored charge" value={<Figure value={profile.storedChargeC} unit="C" />} />
        <Item
          label={`Time to ${profile.safeVoltageV} V`}
          value={profile.dischargeS === null ? (profile.capacitanceF > 0 ? "no bleeder — discharge by hand" : "—") : <Figure value={profile.dischargeS} unit="s" />}
        />
        <Item label="Heatsinks at bus potential" value={declaration.liveHeatsinks ? "yes" : "no"} />
        {profile.ocv ? (
          <Item
            label="Open-circuit voltage"
            value={
              <>
                {profile.ocv.declaredV === null ? "not stated" : <Figure value={profile.ocv.declaredV} unit="V" />} (limit{" "}
                <Figure value={profile.ocvLimitV ?? 0} unit="V" /> {profile.ocv.basis})
              </>
            }
          />
        ) : null}
      </dl>
      {curve.length > 1 ? (
        <DischargePlot points={curve} safeV={profile.safeVoltageV} dischargeS={profile.dischargeS} through={`through the ${Math.round((profile.bleederOhm ?? 0) / 1000)} kΩ bleeder`} />
      ) : null}
      {check.findings.length > 0 ? (
        <ul className="space-y-1 rounded border-l-4 border-amber-500 bg-amber-50 px-4 py-3 text-sm text-amber-900">
          {check.findings.map((f) => (
            <li key={`${f.topic}-${f.code}`}>{f.message}</li>
          ))}
        </ul>
      ) : null}
      <div className="max-w-reading space-y-5">
        {SAFETY_TOPICS.filter((t) => profile.requiredTopics.includes(t.key) || byTopic.has(t.key)).map((topic) => {
          const note = byTopic.get(topic.key);
          return (
            <section key={topic.key} aria-labelledby={`topic-${topic.key}`} data-testid={`sheet-topic-${topic.key}`}>
              <h3 id={`topic-${topic.key}`} className="text-base font-semibold text-graphite-900">
                {topic.label}
              </h3>
              {note ? (
                <>
                  <Markdown imageOrigins={imageOrigins}>{note.text}</Markdown>
                  {note.waitSeconds !== undefined ? (
                    <p className="mt-1 text-sm text-graphite-700">
                      Stated wait before touching: <Figure value={note.waitSeconds} unit="s" />
                    </p>
                  ) : null}
                </>
              ) : (
                <p className="text-sm text-graphite-600">No note.</p>
              )}
            </section>
          );
        })}
      </div>
    </div>
  );
}

function Item({ label, value }: { label: string; value: React.ReactNode }) {
  return (
    <div>
      <dt className="text-graphite-600">{label}</dt>
      <dd className="font-medium text-graphite-900">{value}</dd>
    </div>
  );
}
