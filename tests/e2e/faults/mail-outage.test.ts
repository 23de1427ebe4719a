// Fault: the mail provider is down while payments keep arriving, then comes back and loses the answers
// to its first sends (it accepted them; the sender cannot tell). Two workers deliver, as two would in
// production. Against a stack of its own (tests/e2e/support/stack.ts). Run alone with
// `FLUXYARD_TEST_SLOT=N npm test -- --e2e-only tests/e2e/faults/mail-outage.test.ts`.
import { afterAll, beforeAll, expect, it } from "vitest";
import {
  addToCart,
  eventually,
  fakeMessages,
  liveListing,
  openCheckout,
  payAtProvider,
  signedIn,
  startStack,
  type FaultStack,
  type Member,
} from "../support/stack";

const LOST_ANSWERS = 2;

let stack: FaultStack;

beforeAll(async () => {
  stack = await startStack({ label: "mail-outage", workers: 2 });
});

afterAll(async () => {
  await stack?.stop();
});

type OutboxRow = { id: string; to: string; status: string; attempts: number; last_error: string | null };

async function outboxSince(since: Date): Promise<OutboxRow[]> {
  const { rows } = await stack.db.query(`select id, "to", status, attempts, last_error from mail_outbox where created_at >= $1 order by created_at`, [since]);
  return rows as OutboxRow[];
}

it("mail written while the provider is down waits in the outbox, goes out once it is back, and none goes out twice though answers were lost", async () => {
  const app = stack.appUrls[0]!;
  const listing = await liveListing(stack, { stock: 10, priceMinor: 2_600, title: "Mail outage choke 10 uH" });
  const buyers: Member[] = [];
  for (let i = 0; i < 3; i++) buyers.push(await signedIn(stack, { email: `mail.outage.buyer.${i}@example.test` }));
  const checkouts: { checkoutId: string; sessionId: string }[] = [];
  for (const buyer of buyers) {
    await addToCart(app, buyer.token, listing.id);
    checkouts.push(await openCheckout(buyer));
  }

  // The provider's process is gone; three payments arrive meanwhile.
  await stack.stopMail();
  const since = new Date(Date.now() - 1_000);
  for (const c of checkouts) expect((await payAtProvider(stack, c.sessionId)).status).toBe(200);
  await eventually("all three checkouts paid though mail is down", async () => {
    const { rows } = await stack.db.query("select count(*)::int as n from checkouts where id = any($1) and status = 'paid'", [checkouts.map((c) => c.checkoutId)]);
    return rows[0].n === 3;
  });

  // Queued, tried and kept: every receipt and seller notice is pending, and the workers have tried some.
  const queued = await eventually("the workers to try and fail", async () => {
    const rows = await outboxSince(since);
    return rows.length >= 6 && rows.some((r) => r.attempts >= 1 && r.last_error) ? rows : undefined;
  }, 30_000);
  expect(queued.every((r) => r.status === "pending")).toBe(true);
  for (const buyer of buyers) expect(queued.some((r) => r.to === buyer.email)).toBe(true);

  // Back, but the answers to its first sends are lost on the way: accepted, stored, never acknowledged.
  await stack.startMail();
  const lose = await fetch(`${stack.mailUrl}/api/lose-answers`, { method: "POST", body: JSON.stringify({ count: LOST_ANSWERS }) });
  expect(lose.status).toBe(200);

  const delivered = await eventually("every queued message sent", async () => {
    const rows = await outboxSince(since);
    return rows.length === queued.length && rows.every((r) => r.status === "sent") ? rows : undefined;
  }, 90_000);
  // Both lost answers were used up, so two messages really were accepted without the sender knowing.
  expect(((await (await fetch(`${stack.mailUrl}/api/lose-answers`)).json()) as { loseAnswers: number }).loseAnswers).toBe(0);

  // Exactly one message per outbox row: the retries after a lost answer replayed the first send.
  const messages = await fakeMessages(stack);
  for (const row of delivered) {
    expect(messages.filter((m) => m.idempotencyKey === row.id), `messages with key ${row.id}`).toHaveLength(1);
  }
  const recipients = new Set(delivered.map((r) => r.to));
  const toThem = messages.filter((m) => m.to.some((t) => recipients.has(t)) && new Date(m.createdAt) >= since);
  expect(toThem).toHaveLength(delivered.length);
  // Some were tried more than once (the outage, the lost answers), and still sent once.
  expect(delivered.filter((r) => r.attempts >= 2).length).toBeGreaterThanOrEqual(1);
  console.log(`[faults] ${delivered.length} messages sent once each; attempts ${delivered.map((r) => r.attempts).join(", ")}`);
  for (const worker of stack.workers) expect(worker.child.exitCode).toBeNull();
}, 180_000);
