"use client";

import { useActionState, useState } from "react";
import { Button } from "@/components/ui/button";
import { SelectField, TextArea, TextField } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import { PhotoUploader, type PhotoValue } from "@/components/uploads/photo-uploader";
import type { FormResult } from "@/lib/validations/auth";
import { MAX_POST_PHOTOS, POST_BODY_MAX, QUESTION_TITLE_MAX } from "@/lib/validations/qa-limits";
import { fieldError, MARKDOWN_HINT, type QaFormAction } from "./form-helpers";

export type AskQuestionFormProps = {
  action: QaFormAction;
  listings: readonly { id: string; title: string }[];
  logs: readonly { id: string; title: string; visibility: "private" | "public" }[];
  defaultListingId?: string;
};

/** Title, Markdown text, what it is about (a listing or the general bench), an optional log of one's own, photos. */
export function AskQuestionForm({ action, listings, logs, defaultListingId }: AskQuestionFormProps) {
  const [state, formAction, pending] = useActionState(action, null);
  // Controlled, so a refused submit keeps what was typed.
  const [title, setTitle] = useState("");
  const [bodyMd, setBodyMd] = useState("");
  const [listingId, setListingId] = useState(defaultListingId ?? "");
  const [logId, setLogId] = useState("");
  const [photos, setPhotos] = useState<PhotoValue[]>([]);
  return (
    <form action={formAction} className="max-w-reading space-y-5" aria-label="Ask a question" data-testid="ask-form">
      <TextField
        name="title"
        label="Question"
        hint="One line that says what you are stuck on, e.g. “Bus reads 20 V low through the series lamp”."
        required
        maxLength={QUESTION_TITLE_MAX}
        value={title}
        onChange={(e) => setTitle(e.target.value)}
        error={fieldError(state, "title")}
      />
      <TextArea
        name="bodyMd"
        label="Details"
        hint={MARKDOWN_HINT}
        rows={10}
        required
        maxLength={POST_BODY_MAX}
        value={bodyMd}
        onChange={(e) => setBodyMd(e.target.value)}
        error={fieldError(state, "bodyMd")}
      />
      <SelectField
        name="listingId"
        label="About"
        hint="A listing from the catalog, or the general bench for anything else."
        placeholder="The general bench"
        value={listingId}
        onChange={(e) => setListingId(e.target.value)}
        options={listings.map((l) => ({ value: l.id, label: l.title }))}
        error={fieldError(state, "listingId")}
      />
      {logs.length > 0 ? (
        <SelectField
          name="logId"
          label="Bring-up log (optional)"
          hint="Readers see a link to the log only while you have made it public."
          placeholder="No log"
          value={logId}
          onChange={(e) => setLogId(e.target.value)}
          options={logs.map((l) => ({ value: l.id, label: `${l.title}${l.visibility === "private" ? " (private)" : ""}` }))}
          error={fieldError(state, "logId")}
        />
      ) : null}
      <PhotoUploader value={photos} onChange={setPhotos} endpoint="readingPhoto" max={MAX_POST_PHOTOS} label="Photos" name="photos" error={fieldError(state, "photos")} />
      <FormMessage tone={state && !state.ok ? "error" : "info"} message={state && !state.ok ? state.message : undefined} />
      <Button type="submit" disabled={pending}>
        {pending ? "Posting…" : "Post the question"}
      </Button>
    </form>
  );
}
