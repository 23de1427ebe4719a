"use server";

import { revalidatePath } from "next/cache";
import { addCheckpoint, recordReading, setVisibility } from "@/db/queries/bench";
import { benchFailure, invalidForm } from "@/lib/bench/action-failure";
import { formatReading } from "@/components/bench/format";
import { requireUser } from "@/lib/auth/guard";
import { builderCheckpointSchema, readingSchema, visibilitySchema, type BenchFormResult } from "@/lib/validations/bench";

// The owner's changes to a log, bound to its id on the page; the queries check ownership again.

function revalidateLog(logId: string) {
  revalidatePath("/bench");
  revalidatePath(`/bench/logs/${logId}`);
}

const VERDICT_WORDS = { within: "within the expected range", low: "below the expected range", high: "above the expected range" } as const;

export async function recordReadingAction(logId: string, raw: unknown): Promise<BenchFormResult> {
  let message: string;
  let outsideRange = false;
  try {
    const user = await requireUser();
    const parsed = readingSchema.safeParse(raw);
    if (!parsed.success) return invalidForm(parsed.error);
    const recorded = await recordReading(user, logId, parsed.data);
    const far = recorded.farOutside ? ", far outside it: read the caution beside the reading before you go on" : "";
    outsideRange = recorded.verdict !== "within";
    message = `Recorded ${formatReading(recorded.value, recorded.unit)}: ${VERDICT_WORDS[recorded.verdict]}${far}.`;
  } catch (error) {
    return benchFailure(error, "record-reading");
  }
  revalidateLog(logId);
  return { ok: true, message, outsideRange };
}

export async function addCheckpointAction(logId: string, raw: unknown): Promise<BenchFormResult> {
  try {
    const user = await requireUser();
    const parsed = builderCheckpointSchema.safeParse(raw);
    if (!parsed.success) return invalidForm(parsed.error);
    await addCheckpoint(user, logId, parsed.data);
  } catch (error) {
    return benchFailure(error, "add-checkpoint");
  }
  revalidateLog(logId);
  return { ok: true, message: "Checkpoint added to its stage." };
}

export async function setVisibilityAction(logId: string, raw: unknown): Promise<BenchFormResult> {
  let visibility: "private" | "public";
  try {
    const user = await requireUser();
    const parsed = visibilitySchema.safeParse(raw);
    if (!parsed.success) return invalidForm(parsed.error);
    visibility = parsed.data;
    await setVisibility(user, logId, visibility);
  } catch (error) {
    return benchFailure(error, "set-visibility");
  }
  revalidateLog(logId);
  return { ok: true, message: visibility === "public" ? "The log is public now." : "The log is private again." };
}
