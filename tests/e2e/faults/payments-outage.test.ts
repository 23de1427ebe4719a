// Fault: the payment provider is down, first refusing connections (its process gone) and then
// answering 503 (up but failing); later its events arrive late, after the stock hold has run out.
// In Chromium against a stack of its own (tests/e2e/support/stack.ts). Run alone with
// `FLUXYARD_TEST_SLOT=N npm test -- --e2e-only tests/e2e/faults/payments-outage.test.ts`.
import { afterAll, beforeAll, expect, it } from "vitest";
import { openBrowser, screenshot, type Session } from "../support/browser";
import {
  addToCart,
  browserSessionCookies,
  eventually,
  fakeMessages,
  liveListing,
  paymentsHook,
  signedIn,
  startStack,
  type FaultStack,
  type Member,
} from "../support/stack";

let stack: FaultStack;
let browser: Session;

beforeAll(async () => {
  stack = await startStack({ label: "payments-outage" });
  browser = await openBrowser();
});

afterAll(async () => {
  await browser?.close();
  const { jobSender } = await import("@/lib/jobs/boss");
  await (await jobSender().catch(() => null))?.stop({ graceful: false }).catch(() => {});
  await stack?.stop();
});

async function stockOf(listingId: string): Promise<number> {
  return (await stack.db.query("select stock from listings where id = $1", [listingId])).rows[0].stock;
}

async function checkoutsOf(member: Member) {
  const { rows } = await stack.db.query(
    `select c.id, c.status,
            array(select r.status::text from stock_reservations r where r.checkout_id = c.id) as reservations,
            array(select o.state::text from orders o where o.checkout_id = c.id) as orders
     from checkouts c where c.buyer_id = $1 order by c.created_at`,
    [member.userId],
  );
  return rows as { id: string; status: string; reservations: string[]; orders: string[] }[];
}

/** Runs the worker's checkout sweep now (it is also scheduled every minute) and waits for it to finish. */
async function sweepThroughWorker(): Promise<void> {
  const { jobSender } = await import("@/lib/jobs/boss");
  const boss = await jobSender();
  const id = await boss.send("checkout-sweep", {});
  if (!id) throw new Error("the sweep job was not queued");
  await eventually("the worker's checkout sweep", async () => (await boss.getJobById("checkout-sweep", id))?.state === "completed", 20_000);
}

it("checkout says the provider is down and keeps the cart whole; a payment whose events come late, after the hold ran out, still completes the order", async () => {
  const app = stack.appUrls[0]!;
  const page = browser.page;
  const buyer = await signedIn(stack, { email: "outage.buyer@example.test" });
  const listing = await liveListing(stack, { stock: 3, priceMinor: 4_800, title: "Outage choke 25 uH" });
  await addToCart(app, buyer.token, listing.id);
  await browser.context.addCookies(browserSessionCookies(buyer.token));
  await page.goto(`${app}/checkout`);
  const pay = page.getByRole("button", { name: "Pay €48.00" });
  await pay.waitFor();

  // 1. The provider's process is gone: connections are refused.
  await stack.stopPayments();
  await pay.click();
  const alert = page.getByRole("alert").filter({ hasText: "Payment not started" });
  await alert.waitFor({ timeout: 30_000 });
  expect(await alert.textContent()).toContain("The payment provider is not answering; nothing was charged and your cart is unchanged.");
  await screenshot(page, "faults-payments-01-refused");
  // Nothing is held for a checkout that could not start: the stock is back, the checkout failed, its orders are cancelled.
  expect(await stockOf(listing.id)).toBe(3);
  expect(await checkoutsOf(buyer)).toEqual([expect.objectContaining({ status: "failed", reservations: ["released"], orders: ["cancelled"] })]);

  // 2. The provider is up but failing: every call answers 503.
  await stack.startPayments();
  await paymentsHook(stack, "fail-mode", { down: true });
  await page.goto(`${app}/checkout`);
  await pay.click();
  await page.getByRole("alert").filter({ hasText: "Payment not started" }).waitFor({ timeout: 30_000 });
  expect(await stockOf(listing.id)).toBe(3);
  const afterTwo = await checkoutsOf(buyer);
  expect(afterTwo.map((c) => [c.status, c.reservations, c.orders])).toEqual([
    ["failed", ["released"], ["cancelled"]],
    ["failed", ["released"], ["cancelled"]],
  ]);
  // The cart is as it was.
  await page.goto(`${app}/cart`);
  expect(await page.getByTestId("cart-line").count()).toBe(1);
  expect(await page.getByTestId("cart-line").textContent()).toContain(listing.title);
  await screenshot(page, "faults-payments-02-cart-intact");

  // 3. The provider is back: the same cart checks out. Its events are held back (its event delivery lags).
  await paymentsHook(stack, "fail-mode", { down: false });
  await page.goto(`${app}/checkout`);
  await pay.click();
  await page.waitForURL(/\/pay\/cs_/, { timeout: 30_000 });
  expect(await stockOf(listing.id)).toBe(2);
  await paymentsHook(stack, "hold-webhooks", { held: true });
  await page.getByLabel("Card number").fill("4242 4242 4242 4242");
  await page.getByRole("button", { name: /^Pay / }).click();
  await page.waitForURL(/\/checkout\/done\?session=/);
  await page.getByTestId("payment-status").waitFor();
  expect(await page.getByTestId("payment-status").getAttribute("data-status")).not.toBe("paid");
  const open = (await checkoutsOf(buyer))[2]!;
  expect(open).toMatchObject({ status: "open", reservations: ["held"], orders: ["awaiting_payment"] });

  // 4. The provider goes down again and the hold runs out (moved into the past, beyond the sweep's grace).
  //    The sweep cannot ask the provider whether the session was paid, so it keeps the stock held.
  await paymentsHook(stack, "fail-mode", { down: true });
  await stack.db.query("update checkouts set expires_at = now() - interval '10 minutes' where id = $1", [open.id]);
  await stack.db.query("update stock_reservations set expires_at = now() - interval '10 minutes' where checkout_id = $1", [open.id]);
  await sweepThroughWorker();
  expect((await checkoutsOf(buyer))[2]).toMatchObject({ status: "open", reservations: ["held"] });
  // Back up, events still late: the provider says the session is complete, so the sweep still keeps the hold.
  await paymentsHook(stack, "fail-mode", { down: false });
  await sweepThroughWorker();
  expect((await checkoutsOf(buyer))[2]).toMatchObject({ status: "open", reservations: ["held"] });
  expect(await stockOf(listing.id)).toBe(2);

  // 5. The late events arrive: the order is paid, the stock taken once, the receipt sent once.
  await paymentsHook(stack, "hold-webhooks", { held: false });
  await eventually("the late webhook to mark the checkout paid", async () => (await checkoutsOf(buyer))[2]!.status === "paid", 30_000);
  expect((await checkoutsOf(buyer))[2]).toMatchObject({ status: "paid", reservations: ["committed"], orders: ["paid"] });
  expect(await stockOf(listing.id)).toBe(2);
  await page.reload();
  await page.locator('[data-testid="payment-status"][data-status="paid"]').waitFor();
  await screenshot(page, "faults-payments-03-paid-late");
  const receipts = await eventually("the receipt", async () => {
    const found = (await fakeMessages(stack)).filter((m) => m.to.includes(buyer.email) && m.subject.startsWith("Paid:"));
    return found.length > 0 ? found : undefined;
  });
  expect(receipts).toHaveLength(1);
  await page.goto(`${app}/cart`);
  await page.getByText("Your cart is empty").waitFor();
}, 150_000);
