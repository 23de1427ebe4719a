"use client";

import { useQuery } from "@tanstack/react-query";
import { DischargePlot } from "@/components/charts/discharge-plot";
import { Alert } from "@/components/ui/alert";
import { Figure } from "@/components/ui/figure";
import { Panel } from "@/components/ui/panel";
import { Loading, Skeleton } from "@/components/ui/skeleton";
import { ProductStateBadge, StateBadge } from "@/components/ui/state-badge";
import { dischargeCurve } from "@/lib/engineering";
import { topicLabel, type SafetySheetCheck } from "@/lib/policy";
import { safetyDeclarationSchema, safetyNotesSchema } from "@/lib/validations/policy";
import { TOPIC_STATUS_WORDS, topicStatuses } from "./topic-status";
import { useDebouncedValue } from "./use-debounced-value";

type CheckBody = { declaration: unknown; notes: unknown };

async function postCheck(body: CheckBody, signal: AbortSignal): Promise<SafetySheetCheck> {
  const res = await fetch("/api/policy/check", {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify(body),
    signal,
  });
  const json = (await res.json().catch(() => null)) as (SafetySheetCheck & { message?: string }) | null;
  if (!res.ok || !json) throw new Error(json?.message ?? "The check could not be run just now.");
  return json;
}

/**
 * The policy check of the declaration and notes as typed, asked of the server once typing pauses.
 * It only runs on a declaration the shared schema accepts; until then the form's own errors show.
 */
export function useSafetyCheck(declaration: unknown, notes: unknown) {
  const body = useDebouncedValue<CheckBody>({ declaration, notes });
  const valid = safetyDeclarationSchema.safeParse(body.declaration).success && safetyNotesSchema.safeParse(body.notes).success;
  const query = useQuery({
    queryKey: ["policy-check", body],
    queryFn: ({ signal }) => postCheck(body, signal),
    enabled: valid,
    // The previous answer stays on screen while the next one is on its way.
    placeholderData: (previous) => previous,
    staleTime: 60_000,
  });
  const settled = JSON.stringify(body) === JSON.stringify({ declaration, notes });
  return { ...query, valid, settled };
}

export type SafetyCheckState = ReturnType<typeof useSafetyCheck>;

function dischargeText(check: SafetySheetCheck) {
  const { profile } = check;
  if (profile.dischargeS === null) return <strong>unbounded — discharge by hand</strong>;
  // Rounded up, as the policy states waits, so this agrees with the wait the findings ask for.
  return <Figure value={Math.ceil(profile.dischargeS)} unit="s" />;
}

export function LiveCheckPanel({ state }: { state: SafetyCheckState }) {
  const check = state.data;
  return (
    <Panel
      title="Live safety check"
      actions={check ? <ProductStateBadge kind="policy" state={check.status} className="text-sm" /> : null}
    >
      <div data-testid="live-check" data-status={check && state.settled && !state.isFetching ? check.status : "pending"} className="space-y-4">
        {!state.valid ? (
          <Alert tone="caution" title="Waiting for the declaration">
            Fill in the declaration (mains voltage, capacitance, bleeder) without errors and the check runs by itself.
          </Alert>
        ) : state.isError && !check ? (
          <Alert tone="stop" title="The check could not be run">
            {state.error.message} Your entries are kept; it tries again when you change something.
          </Alert>
        ) : !check ? (
          <Loading label="Checking the safety sheet">
            <Skeleton className="h-24 w-full" />
          </Loading>
        ) : (
          <CheckBody check={check} />
        )}
        <p className="sr-only" aria-live="polite">
          {check && state.settled ? `Safety check: ${check.status}, ${check.findings.length} findings.` : ""}
        </p>
      </div>
    </Panel>
  );
}

function CheckBody({ check }: { check: SafetySheetCheck }) {
  const { profile } = check;
  const statuses = topicStatuses(profile.requiredTopics, check.findings);
  const curve =
    profile.bleederOhm && profile.capacitanceF > 0 && profile.busPeakV > profile.safeVoltageV
      ? dischargeCurve({ resistanceOhm: profile.bleederOhm, capacitanceF: profile.capacitanceF, fromV: profile.busPeakV, toV: profile.safeVoltageV, points: 60 })
      : [];
  return (
    <>
      {check.status === "blocked" ? (
        <Alert tone="stop" title="This listing cannot be sold as declared">
          The declared open-circuit voltage is above the limit of the arc-welding standard, so no safety note can make up for it. Bring
          the output within the limit and change the declaration.
        </Alert>
      ) : check.status === "clear" ? (
        <Alert tone="info" title="Every required topic is covered">
          You can submit the listing for review; a moderator reads the sheet before it goes live.
        </Alert>
      ) : null}

      <dl className="grid grid-cols-2 gap-x-4 gap-y-2 text-sm" data-testid="live-hazard-profile">
        <dt className="text-graphite-600">DC bus peak</dt>
        <dd><Figure value={profile.busPeakV} unit="V" /></dd>
        <dt className="text-graphite-600">Stored energy</dt>
        <dd><Figure value={profile.storedEnergyJ} unit="J" /></dd>
        <dt className="text-graphite-600">Stored charge</dt>
        <dd><Figure value={profile.storedChargeC} unit="C" /></dd>
        <dt className="text-graphite-600">Time to {profile.safeVoltageV} V</dt>
        <dd data-testid="discharge-time">{dischargeText(check)}</dd>
        {profile.ocvLimitV !== null ? (
          <>
            <dt className="text-graphite-600">Open-circuit limit</dt>
            <dd><Figure value={profile.ocvLimitV} unit="V" /> {profile.ocv?.basis}</dd>
          </>
        ) : null}
      </dl>

      <div>
        <h3 className="text-sm font-semibold text-graphite-900">Required topics</h3>
        <ul className="mt-2 space-y-1" data-testid="required-topics">
          {profile.requiredTopics.map((topic) => {
            const word = TOPIC_STATUS_WORDS[statuses.get(topic) ?? "covered"];
            return (
              <li key={topic} className="flex items-center justify-between gap-2 text-sm" data-topic={topic} data-status={statuses.get(topic)}>
                <span>{topicLabel(topic)}</span>
                <StateBadge label={word.label} tone={word.tone} />
              </li>
            );
          })}
        </ul>
      </div>

      {check.findings.length > 0 ? (
        <div>
          <h3 className="text-sm font-semibold text-graphite-900">What to do</h3>
          <ul className="mt-2 list-disc space-y-2 pl-5 text-sm" data-testid="findings">
            {check.findings.map((f) => (
              <li key={`${f.topic}-${f.code}`}>{f.message}</li>
            ))}
          </ul>
        </div>
      ) : null}

      {/* The chart's screen-reader table is absolutely placed; this box keeps it from widening the page. */}
      <div className="relative overflow-hidden">
        <DischargePlot
          points={curve}
          safeV={profile.safeVoltageV}
          dischargeS={profile.dischargeS}
          through={profile.bleederOhm ? "through the declared bleeder" : undefined}
        />
      </div>
      <p className="text-xs text-graphite-600">Checked against policy revision {check.revision}. Figures are estimates for checking a design, not a certification.</p>
    </>
  );
}
