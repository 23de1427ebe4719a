import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import type { SessionUser } from "@/lib/auth/access";
import { auditActions, MODERATOR, outbox, startWorld, type World } from "./world";

vi.mock("@/lib/jobs/boss", () => ({ sendJob: async () => {} }));

// Vetting reviewers (issue 6: "a moderator vets and approves (reviewer role, audit entry). Reviewers
// connect a payout account like sellers do") against the real PostgreSQL and the payments fake.

let world: World;

beforeAll(async () => {
  world = await startWorld("reviews_applications");
});

afterAll(async () => {
  await world?.close();
});

async function member(id: string): Promise<SessionUser> {
  const email = `${id}@example.test`;
  await world.pool.query("insert into users (id, email, name) values ($1, $2, $3)", [id, email, `Member ${id}`]);
  return { id, email, name: `Member ${id}`, roles: ["member"] };
}

const application = {
  expertise: ["welding-inverters", "magnetics"] as ("welding-inverters" | "magnetics")[],
  profileMd: "I have wound and brought up half-bridge welders for years, and I read scope captures for a living.",
  trackRecordMd: "Six stick welders from 120 A to 200 A brought up through a series lamp, two induction heaters, and a bench supply that taught me to respect the bus.",
  priceMinor: 3_950,
};

async function roles(userId: string): Promise<string[]> {
  const { rows } = await world.pool.query("select role::text from user_roles where user_id = $1 order by role", [userId]);
  return rows.map((r) => r.role);
}

describe("reviewer applications", () => {
  it("a member applies once; a moderator approves: reviewer role, profile, audit entries and both e-mails", async () => {
    const { createReviewerApplication, approveReviewerApplication, pendingReviewerApplications, getReviewerProfile } = await import("@/db/queries/reviews");
    const applicant = await member("applicant-one");
    const created = await createReviewerApplication(applicant.id, application);
    await expect(createReviewerApplication(applicant.id, application)).rejects.toMatchObject({ status: 409 });
    expect((await pendingReviewerApplications()).map((a) => a.id)).toContain(created.id);
    expect((await outbox(world, "reviewer-application-received", applicant.email!)).length).toBe(1);

    // Nobody without the moderator role decides, and nobody decides their own.
    await expect(approveReviewerApplication({ actor: applicant, applicationId: created.id })).rejects.toMatchObject({ status: 403 });
    await expect(approveReviewerApplication({ actor: { ...applicant, roles: ["moderator"] }, applicationId: created.id })).rejects.toMatchObject({ status: 403 });
    expect(await roles(applicant.id)).not.toContain("reviewer");

    await approveReviewerApplication({ actor: MODERATOR, applicationId: created.id });
    expect(await roles(applicant.id)).toContain("reviewer");
    expect(await getReviewerProfile(applicant.id)).toMatchObject({ expertise: ["welding-inverters", "magnetics"], priceMinor: 3_950, currency: "EUR", payoutAccountId: null, payoutsEnabled: false });
    expect(await auditActions(world, created.id)).toEqual(["reviewer_application.submitted", "reviewer.approved"]);
    expect((await outbox(world, "reviewer-approved", applicant.email!)).length).toBe(1);
    await expect(approveReviewerApplication({ actor: MODERATOR, applicationId: created.id })).rejects.toMatchObject({ status: 409 });
    // With a profile there is nothing more to apply for.
    await expect(createReviewerApplication(applicant.id, application)).rejects.toMatchObject({ status: 409 });
  });

  it("a moderator declines with a reason the applicant reads; no role is granted", async () => {
    const { createReviewerApplication, declineReviewerApplication, latestReviewerApplication } = await import("@/db/queries/reviews");
    const applicant = await member("applicant-two");
    const created = await createReviewerApplication(applicant.id, application);
    await expect(declineReviewerApplication({ actor: MODERATOR, applicationId: created.id, reason: " " })).rejects.toMatchObject({ status: 422 });
    await declineReviewerApplication({ actor: MODERATOR, applicationId: created.id, reason: "Please show a bring-up log or two here first." });
    expect(await latestReviewerApplication(applicant.id)).toMatchObject({ status: "declined", decisionReason: "Please show a bring-up log or two here first.", decidedBy: MODERATOR.id });
    expect(await roles(applicant.id)).not.toContain("reviewer");
    const { rows } = await world.pool.query("select action, reason from audit_log where subject_id = $1 order by id", [created.id]);
    expect(rows.at(-1)).toEqual({ action: "reviewer.declined", reason: "Please show a bring-up log or two here first." });
    expect((await outbox(world, "reviewer-declined", applicant.email!)).at(-1)?.props).toMatchObject({ reason: "Please show a bring-up log or two here first." });
    // After a decline the member may apply again.
    await expect(createReviewerApplication(applicant.id, application)).resolves.toMatchObject({ status: "pending" });
  });
});

describe("payout account", () => {
  it("an approved reviewer connects a payout account; once onboarded they are bookable", async () => {
    const { createReviewerApplication, approveReviewerApplication, availableReviewers, getReviewerProfile } = await import("@/db/queries/reviews");
    const { startReviewerPayoutOnboarding, refreshReviewerPayoutStatus } = await import("@/lib/reviews/payouts");
    const applicant = await member("applicant-three");
    const created = await createReviewerApplication(applicant.id, application);
    await approveReviewerApplication({ actor: MODERATOR, applicationId: created.id });
    expect((await availableReviewers()).map((r) => r.userId)).not.toContain(applicant.id);

    const link = await startReviewerPayoutOnboarding(applicant);
    expect(link).toMatch(/\/onboarding\//);
    const accountId = (await getReviewerProfile(applicant.id))?.payoutAccountId;
    expect(accountId).toMatch(/^acct_/);
    // A second click keeps the same account.
    await startReviewerPayoutOnboarding(applicant);
    expect((await getReviewerProfile(applicant.id))?.payoutAccountId).toBe(accountId);
    expect(await refreshReviewerPayoutStatus(applicant.id)).toEqual({ payoutAccountId: accountId, payoutsEnabled: false });

    await fetch(`${world.fake.url}/api/test/complete-onboarding`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ account: accountId }) });
    expect(await refreshReviewerPayoutStatus(applicant.id)).toEqual({ payoutAccountId: accountId, payoutsEnabled: true });
    const listed = (await availableReviewers()).find((r) => r.userId === applicant.id);
    expect(listed).toMatchObject({ name: "Member applicant-three", priceMinor: 3_950, expertise: ["welding-inverters", "magnetics"] });
  });
});
