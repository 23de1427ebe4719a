import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { auditFor, outboxTo, sessionUser, setupModerationDb, type ModerationTestDb } from "./setup";

let t: ModerationTestDb;

async function apply(userId: string, shopName: string, minutesAgo = 60): Promise<string> {
  const { rows } = await t.pool.query(
    `insert into seller_applications (user_id, shop_name, profile_md, country, returns_policy_md, created_at)
     values ($1, $2, $3, 'PT', $4, now() - make_interval(mins => $5)) returning id`,
    [userId, shopName, "I wind **toroidal chokes** for induction heaters.", "Unused parts back within 30 days, buyer pays postage.", minutesAgo],
  );
  return rows[0].id;
}

async function addMember(id: string, email: string, name: string): Promise<void> {
  await t.pool.query("insert into users (id, email, name) values ($1, $2, $3)", [id, email, name]);
  await t.pool.query("insert into user_roles (user_id, role) values ($1, 'member')", [id]);
}

async function roles(userId: string): Promise<string[]> {
  const { rows } = await t.pool.query("select role from user_roles where user_id = $1 order by role", [userId]);
  return rows.map((r) => r.role);
}

async function profile(userId: string): Promise<{ shop_name: string; slug: string; country: string } | undefined> {
  const { rows } = await t.pool.query("select shop_name, slug, country from seller_profiles where user_id = $1", [userId]);
  return rows[0];
}

beforeAll(async () => {
  t = await setupModerationDb("moderation_applications");
  await addMember("applicant-a", "maren.coils@larkspur.test", "Maren Coils");
  await addMember("applicant-b", "ilse.cores@larkspur.test", "Ilse Cores");
  await addMember("applicant-c", "jory.ferrite@larkspur.test", "Jory Ferrite");
});
afterAll(async () => {
  await t.teardown();
});

describe("seller applications", () => {
  it("lists pending applications oldest first", async () => {
    const newer = await apply("applicant-b", "Ilse's Core Room", 10);
    const older = await apply("applicant-a", "Tidewater Coil & Core", 120);
    const { pendingApplications } = await import("@/db/queries/seller-applications");
    const pending = await pendingApplications();
    expect(pending.map((a) => a.id)).toEqual([older, newer]);
    expect(pending[0]).toMatchObject({ applicantEmail: "maren.coils@larkspur.test", shopName: "Tidewater Coil & Core" });
  });

  it("a member or a seller cannot decide applications (403), and nothing changes", async () => {
    const { approveApplication, declineApplication, ApplicationError, pendingApplications } = await import("@/db/queries/seller-applications");
    const [first] = await pendingApplications();
    for (const id of ["demo-builder", "demo-seller-kits", "demo-reviewer"]) {
      const actor = await sessionUser(id);
      await expect(approveApplication({ actor, applicationId: first!.id })).rejects.toMatchObject({ status: 403 });
      await expect(declineApplication({ actor, applicationId: first!.id, reason: "No thank you." })).rejects.toBeInstanceOf(ApplicationError);
    }
    expect(await roles("applicant-a")).toEqual(["member"]);
    expect(await profile("applicant-a")).toBeUndefined();
    expect(await auditFor(t.pool, first!.id)).toEqual([]);
  });

  it("approving grants the seller role, opens the shop with a slug from its name, audits and e-mails the applicant", async () => {
    const { approveApplication, pendingApplications } = await import("@/db/queries/seller-applications");
    const application = (await pendingApplications()).find((a) => a.userId === "applicant-a")!;
    expect(await approveApplication({ actor: await sessionUser("demo-moderator"), applicationId: application.id })).toEqual({ slug: "tidewater-coil-core" });
    expect(await roles("applicant-a")).toEqual(["member", "seller"]);
    expect(await profile("applicant-a")).toEqual({ shop_name: "Tidewater Coil & Core", slug: "tidewater-coil-core", country: "PT" });
    const { rows } = await t.pool.query("select status, decided_by from seller_applications where id = $1", [application.id]);
    expect(rows[0]).toEqual({ status: "approved", decided_by: "demo-moderator" });
    expect(await auditFor(t.pool, application.id)).toMatchObject([{ actor_id: "demo-moderator", action: "seller.approved", details: { userId: "applicant-a" } }]);
    expect(await outboxTo(t.pool, "maren.coils@larkspur.test")).toMatchObject([{ template: "seller-approved", props: { shopName: "Tidewater Coil & Core" } }]);
  });

  it("a second decision on the same application is a 409", async () => {
    const { approveApplication, declineApplication } = await import("@/db/queries/seller-applications");
    const { rows } = await t.pool.query("select id from seller_applications where user_id = 'applicant-a'");
    const actor = await sessionUser("demo-admin");
    await expect(approveApplication({ actor, applicationId: rows[0].id })).rejects.toMatchObject({ status: 409 });
    await expect(declineApplication({ actor, applicationId: rows[0].id, reason: "Changed my mind." })).rejects.toMatchObject({ status: 409 });
  });

  it("a shop whose name makes the same slug gets a numbered one", async () => {
    const { approveApplication } = await import("@/db/queries/seller-applications");
    const id = await apply("applicant-c", "Tidewater Coil Core");
    expect(await approveApplication({ actor: await sessionUser("demo-admin"), applicationId: id })).toEqual({ slug: "tidewater-coil-core-2" });
  });

  it("declining needs a reason, grants nothing, audits with the reason and e-mails it", async () => {
    const { declineApplication, pendingApplications } = await import("@/db/queries/seller-applications");
    const application = (await pendingApplications()).find((a) => a.userId === "applicant-b")!;
    const moderator = await sessionUser("demo-moderator");
    await expect(declineApplication({ actor: moderator, applicationId: application.id, reason: " " })).rejects.toMatchObject({ status: 422 });
    await declineApplication({ actor: moderator, applicationId: application.id, reason: "Please describe the returns policy for wound parts." });
    expect(await roles("applicant-b")).toEqual(["member"]);
    expect(await profile("applicant-b")).toBeUndefined();
    const { rows } = await t.pool.query("select status, decision_reason from seller_applications where id = $1", [application.id]);
    expect(rows[0]).toEqual({ status: "declined", decision_reason: "Please describe the returns policy for wound parts." });
    expect(await auditFor(t.pool, application.id)).toMatchObject([
      { actor_id: "demo-moderator", action: "seller.declined", reason: "Please describe the returns policy for wound parts." },
    ]);
    expect(await outboxTo(t.pool, "ilse.cores@larkspur.test")).toMatchObject([
      { template: "seller-declined", props: { reason: "Please describe the returns policy for wound parts." } },
    ]);
  });

  it("nobody decides their own application", async () => {
    const { approveApplication } = await import("@/db/queries/seller-applications");
    const id = await apply("demo-moderator", "Marchetti Test Bench");
    await expect(approveApplication({ actor: await sessionUser("demo-moderator"), applicationId: id })).rejects.toMatchObject({ status: 403 });
    expect(await roles("demo-moderator")).not.toContain("seller");
  });

  it("an unknown application is a 404", async () => {
    const { approveApplication } = await import("@/db/queries/seller-applications");
    const actor = await sessionUser("demo-moderator");
    await expect(approveApplication({ actor, applicationId: "00000000-0000-4000-8000-000000000000" })).rejects.toMatchObject({ status: 404 });
    await expect(approveApplication({ actor, applicationId: "nope" })).rejects.toMatchObject({ status: 404 });
  });
});
