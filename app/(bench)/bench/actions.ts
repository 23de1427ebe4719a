"use server";

import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import { createLog } from "@/db/queries/bench";
import { benchFailure, invalidForm } from "@/lib/bench/action-failure";
import { requireUser } from "@/lib/auth/guard";
import { createLogSchema, type BenchFormResult } from "@/lib/validations/bench";

/** Starts a log (copying the kit's checkpoints) and opens it. */
export async function createLogAction(raw: unknown): Promise<BenchFormResult> {
  let id: string;
  try {
    const user = await requireUser();
    const parsed = createLogSchema.safeParse(raw);
    if (!parsed.success) return invalidForm(parsed.error);
    id = (await createLog(user.id, parsed.data)).id;
  } catch (error) {
    return benchFailure(error, "create-log");
  }
  revalidatePath("/bench");
  redirect(`/bench/logs/${id}`);
}
