import "server-only";
import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { auditLog, policyRevisions } from "@/db/schema";
import { currentPolicyRevision } from "@/db/queries/policy";
import { hasRole, type SessionUser } from "@/lib/auth/access";
import { fieldErrorsFromZod, type FieldErrors } from "@/lib/http/json";
import { QUEUES } from "@/lib/jobs/queues";
import { sendJob } from "@/lib/jobs/boss";
import { CURRENT_POLICY_REVISION, SAFETY_TOPIC_KEYS, type PolicyRevision } from "@/lib/policy";
import { policyRevisionSchema } from "@/lib/validations/policy";
import { publishPolicySchema, type PublishPolicyInput } from "@/lib/validations/moderation";

export type PublishOutcome =
  | { ok: true; revision: number }
  | { ok: false; status: 403 | 422; message: string; fieldErrors: FieldErrors };

/** The next revision's rules: the current ones with the admin's figures put in. */
export function buildRevision(current: PolicyRevision, input: PublishPolicyInput, revision: number, publishedAt: Date): PolicyRevision {
  return {
    ...current,
    revision,
    publishedAt: publishedAt.toISOString(),
    summary: input.summary,
    minWords: input.minWords,
    safeVoltageV: input.safeVoltageV,
    // Typed in µC; divided rather than multiplied by 1e-6, so 45 µC is stored as exactly 4.5e-5.
    storedChargeThresholdC: input.storedChargeThresholdMicroC / 1e6,
    waitMarginFactor: input.waitMarginFactor,
    topicRules: current.topicRules.map(({ minWords: _old, ...rule }) => {
      const override = input.topicMinWords[rule.topic];
      return override === undefined ? rule : { ...rule, minWords: override };
    }),
  };
}

/** Per-topic minimum words of a revision, for pre-filling the form ("" where the general minimum applies). */
export function topicMinWordsOf(revision: PolicyRevision): Record<(typeof SAFETY_TOPIC_KEYS)[number], number | undefined> {
  return Object.fromEntries(
    SAFETY_TOPIC_KEYS.map((topic) => {
      const values = revision.topicRules.filter((r) => r.topic === topic && r.minWords !== undefined).map((r) => r.minWords!);
      return [topic, values.length ? Math.max(...values) : undefined];
    }),
  ) as Record<(typeof SAFETY_TOPIC_KEYS)[number], number | undefined>;
}

/**
 * Publishes a policy revision (admins only): validated, numbered one above the newest, stored with
 * its audit entry in one transaction; then the re-check of every live listing is queued.
 */
export async function publishPolicyRevision(actor: SessionUser, raw: unknown): Promise<PublishOutcome> {
  if (!hasRole(actor, "admin")) return { ok: false, status: 403, message: "Only an admin publishes policy revisions.", fieldErrors: {} };
  const parsed = publishPolicySchema.safeParse(raw);
  if (!parsed.success) {
    return { ok: false, status: 422, message: "Some figures are missing or out of range.", fieldErrors: fieldErrorsFromZod(parsed.error) };
  }
  const input = parsed.data;
  const revision = await db.transaction(async (tx) => {
    // Two admins publishing at once must not both take the same number.
    await tx.execute(sql`select pg_advisory_xact_lock(hashtext('policy_revisions.publish'))`);
    const current = await currentPolicyRevision(tx);
    const [row] = await tx.select({ max: sql<number | null>`max(${policyRevisions.revision})` }).from(policyRevisions);
    const number = Math.max(row?.max ?? 0, CURRENT_POLICY_REVISION.revision, current.revision) + 1;
    const rules = policyRevisionSchema.parse(buildRevision(current, input, number, new Date()));
    await tx.insert(policyRevisions).values({ revision: number, rules, summary: input.summary, graceDays: input.graceDays, publishedBy: actor.id });
    await tx.insert(auditLog).values({
      actorId: actor.id,
      action: "policy.published",
      subjectType: "policy_revision",
      subjectId: String(number),
      reason: input.summary,
      details: {
        previous: current.revision,
        minWords: rules.minWords,
        safeVoltageV: rules.safeVoltageV,
        storedChargeThresholdC: rules.storedChargeThresholdC,
        waitMarginFactor: rules.waitMarginFactor,
        topicMinWords: Object.fromEntries(Object.entries(input.topicMinWords).filter(([, v]) => v !== undefined)),
        graceDays: input.graceDays,
      },
    });
    return number;
  });
  await sendJob(QUEUES.policyRecheck, { revision }, { singletonKey: `policy-recheck-${revision}` });
  return { ok: true, revision };
}
