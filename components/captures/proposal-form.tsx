"use client";

import { useId, useState, useTransition } from "react";
import { formatRange, formatReading } from "@/components/bench/format";
import { Button } from "@/components/ui/button";
import { SelectField } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import type { CaptureActionResult } from "@/lib/captures/action-schemas";
import type { Proposal } from "@/lib/captures/proposal";
import { formatSi } from "@/components/ui/format";

export type ProposalFormProps = {
  proposal: Proposal;
  checkpoint: { name: string; unit: string; expectedMin: number; expectedMax: number };
  currentValue: number;
  /** the owner's confirm action; without it the proposal is shown, not offered */
  confirm?: (input: unknown) => Promise<CaptureActionResult>;
  /** the card shows the answer: this form is gone once the figure is applied */
  onConfirmed?: (result: Extract<CaptureActionResult, { ok: true }>) => void;
  /** where the form sits in the page's outline: under a stage's checkpoint (4) or a panel (3) */
  headingLevel?: 3 | 4;
};

/**
 * The figure the capture gives for the checkpoint, proposed as the reading's value. Nothing
 * changes until the builder confirms; the server then works the figure out again and classifies it.
 */
export function ProposalForm({ proposal, checkpoint, currentValue, confirm, onConfirmed, headingLevel = 4 }: ProposalFormProps) {
  const id = useId();
  const Heading = `h${headingLevel}` as const;
  const [channel, setChannel] = useState(proposal.ok ? (proposal.options[0]?.channel ?? 0) : 0);
  const [result, setResult] = useState<CaptureActionResult | null>(null);
  const [pending, startTransition] = useTransition();

  if (!proposal.ok) {
    return (
      <p className="text-sm text-graphite-700" data-testid="capture-no-proposal">
        <span className="font-semibold">No value to propose.</span> {proposal.reason}
      </p>
    );
  }
  const option = proposal.options.find((o) => o.channel === channel) ?? proposal.options[0];
  if (!option) return null;
  const same = Math.abs(option.value - currentValue) <= Math.abs(currentValue) * 1e-9;
  const range = formatRange(checkpoint.expectedMin, checkpoint.expectedMax, checkpoint.unit);

  const submit = () =>
    startTransition(async () => {
      if (!confirm) return;
      const answer = await confirm({ channel });
      if (answer.ok) onConfirmed?.(answer);
      else setResult(answer);
    });

  return (
    <section aria-labelledby={`${id}-title`} className="space-y-3 rounded border border-copper-300 bg-copper-50 px-3 py-3" data-testid="capture-proposal">
      <Heading id={`${id}-title`} className="text-sm font-semibold text-graphite-900">
        Proposed reading
      </Heading>
      <p className="text-sm text-graphite-800">
        <data value={String(option.value)} className="figure font-mono text-lg font-semibold text-graphite-900" data-testid="proposed-value">
          {formatReading(option.value, option.unit)}
        </data>{" "}
        — the {option.figureLabel.toLowerCase()} of {option.channelName}
        {option.measuredUnit !== option.unit ? ` (${formatSi(option.measured, option.measuredUnit, 5)} as measured)` : ""}. Expected {range}; the reading is now{" "}
        {formatReading(currentValue, checkpoint.unit)}.
      </p>
      {proposal.options.length > 1 ? (
        <SelectField
          id={`${id}-channel`}
          label="Channel"
          value={String(channel)}
          onChange={(event) => setChannel(Number(event.currentTarget.value))}
          options={proposal.options.map((o) => ({ value: String(o.channel), label: `${o.channelName}: ${formatReading(o.value, o.unit)}` }))}
          disabled={!confirm || pending}
        />
      ) : null}
      {confirm ? (
        <>
          <Button onClick={submit} disabled={pending || same}>
            {pending ? "Saving…" : same ? "The reading already has this value" : `Use ${formatReading(option.value, option.unit)} as the reading`}
          </Button>
          <p className="text-xs text-graphite-600">Nothing changes until you confirm. The reading is then classified against {range} again.</p>
        </>
      ) : (
        <p className="text-xs text-graphite-600">Only the builder who keeps the log can make it the reading&apos;s value.</p>
      )}
      <div data-testid="capture-proposal-result">
        <FormMessage tone="error" message={result?.ok === false ? result.message : undefined} />
      </div>
    </section>
  );
}
