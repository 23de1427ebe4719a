// Fault: PostgreSQL goes away while pages, API calls, a seller's actions and the payment provider's
// webhooks are in flight — an immediate stop, which clients cannot tell from a crash (no checkpoint;
// the server replays its write-ahead log when it starts) — and comes back three seconds later. The
// app and the worker are not restarted. Its own cluster (tests/e2e/support/stack.ts), so no other
// test sees the outage. Run alone with
// `FLUXYARD_TEST_SLOT=N npm test -- --e2e-only tests/e2e/faults/database-restart.test.ts`.
import { readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, expect, it } from "vitest";
import {
  addToCart,
  eventually,
  liveListing,
  openCheckout,
  payAtProvider,
  sessionCookieHeader,
  signedIn,
  startStack,
  type FaultStack,
  type Member,
} from "../support/stack";

const DOWN_MS = 3_000;
// How soon after PostgreSQL accepts connections again every probe must succeed. The pool keeps no
// client across the outage and opens new ones on demand, so well under this is expected.
const RECOVERY_LIMIT_MS = 10_000;

let stack: FaultStack;

beforeAll(async () => {
  stack = await startStack({ label: "database-restart", ownCluster: true });
});

afterAll(async () => {
  const { jobSender } = await import("@/lib/jobs/boss");
  await (await jobSender().catch(() => null))?.stop({ graceful: false }).catch(() => {});
  await stack?.stop();
});

type Checkout = { checkoutId: string; sessionId: string };
type Probe = { at: number; path: string; outcome: number | "refused" | "timeout" | "error" };

function outcomeOf(error: unknown): Probe["outcome"] {
  const code = (error as { cause?: { code?: string } }).cause?.code;
  if (code === "ECONNREFUSED" || code === "ECONNRESET") return "refused";
  return (error as Error).name === "TimeoutError" ? "timeout" : "error";
}

/** Reads four kinds of page and API, two rounds a second, until stopped. */
function startProbes(app: string, member: Member) {
  const probes: Probe[] = [];
  const paths = ["/api/health", "/api/listings?q=choke", "/catalog", "/api/cart"];
  let running = true;
  const loop = (async () => {
    while (running) {
      await Promise.all(
        paths.map(async (p) => {
          const at = Date.now();
          try {
            const res = await fetch(`${app}${p}`, { headers: { cookie: sessionCookieHeader(member.token) }, signal: AbortSignal.timeout(8_000) });
            await res.arrayBuffer();
            probes.push({ at, path: p, outcome: res.status });
          } catch (error) {
            probes.push({ at, path: p, outcome: outcomeOf(error) });
          }
        }),
      );
      await new Promise((r) => setTimeout(r, 400));
    }
  })();
  return {
    probes,
    stop: async () => {
      running = false;
      await loop;
    },
  };
}

async function ship(app: string, seller: Member, orderId: string): Promise<number | "error"> {
  try {
    const res = await fetch(`${app}/api/orders/${orderId}/ship`, {
      method: "POST",
      headers: { "content-type": "application/json", cookie: sessionCookieHeader(seller.token), origin: app },
      body: JSON.stringify({ carrier: "Yard Post", trackingRef: `YP-${orderId.slice(0, 8)}` }),
      signal: AbortSignal.timeout(10_000),
    });
    await res.arrayBuffer();
    return res.status;
  } catch {
    return "error";
  }
}

async function checkoutState(checkoutId: string): Promise<{ status: string; orderId: string; orderState: string }> {
  const { rows } = await stack.db.query(
    "select c.status, o.id as order_id, o.state as order_state from checkouts c join orders o on o.checkout_id = c.id where c.id = $1",
    [checkoutId],
  );
  return { status: rows[0].status, orderId: rows[0].order_id, orderState: rows[0].order_state };
}

it("PostgreSQL stops hard and starts again: the same app answers within seconds, no paid order or audit entry is lost, payments made meanwhile complete", async () => {
  const app = stack.appUrls[0]!;
  const appPid = stack.apps[0]!.child.pid;
  const seller = await signedIn(stack, { id: "demo-seller-magnetics", email: "idunn.winds@larkspur.test" });
  const listing = await liveListing(stack, { stock: 20, priceMinor: 3_900, title: "Restart choke 40 uH" });
  const buyers: Member[] = [];
  for (let i = 0; i < 7; i++) buyers.push(await signedIn(stack, { email: `restart.buyer.${i}@example.test` }));
  for (const buyer of buyers) await addToCart(app, buyer.token, listing.id);
  const checkouts: Checkout[] = [];
  for (const buyer of buyers) checkouts.push(await openCheckout(buyer));
  const [c1, c2, c3, c4, c5, c6, c7] = checkouts as [Checkout, Checkout, Checkout, Checkout, Checkout, Checkout, Checkout];

  // Before the fault: two orders paid through the provider's webhook, one of them shipped (an audit entry).
  for (const c of [c1, c2]) expect((await payAtProvider(stack, c.sessionId)).status).toBe(200);
  await eventually("the first two checkouts paid", async () => (await checkoutState(c1.checkoutId)).status === "paid" && (await checkoutState(c2.checkoutId)).status === "paid");
  const o1 = (await checkoutState(c1.checkoutId)).orderId;
  const o2 = (await checkoutState(c2.checkoutId)).orderId;
  expect(await ship(app, seller, o1)).toBe(200);

  const auditBefore = (await stack.db.query("select id, action, subject_id, details::text as details from audit_log order by id")).rows;
  const paidBefore = (await stack.db.query("select id from orders where state in ('paid', 'shipped') order by id")).rows.map((r) => r.id as string);
  expect(paidBefore).toHaveLength(2);
  expect(auditBefore.filter((a) => a.action === "order.shipped" && a.subject_id === o1)).toHaveLength(1);

  const load = startProbes(app, buyers[0]!);
  await new Promise((r) => setTimeout(r, 1_000));

  // Two payments whose webhooks are on their way as the server dies, then transactions caught open
  // by it in the app and in the worker: the test holds a row lock, so the app's shipment of o2 and the
  // worker's sweep of the overdue checkout c7 are each waiting inside a transaction when it dies.
  for (const c of [c3, c4]) expect((await payAtProvider(stack, c.sessionId)).status).toBe(200);
  await stack.db.query("update checkouts set expires_at = now() - interval '10 minutes' where id = $1", [c7.checkoutId]);
  const lock = await stack.db.connect();
  lock.on("error", () => {});
  await lock.query("begin");
  await lock.query("select 1 from orders where id = $1 for update", [o2]);
  await lock.query("select 1 from checkouts where id = $1 for update", [c7.checkoutId]);
  const shipInFlight = ship(app, seller, o2);
  const { jobSender } = await import("@/lib/jobs/boss");
  await (await jobSender()).send("checkout-sweep", {});
  await eventually("the app and the worker waiting inside their transactions", async () => {
    const { rows } = await stack.db.query("select count(*)::int as n from pg_stat_activity where wait_event_type = 'Lock' and datname = current_database()");
    return rows[0].n >= 2;
  }, 20_000);
  const restarted = stack.database!.restart({ mode: "immediate", downMs: DOWN_MS });
  await new Promise((r) => setTimeout(r, 1_000));
  for (const c of [c5, c6]) expect((await payAtProvider(stack, c.sessionId)).status).toBe(200);
  const shipWhileDown = await ship(app, seller, o2);
  await restarted;
  const backAt = Date.now();
  lock.release(true);
  const firstShip = await shipInFlight;

  // The seller tries again until it goes through, as a person would after an error message.
  const shipped = await eventually("the shipment to go through after the restart", async () => {
    const status = await ship(app, seller, o2);
    return status === 200 || status === 409 ? status : undefined;
  });
  await new Promise((r) => setTimeout(r, 6_000));
  await load.stop();

  // The app never went away (its process is the same one, no connection was refused) and answered
  // errors while the database was down…
  expect(stack.apps[0]!.child.exitCode).toBeNull();
  expect(stack.apps[0]!.child.pid).toBe(appPid);
  expect(load.probes.filter((p) => p.outcome === "refused")).toEqual([]);
  // Nor did anything escape as an uncaught error (Next logs and carries on after one; the worker would exit).
  for (const worker of stack.workers) expect(worker.child.exitCode).toBeNull();
  for (const file of ["app-1.log", "worker-1.log"]) {
    expect(readFileSync(path.join(stack.artifacts, file), "utf8")).not.toMatch(/uncaughtException|Unhandled 'error' event/);
  }
  const duringOutage = load.probes.filter((p) => p.at > backAt - DOWN_MS && p.at < backAt - 500);
  expect(duringOutage.some((p) => p.path === "/api/health" && p.outcome === 503)).toBe(true);
  expect(shipWhileDown).not.toBe(200);
  // …and every probe sent from a few seconds after PostgreSQL was back succeeded.
  const failingAfter = load.probes.filter((p) => p.at >= backAt && p.outcome !== 200);
  const recoveredAt = Math.max(backAt, ...failingAfter.map((p) => p.at + 1));
  console.log(`[faults] database back after ${DOWN_MS} ms down; all probes answering 200 ${recoveredAt - backAt} ms later (${load.probes.length} probes)`);
  expect(recoveredAt - backAt).toBeLessThanOrEqual(RECOVERY_LIMIT_MS);
  expect(load.probes.filter((p) => p.at >= recoveredAt).length).toBeGreaterThan(8);

  // Payments made just before and during the outage complete: the provider retries a webhook that failed.
  for (const c of [c3, c4, c5, c6]) {
    await eventually(`checkout ${c.checkoutId} paid after the restart`, async () => (await checkoutState(c.checkoutId)).status === "paid", 60_000);
  }
  // (Events reach an endpoint one at a time, in order; the one at the head during the outage was retried.)
  const deliveries = (await (await fetch(`${stack.paymentsUrl}/api/test/deliveries`)).json()) as { deliveries: { attempts: number; status: string }[] };
  expect(deliveries.deliveries.some((d) => d.attempts > 1 && d.status === "succeeded")).toBe(true);
  expect(deliveries.deliveries.filter((d) => d.status === "failed")).toEqual([]);

  // Nothing committed before the fault is lost, and the one shipment is recorded once, with its audit entry.
  const paidAfter = (await stack.db.query("select id from orders where state in ('paid', 'shipped')")).rows.map((r) => r.id as string);
  for (const id of paidBefore) expect(paidAfter).toContain(id);
  expect(paidAfter).toHaveLength(6);
  const auditAfter = (await stack.db.query("select id, action, subject_id, details::text as details from audit_log order by id")).rows;
  expect(auditAfter.slice(0, auditBefore.length)).toEqual(auditBefore);
  expect([firstShip, shipWhileDown, shipped]).toContain(200);
  const o2State = await stack.db.query("select state from orders where id = $1", [o2]);
  expect(o2State.rows[0].state).toBe("shipped");
  // The change and its audit entry commit together: every shipped order has exactly one entry, and no entry names an unshipped order.
  const { rows: mismatched } = await stack.db.query(`
    select o.id, o.state, count(a.id)::int as entries from orders o
    left join audit_log a on a.subject_type = 'order' and a.subject_id = o.id::text and a.action = 'order.shipped'
    group by o.id, o.state having (o.state = 'shipped') <> (count(a.id) = 1)`);
  expect(mismatched).toEqual([]);
  // The overdue hold the worker was releasing when the server died is released once: the provider's
  // expiry event (sent when the sweep closed the session) or the next sweep finishes it.
  await eventually("the overdue checkout released", async () => (await checkoutState(c7.checkoutId)).status === "expired", 60_000);
  const stock = await stack.db.query("select stock from listings where id = $1", [listing.id]);
  expect(stock.rows[0].stock).toBe(14);

  // The worker came through too: the receipts of the payments made during the outage are delivered.
  for (const buyer of [buyers[4]!, buyers[5]!]) {
    await eventually(`the receipt to ${buyer.email} sent`, async () => {
      const { rows } = await stack.db.query("select status from mail_outbox where \"to\" = $1", [buyer.email]);
      return rows.length > 0 && rows.every((r) => r.status === "sent");
    }, 60_000);
  }
  for (const worker of stack.workers) expect(worker.child.exitCode).toBeNull();
}, 180_000);
