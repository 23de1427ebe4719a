// Becoming a seller: one pending application at a time, with its audit entry and the applicant's
// e-mail in the outbox; and a shop for a person who was given the seller role directly.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { setupSellingDb, type SellingDb } from "./setup";

let t: SellingDb;

beforeAll(async () => {
  t = await setupSellingDb("selling_applications");
});

afterAll(async () => {
  await t?.teardown();
});

const fields = {
  shopName: "Noor's Coil Corner",
  profileMd: "I rewind **output chokes** for small inverter welders.",
  country: "PT" as const,
  returnsPolicyMd: "Unused parts come back within 30 days for a refund.",
  returnsWindowDays: 30,
};

describe("createApplication", () => {
  it("records a pending application, an audit entry and the applicant's e-mail", async () => {
    const { createApplication, latestApplication } = await import("@/db/queries/sellers");
    const application = await createApplication("demo-builder", fields);
    expect(application).toMatchObject({ status: "pending", shopName: fields.shopName, country: "PT" });
    expect((await latestApplication("demo-builder"))?.id).toBe(application.id);
    const audit = await t.pool.query("select actor_id, action from audit_log where subject_id = $1", [application.id]);
    expect(audit.rows).toEqual([{ actor_id: "demo-builder", action: "seller_application.submitted" }]);
    const mail = await t.pool.query(`select template from mail_outbox where "to" = 'noor.builds@larkspur.test'`);
    expect(mail.rows.map((r) => r.template)).toContain("seller-application-received");
  });

  it("refuses a second one while the first is pending, even when both arrive at once", async () => {
    const { createApplication, SellerError } = await import("@/db/queries/sellers");
    const again = await createApplication("demo-builder", { ...fields, shopName: "Another name" }).catch((e: unknown) => e);
    expect(again).toBeInstanceOf(SellerError);
    expect((again as InstanceType<typeof SellerError>).status).toBe(409);

    const racing = await Promise.allSettled([
      createApplication("demo-reviewer", { ...fields, shopName: "Review Bench" }),
      createApplication("demo-reviewer", { ...fields, shopName: "Review Bench Two" }),
    ]);
    expect(racing.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    const { rows } = await t.pool.query("select count(*)::int as n from seller_applications where user_id = 'demo-reviewer'");
    expect(rows[0].n).toBe(1);
  });

  it("takes a new application once the last one was declined", async () => {
    const { createApplication, latestApplication } = await import("@/db/queries/sellers");
    await t.pool.query("update seller_applications set status = 'declined', decision_reason = 'Name too close to another shop' where user_id = 'demo-builder'");
    const declined = await latestApplication("demo-builder");
    expect(declined).toMatchObject({ status: "declined", decisionReason: "Name too close to another shop" });
    const fresh = await createApplication("demo-builder", { ...fields, shopName: "Corner Coils" });
    expect((await latestApplication("demo-builder"))?.id).toBe(fresh.id);
  });
});

describe("openShopForSeller", () => {
  it("opens a shop with a slug of its own, and refuses a name another shop has (in any case)", async () => {
    const { openShopForSeller, getSellerProfile, createApplication, SellerError } = await import("@/db/queries/sellers");
    const shop = await openShopForSeller("demo-admin", { ...fields, shopName: "Yard Office Spares" });
    expect(shop.slug).toBe("yard-office-spares");
    expect((await getSellerProfile("demo-admin"))?.shopName).toBe("Yard Office Spares");

    const clash = await openShopForSeller("demo-moderator", { ...fields, shopName: "YARD office SPARES" }).catch((e: unknown) => e);
    expect(clash).toBeInstanceOf(SellerError);
    expect((clash as InstanceType<typeof SellerError>).field).toBe("shopName");

    const twin = await openShopForSeller("demo-moderator", { ...fields, shopName: "Yard Office Spares!" });
    expect(twin.slug).toBe("yard-office-spares-2");

    // A person with a shop cannot open a second one, nor apply again.
    await expect(openShopForSeller("demo-admin", { ...fields, shopName: "Second Spares" })).rejects.toBeInstanceOf(SellerError);
    const apply = await createApplication("demo-admin", { ...fields, shopName: "Yet another" }).catch((e: unknown) => e);
    expect((apply as InstanceType<typeof SellerError>).status).toBe(409);
  });
});
