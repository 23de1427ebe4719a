"use client";

import { useCallback, useEffect, useRef, useState } from "react";
import { refuseDeclaredFile, type UploadRouteName } from "@/lib/uploads/limits";
import type { UploadServerData } from "@/lib/uploads/process-upload";
import { uploadOneFile } from "./upload-client";

export type AcceptedUpload = Extract<UploadServerData, { ok: true }>;
export type PendingUpload = { id: string; name: string; progress: number; phase: "uploading" | "checking" };
export type UploadProblem = { id: string; message: string };

let nextId = 0;
const newId = () => `upload-${++nextId}`;

/**
 * Files on their way up: per-file progress, then the server's verdict. Accepted files go to
 * `onAccepted` (the uploader adds them to its value); refusals stay listed until dismissed.
 */
export function useUploadQueue({ endpoint, onAccepted }: { endpoint: UploadRouteName; onAccepted: (upload: AcceptedUpload) => void }) {
  const [pending, setPending] = useState<PendingUpload[]>([]);
  const [problems, setProblems] = useState<UploadProblem[]>([]);
  const accepted = useRef(onAccepted);
  const abort = useRef<AbortController | null>(null);

  useEffect(() => {
    accepted.current = onAccepted;
  });
  useEffect(() => {
    const controller = new AbortController();
    abort.current = controller;
    return () => controller.abort();
  }, []);

  const refuse = useCallback((messages: readonly string[]) => {
    if (messages.length > 0) setProblems((list) => [...list, ...messages.map((message) => ({ id: newId(), message }))]);
  }, []);

  const upload = useCallback(
    (files: readonly File[]) => {
      const refusals: string[] = [];
      for (const file of files) {
        // The same limits the route applies, so an obvious refusal costs no upload.
        const refusal = refuseDeclaredFile(endpoint, file);
        if (refusal) {
          refusals.push(refusal);
          continue;
        }
        const id = newId();
        setPending((list) => [...list, { id, name: file.name, progress: 0, phase: "uploading" }]);
        const signal = abort.current?.signal;
        void uploadOneFile(endpoint, file, {
          signal,
          onProgress: (percent) =>
            setPending((list) =>
              list.map((p) => (p.id === id ? { ...p, progress: percent, phase: percent >= 100 ? "checking" : "uploading" } : p)),
            ),
        }).then((result) => {
          if (signal?.aborted) return;
          setPending((list) => list.filter((p) => p.id !== id));
          if (result.ok) accepted.current(result);
          else setProblems((list) => [...list, { id, message: result.message }]);
        });
      }
      refuse(refusals);
    },
    [endpoint, refuse],
  );

  const dismiss = useCallback((id: string) => setProblems((list) => list.filter((p) => p.id !== id)), []);

  return { pending, problems, upload, refuse, dismiss };
}
