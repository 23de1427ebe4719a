"use client";

import { useMemo, useState, useTransition } from "react";
import { saveListing } from "@/app/(sell)/sell/listings/actions";
import { Button } from "@/components/ui/button";
import { FormMessage } from "@/components/ui/form-message";
import type { ListingState } from "@/db/schema/listings";
import { BasicsSection } from "./basics-section";
import { declarationInput, formPath, notesInput, toInput, validate, type FormErrors, type FormValues } from "./form-model";
import { CheckpointsEditor, RequirementsEditor } from "./kit-section";
import { LiveCheckPanel, useSafetyCheck } from "./live-check";
import { MagneticSection } from "./magnetic-section";
import { MediaSection } from "./media-section";
import { SafetySheetSection } from "./safety-sheet-section";
import { setIn } from "./set-in";

export type ListingFormProps = {
  listingId: string | null;
  initial: FormValues;
  state: ListingState | null;
  payoutReady: boolean;
};

type Message = { tone: "success" | "error" | "info"; text: string } | null;

/** Why "Submit for review" is not available yet, in the seller's words; empty when it is. */
function submitBlockers({ state, payoutReady, values, checkStatus, settled, formOk }: {
  state: ListingState | null;
  payoutReady: boolean;
  values: FormValues;
  checkStatus: string | undefined;
  settled: boolean;
  formOk: boolean;
}): string[] {
  if (state !== null && state !== "draft" && state !== "sent_back") return [];
  const out: string[] = [];
  if (!payoutReady) out.push("Connect and finish your payout account on the seller desk; until then you can keep drafting.");
  if (values.photos.length === 0) out.push("Add at least one photo.");
  if (!formOk) out.push("Fix the entries marked in the form.");
  if (checkStatus === "blocked") out.push("The safety check blocks this listing as declared.");
  else if (checkStatus !== "clear" || !settled) out.push("The live safety check must show clear.");
  return out;
}

export function ListingForm({ listingId, initial, state, payoutReady }: ListingFormProps) {
  const [values, setValues] = useState<FormValues>(initial);
  const [serverErrors, setServerErrors] = useState<FormErrors>({});
  const [showErrors, setShowErrors] = useState(false);
  const [message, setMessage] = useState<Message>(null);
  const [pending, startTransition] = useTransition();

  const set = (path: string, value: unknown) => {
    setValues((current) => setIn(current, path, value));
    // A server complaint about a field is stale once the field changes.
    setServerErrors((current) => {
      if (!(path in current)) return current;
      const { [path]: _gone, ...rest } = current;
      return rest;
    });
  };

  const checked = useMemo(() => validate(values), [values]);
  const clientErrors = checked.ok ? {} : checked.errors;
  const errors: FormErrors = { ...(showErrors ? clientErrors : {}), ...serverErrors };

  const declaration = useMemo(() => declarationInput(values), [values]);
  const notes = useMemo(() => notesInput(values).notes, [values]);
  const check = useSafetyCheck(declaration, notes);

  const blockers = submitBlockers({ state, payoutReady, values, checkStatus: check.data?.status, settled: check.settled && !check.isFetching, formOk: checked.ok });
  const canSubmit = state === null || state === "draft" || state === "sent_back";
  const editing = listingId !== null;

  const save = (intent: "draft" | "submit") => {
    setShowErrors(true);
    if (!checked.ok) {
      setMessage({ tone: "error", text: "Some entries need fixing; they are marked beside each field. Nothing was saved yet." });
      return;
    }
    setMessage({ tone: "info", text: intent === "submit" ? "Saving and submitting…" : "Saving…" });
    const { input, noteTopics } = toInput(values);
    startTransition(async () => {
      const result = await saveListing(listingId, input, intent);
      // A redirect (after creating, or after submitting) leaves this page before anything comes back.
      if (!result) return;
      if (result.ok) {
        setServerErrors({});
        setMessage({ tone: "success", text: result.message });
      } else {
        const mapped: FormErrors = {};
        for (const [path, list] of Object.entries(result.fieldErrors)) (mapped[formPath(path, noteTopics)] ??= []).push(...list);
        setServerErrors(mapped);
        setMessage({ tone: "error", text: result.message });
      }
    });
  };

  const section = { values, set, errors, editing };
  return (
    <form
      noValidate
      className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_24rem]"
      onSubmit={(e) => {
        e.preventDefault();
        save("draft");
      }}
      data-testid="listing-form"
    >
      <div className="min-w-0 space-y-6">
        <BasicsSection {...section} />
        <MediaSection {...section} />
        {values.kind === "magnetic" ? <MagneticSection {...section} /> : null}
        {values.kind === "kit" ? (
          <>
            <CheckpointsEditor {...section} />
            <RequirementsEditor {...section} />
          </>
        ) : null}
        <SafetySheetSection {...section} check={check} />

        <div className="space-y-3 rounded-md border border-graphite-200 bg-paper-raised p-4">
          <FormMessage tone={message?.tone ?? "info"} message={message?.text} />
          <div className="flex flex-wrap items-center gap-3">
            <Button type="submit" variant="secondary" disabled={pending}>
              {state === null || state === "draft" || state === "sent_back" ? "Save draft" : "Save changes"}
            </Button>
            {canSubmit ? (
              <Button type="button" disabled={pending || blockers.length > 0} onClick={() => save("submit")} aria-describedby="submit-blockers">
                Submit for review
              </Button>
            ) : null}
          </div>
          {canSubmit && blockers.length > 0 ? (
            <ul id="submit-blockers" className="list-disc space-y-1 pl-5 text-sm text-graphite-700" data-testid="submit-blockers">
              {blockers.map((b) => (
                <li key={b}>{b}</li>
              ))}
            </ul>
          ) : null}
          {state === "live" ? (
            <p className="text-sm text-graphite-600">
              Price, stock and photos change at once. A change to the safety sheet or the figures sends the listing back to review.
            </p>
          ) : null}
        </div>
      </div>
      <aside aria-label="Live safety check" className="min-w-0 lg:sticky lg:top-4 lg:self-start">
        <LiveCheckPanel state={check} />
      </aside>
    </form>
  );
}
