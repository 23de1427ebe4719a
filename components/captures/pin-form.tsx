"use client";

import { useId, useState, useTransition, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { SelectField, TextArea, TextField } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import type { CaptureActionResult } from "@/lib/captures/action-schemas";
import { MAX_PIN_BODY } from "@/lib/captures/pin-rules";

export type PinFormProps = {
  captureId: string;
  channels: readonly { index: number; name: string }[];
  /** the time field's text; the viewer fills it when the reviewer clicks the trace */
  time: string;
  onTimeChange: (text: string) => void;
  pin: (input: unknown) => Promise<CaptureActionResult>;
  onPinned: () => void;
};

/** The reviewer's comment at a time on the trace (and, if it is about one, a channel). */
export function PinForm({ captureId, channels, time, onTimeChange, pin, onPinned }: PinFormProps) {
  const id = useId();
  const [channel, setChannel] = useState("");
  const [body, setBody] = useState("");
  const [result, setResult] = useState<CaptureActionResult | null>(null);
  const [pending, startTransition] = useTransition();
  const errors = result && !result.ok ? result.fieldErrors : {};

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    startTransition(async () => {
      const answer = await pin({ captureId, time, channel, body });
      setResult(answer);
      if (answer.ok) {
        setBody("");
        onPinned();
      }
    });
  };

  return (
    <form onSubmit={submit} noValidate aria-label="Pin a comment to the trace" className="space-y-3" data-testid="pin-form">
      <div className="grid gap-3 sm:grid-cols-2">
        <TextField
          id={`${id}-time`}
          label="Time on the trace"
          hint="Click the trace to choose it, or type it, e.g. 12.5 µs."
          className="figure font-mono"
          value={time}
          onChange={(event) => onTimeChange(event.currentTarget.value)}
          error={errors.time}
          autoComplete="off"
          required
        />
        <SelectField
          id={`${id}-channel`}
          label="About the channel"
          value={channel}
          onChange={(event) => setChannel(event.currentTarget.value)}
          options={[{ value: "", label: "All channels" }, ...channels.map((c) => ({ value: String(c.index), label: c.name }))]}
          error={errors.channel}
        />
      </div>
      <TextArea
        id={`${id}-body`}
        label="Comment"
        hint={`What you see at this point of the trace; at most ${MAX_PIN_BODY} characters, shown as plain text.`}
        rows={3}
        maxLength={MAX_PIN_BODY}
        value={body}
        onChange={(event) => setBody(event.currentTarget.value)}
        error={errors.body}
        required
      />
      <div data-testid="pin-form-result">
        <FormMessage tone={result?.ok ? "success" : "error"} message={result?.message} />
      </div>
      <Button type="submit" disabled={pending}>
        {pending ? "Pinning…" : "Pin the comment"}
      </Button>
    </form>
  );
}
