import "server-only";
import { desc, eq } from "drizzle-orm";
import { db, type Executor } from "@/db/client";
import { policyRevisions } from "@/db/schema";
import { CURRENT_POLICY_REVISION, getPolicyRevision, type PolicyRevision } from "@/lib/policy";

/** The revision in force: the newest one an admin published, else the built-in current one. */
export async function currentPolicyRevision(executor: Executor = db): Promise<PolicyRevision> {
  const [row] = await executor.select({ rules: policyRevisions.rules }).from(policyRevisions).orderBy(desc(policyRevisions.revision)).limit(1);
  return row && row.rules.revision >= CURRENT_POLICY_REVISION.revision ? row.rules : CURRENT_POLICY_REVISION;
}

export async function policyRevisionByNumber(revision: number, executor: Executor = db): Promise<PolicyRevision | undefined> {
  const [row] = await executor.select({ rules: policyRevisions.rules }).from(policyRevisions).where(eq(policyRevisions.revision, revision));
  return row?.rules ?? getPolicyRevision(revision);
}
