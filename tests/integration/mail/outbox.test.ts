import { afterAll, beforeAll, describe, expect, it } from "vitest";
import pg from "pg";
import { startMailFake } from "@/fakes/mail/server";
import { freshDatabase } from "../../support/test-database";

// The outbox delivers through the real resend SDK to the mail fake; an outage must lose nothing
// and a retry must never send a message twice.
let database: Awaited<ReturnType<typeof freshDatabase>>;
let mail: Awaited<ReturnType<typeof startMailFake>>;
let pool: pg.Pool;

async function outboxMessages(): Promise<{ id: string; subject: string; to: string[] }[]> {
  return (await fetch(`${mail.url}/api/messages`)).json();
}

beforeAll(async () => {
  database = await freshDatabase("outbox");
  mail = await startMailFake({ port: 0 });
  process.env.DATABASE_URL = database.url;
  process.env.RESEND_BASE_URL = mail.url;
  pool = new pg.Pool({ connectionString: database.url });
});

afterAll(async () => {
  const { closeDb } = await import("@/db/client");
  await closeDb();
  await pool.end();
  await mail.close();
  await database.drop();
});

describe("mail outbox", () => {
  it("a queued message is delivered once, even when delivery runs twice", async () => {
    const { db } = await import("@/db/client");
    const { enqueueMail, deliverMail } = await import("@/lib/mail/outbox");
    const { listingApprovedMail } = await import("@/emails/listings/listing-approved");
    const id = await db.transaction((tx) =>
      enqueueMail(tx, {
        template: listingApprovedMail,
        to: "idunn.winds@larkspur.test",
        props: { sellerName: "Idunn", listingTitle: "EE55 output choke", listingUrl: "http://localhost:3000/sell/listings/x" },
      }),
    );
    expect(await deliverMail(id)).toBe("sent");
    expect(await deliverMail(id)).toBe("already-sent");
    const sent = (await outboxMessages()).filter((m) => m.subject.includes("EE55 output choke"));
    expect(sent).toHaveLength(1);
    expect(sent[0]!.to).toEqual(["idunn.winds@larkspur.test"]);
    const { rows } = await pool.query("select status, attempts, provider_id from mail_outbox where id = $1", [id]);
    expect(rows[0]).toMatchObject({ status: "sent", attempts: 1, provider_id: sent[0]!.id });
  });

  it("a rolled-back transaction leaves no message behind", async () => {
    const { db } = await import("@/db/client");
    const { enqueueMail } = await import("@/lib/mail/outbox");
    const { listingHeldMail } = await import("@/emails/listings/listing-held");
    await expect(
      db.transaction(async (tx) => {
        await enqueueMail(tx, { template: listingHeldMail, to: "a@larkspur.test", props: { sellerName: "A", listingTitle: "Rolled back", listingUrl: "x" } });
        throw new Error("the change failed");
      }),
    ).rejects.toThrow("the change failed");
    const { rows } = await pool.query("select count(*)::int as n from mail_outbox where props->>'listingTitle' = 'Rolled back'");
    expect(rows[0].n).toBe(0);
  });

  it("during a mail outage delivery fails (so the job is retried) and succeeds once the service is back", async () => {
    const { db } = await import("@/db/client");
    const { enqueueMail, deliverMail, pendingMailIds, MailDeliveryError } = await import("@/lib/mail/outbox");
    const { listingSentBackMail } = await import("@/emails/listings/listing-sent-back");
    const id = await db.transaction((tx) =>
      enqueueMail(tx, {
        template: listingSentBackMail,
        to: "bram.kits@larkspur.test",
        props: { sellerName: "Bram", listingTitle: "Half-bridge kit", listingUrl: "x", reasons: [{ topicLabel: "Stored charge", text: "State the wait." }] },
      }),
    );
    await fetch(`${mail.url}/api/fail-mode`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ down: true }) });
    await expect(deliverMail(id)).rejects.toBeInstanceOf(MailDeliveryError);
    expect(await pendingMailIds(0)).toContain(id);
    await fetch(`${mail.url}/api/fail-mode`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ down: false }) });
    expect(await deliverMail(id)).toBe("sent");
    const sent = (await outboxMessages()).filter((m) => m.subject.includes("Half-bridge kit"));
    expect(sent).toHaveLength(1);
    const { rows } = await pool.query("select attempts, last_error from mail_outbox where id = $1", [id]);
    expect(rows[0].attempts).toBe(2);
    expect(await pendingMailIds(0)).not.toContain(id);
  });
});
