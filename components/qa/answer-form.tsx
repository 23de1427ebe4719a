"use client";

import { useActionState, useState } from "react";
import { Button } from "@/components/ui/button";
import { TextArea } from "@/components/ui/field";
import { FormMessage } from "@/components/ui/form-message";
import { PhotoUploader, type PhotoValue } from "@/components/uploads/photo-uploader";
import { MAX_POST_PHOTOS, POST_BODY_MAX } from "@/lib/validations/qa-limits";
import { fieldError, MARKDOWN_HINT, type QaFormAction } from "./form-helpers";

export function AnswerForm({ action }: { action: QaFormAction }) {
  const [state, formAction, pending] = useActionState(action, null);
  const [bodyMd, setBodyMd] = useState("");
  const [photos, setPhotos] = useState<PhotoValue[]>([]);
  return (
    <form action={formAction} className="max-w-reading space-y-4" aria-label="Answer this question" data-testid="answer-form">
      <TextArea
        name="bodyMd"
        label="Your answer"
        hint={MARKDOWN_HINT}
        rows={8}
        required
        maxLength={POST_BODY_MAX}
        value={bodyMd}
        onChange={(e) => setBodyMd(e.target.value)}
        error={fieldError(state, "bodyMd")}
      />
      <PhotoUploader value={photos} onChange={setPhotos} endpoint="readingPhoto" max={MAX_POST_PHOTOS} label="Photos for your answer" name="photos" error={fieldError(state, "photos")} />
      <FormMessage tone={state && !state.ok ? "error" : "info"} message={state && !state.ok ? state.message : undefined} />
      <Button type="submit" disabled={pending}>
        {pending ? "Posting…" : "Post the answer"}
      </Button>
    </form>
  );
}
