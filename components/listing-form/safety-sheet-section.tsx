"use client";

import { MainsCaution } from "@/components/caution";
import { CheckboxField, NumberField, SelectField, TextArea } from "@/components/ui/field";
import { Panel } from "@/components/ui/panel";
import { StateBadge } from "@/components/ui/state-badge";
import { countWords, hazardProfile, SAFETY_TOPIC_KEYS, topicLabel, topicPrompt, type SafetyTopicKey } from "@/lib/policy";
import { safetyDeclarationSchema } from "@/lib/validations/policy";
import type { SectionProps } from "./form-context";
import { declarationInput } from "./form-model";
import type { SafetyCheckState } from "./live-check";
import { TOPIC_STATUS_WORDS, topicStatuses } from "./topic-status";

/** Topics to write: those the live check requires, else those the built-in policy would; plus any already written. */
function topicsToShow(values: SectionProps["values"], check: SafetyCheckState): { required: SafetyTopicKey[]; extra: SafetyTopicKey[] } {
  let required: SafetyTopicKey[] = check.data?.profile.requiredTopics ?? [];
  if (!check.data) {
    const declaration = safetyDeclarationSchema.safeParse(declarationInput(values));
    if (declaration.success) {
      try {
        required = hazardProfile(declaration.data).requiredTopics;
      } catch {
        required = ["codes-and-competence"];
      }
    } else required = ["codes-and-competence"];
  }
  const extra = SAFETY_TOPIC_KEYS.filter((t) => !required.includes(t) && values.notes[t].text.trim() !== "");
  return { required, extra };
}

export function SafetySheetSection({ values, set, errors, check }: SectionProps & { check: SafetyCheckState }) {
  const d = values.declaration;
  const bind = (key: keyof typeof d & string) => ({
    name: `declaration.${key}`,
    value: d[key] as string,
    onChange: (e: { target: { value: string } }) => set(`declaration.${key}`, e.target.value),
    error: errors[`declaration.${key}`],
  });
  const tick = (key: "mainsConnected" | "liveHeatsinks" | "weldingSource") => ({
    name: `declaration.${key}`,
    checked: d[key],
    onChange: (e: { target: { checked: boolean } }) => set(`declaration.${key}`, e.target.checked),
    error: errors[`declaration.${key}`],
  });
  const { required, extra } = topicsToShow(values, check);
  const statuses = check.data ? topicStatuses(check.data.profile.requiredTopics, check.data.findings) : null;
  return (
    <Panel title="Safety sheet">
      <div className="space-y-6">
        <MainsCaution variant="full" />
        <fieldset className="space-y-4">
          <legend className="text-base font-semibold text-graphite-900">Where it sits in the finished build</legend>
          <CheckboxField label="Mains-connected (it sits on the rectified mains bus)" {...tick("mainsConnected")} hint="A main transformer's primary on the bus counts." />
          {d.mainsConnected ? (
            <div className="grid gap-4 sm:grid-cols-2">
              <NumberField label="Nominal mains voltage" unit="V" {...bind("mainsVrms")} />
              <NumberField label="Upper tolerance" unit="%" {...bind("mainsTolerance")} hint="IEC 60038 allows +10 %." />
            </div>
          ) : null}
          <div className="grid gap-4 sm:grid-cols-2">
            <NumberField label="Bulk capacitance on the bus" unit="µF" {...bind("busCapacitanceF")} />
            <NumberField label="Bleeder resistance" unit="kΩ" hint="Leave empty when no bleeder is fitted." {...bind("bleederOhm")} />
          </div>
          <CheckboxField label="Heatsinks at bus potential (live heatsinks)" {...tick("liveHeatsinks")} />
          <CheckboxField label="Welding power source (or part of one)" {...tick("weldingSource")} />
          {d.weldingSource ? (
            <div className="grid gap-4 sm:grid-cols-3">
              <NumberField label="Open-circuit voltage" unit="V" {...bind("openCircuitV")} hint="DC: the peak; AC: the RMS value." />
              <SelectField label="Output" options={[{ value: "dc", label: "DC" }, { value: "ac", label: "AC" }]} {...bind("ocvKind")} />
              <SelectField
                label="Environment"
                options={[
                  { value: "normal", label: "Normal" },
                  { value: "increased-hazard", label: "Increased hazard of electric shock" },
                ]}
                {...bind("environment")}
              />
            </div>
          ) : null}
        </fieldset>

        <fieldset className="space-y-5">
          <legend className="text-base font-semibold text-graphite-900">Notes, one per required topic</legend>
          {[...required, ...extra].map((topic) => {
            const note = values.notes[topic];
            const status = statuses?.get(topic);
            const words = countWords(note.text);
            return (
              <div key={topic} className="space-y-2" data-testid={`note-${topic}`}>
                <div className="flex flex-wrap items-center gap-2">
                  <h3 className="font-semibold text-graphite-900">{topicLabel(topic)}</h3>
                  {status ? <StateBadge label={TOPIC_STATUS_WORDS[status].label} tone={TOPIC_STATUS_WORDS[status].tone} /> : null}
                  {!required.includes(topic) ? <StateBadge label="Not required now" /> : null}
                </div>
                <TextArea
                  label={`Note on ${topicLabel(topic).toLowerCase()}`}
                  name={`notes.${topic}.text`}
                  rows={4}
                  hint={`It should cover ${topicPrompt(topic)}. ${words} ${words === 1 ? "word" : "words"} so far.`}
                  value={note.text}
                  onChange={(e) => set(`notes.${topic}.text`, e.target.value)}
                  error={errors[`notes.${topic}.text`]}
                />
                {topic === "stored-charge" ? (
                  <div className="max-w-xs">
                    <NumberField
                      label="Wait before touching"
                      unit="s"
                      step="1"
                      hint="After unplugging; at least the computed discharge time."
                      value={note.waitSeconds}
                      name="notes.stored-charge.waitSeconds"
                      onChange={(e) => set("notes.stored-charge.waitSeconds", e.target.value)}
                      error={errors["notes.stored-charge.waitSeconds"]}
                    />
                  </div>
                ) : null}
              </div>
            );
          })}
        </fieldset>
      </div>
    </Panel>
  );
}
