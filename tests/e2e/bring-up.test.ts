// A builder's bring-up log in Chromium: the demo builder, with a paid order of the demo kit put in the
// database as checkout leaves it, starts a log from the kit, records the gate-drive frequency in Hz
// (converted to the checkpoint's kHz, within), a reading with a photo, and a bus voltage far above its
// range behind the series lamp (High, with the discharge caution); the stage progress adds up; a
// visitor cannot see the log until the builder makes it public.
import { randomUUID } from "node:crypto";
import pg from "pg";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_ACCOUNTS } from "../../db/seed-data";
import { openBrowser, screenshot, type Session } from "./support/browser";
import { signInThroughOutbox } from "./support/sign-in";

const builder = DEMO_ACCOUNTS.find((a) => a.id === "demo-builder")!;
const DEMO_KIT = "0b7d1c3e-5a21-4c6e-9f10-000000000001";
const DATABASE_URL = process.env.E2E_DATABASE_URL;
// The discharge step for a charged bus; 60 V is the ES1 limit of IEC 62368-1 (from memory).
const DISCHARGE = "Disconnect mains and wait for the bus to discharge below 60 V — check with a meter — before touching anything.";

let pool: pg.Pool;
let kitTitle: string;

/** The demo builder's paid order of the demo kit, as the checkout webhook leaves it. */
async function insertPaidKitOrder(): Promise<void> {
  const checkout = randomUUID();
  const order = randomUUID();
  const [kit] = (await pool.query("select title, price_minor from listings where id = $1", [DEMO_KIT])).rows;
  kitTitle = kit.title;
  const price: number = kit.price_minor;
  const fee = Math.round(price * 0.08);
  await pool.query(
    "insert into checkouts (id, buyer_id, email, currency, total_minor, fee_bps, status, expires_at, paid_at) values ($1, $2, $3, 'EUR', $4, 800, 'paid', now() + interval '1 hour', now())",
    [checkout, builder.id, builder.email, price],
  );
  await pool.query(
    "insert into orders (id, number, checkout_id, buyer_id, seller_id, state, currency, subtotal_minor, fee_minor, seller_share_minor, paid_at) values ($1, $2, $3, $4, 'demo-seller-kits', 'paid', 'EUR', $5, $6, $7, now())",
    [order, `BU-${order.slice(0, 8)}`, checkout, builder.id, price, fee, price - fee],
  );
  await pool.query("insert into order_lines (order_id, listing_id, title, unit_price_minor, quantity, sheet_revision) values ($1, $2, $3, $4, 1, 1)", [order, DEMO_KIT, kitTitle, price]);
}

/** A small photo of the bench, made here: a graphite board with a copper stripe. */
async function benchPhoto(): Promise<Buffer> {
  const stripe = await sharp({ create: { width: 96, height: 16, channels: 3, background: { r: 154, g: 74, b: 34 } } }).png().toBuffer();
  return sharp({ create: { width: 160, height: 120, channels: 3, background: { r: 44, g: 43, b: 40 } } })
    .composite([{ input: stripe, left: 32, top: 52 }])
    .png()
    .toBuffer();
}

beforeAll(async () => {
  if (!DATABASE_URL) throw new Error("E2E_DATABASE_URL is not set: run through `npm test -- --e2e-only`");
  pool = new pg.Pool({ connectionString: DATABASE_URL });
  await insertPaidKitOrder();
});

afterAll(async () => {
  await pool?.end();
});

describe("bring-up log in Chromium", () => {
  let s: Session;
  let visitor: Session | undefined;
  beforeAll(async () => {
    s = await openBrowser();
  });
  afterAll(async () => {
    await s?.close();
    await visitor?.close();
  });

  it("a builder starts a log from the kit they bought, records readings with a photo and sees a high bus voltage with its caution", async () => {
    const { page } = s;
    await signInThroughOutbox(page, builder.email, "/bench");
    await page.waitForURL(/\/bench$/);
    await page.getByRole("heading", { level: 1, name: "My bench" }).waitFor();

    // The kit bought here is offered first, and chosen by default.
    const kitSelect = page.getByLabel("What are you building?");
    expect(await kitSelect.locator("optgroup").first().getAttribute("label")).toBe("Kits you bought here");
    expect(await kitSelect.locator("optgroup").first().locator("option").first().textContent()).toBe(`${kitTitle} (9 checkpoints)`);
    expect(await kitSelect.inputValue()).toBe(DEMO_KIT);
    await screenshot(page, "bring-up-bench-start");
    await page.getByLabel("Title", { exact: true }).fill("Welder, first board");
    await page.getByRole("button", { name: "Start the log" }).click();
    await page.waitForURL(/\/bench\/logs\/[0-9a-f-]{36}$/);
    const logUrl = page.url();

    await page.getByRole("heading", { level: 1, name: "Welder, first board" }).waitFor();
    expect(await page.getByRole("complementary", { name: "Mains safety" }).textContent()).toContain("Mains and charged capacitors can kill.");
    // Stages in the order of a careful bring-up, with the kit's 9 checkpoints.
    expect(await page.locator("[data-testid=stage] h2").allTextContents()).toEqual([
      "1. Control supply only",
      "2. First mains power through a series lamp",
      "3. Low-current load",
      "4. Rated load",
    ]);
    expect(await page.getByTestId("checkpoint").count()).toBe(9);

    // Gate-drive frequency, expected 38–42 kHz, typed in Hz.
    const gate = page.locator('[data-testid=checkpoint][data-checkpoint-name="Gate-drive frequency"]');
    expect(await gate.getByTestId("expected-range").textContent()).toBe("38–42 kHz");
    await gate.getByText("Record a reading").click();
    // The form is rendered when its drawer first opens (components/bench/deferred-details.tsx).
    await gate.getByLabel("Unit", { exact: true }).waitFor();
    expect(await gate.getByLabel("Unit", { exact: true }).locator("option").allTextContents()).toEqual(["Hz", "kHz", "MHz"]);
    await gate.getByRole("textbox", { name: "Reading", exact: true }).fill("41000");
    await gate.getByLabel("Unit", { exact: true }).selectOption("Hz");
    await gate.getByLabel("Instrument", { exact: true }).fill("Scope, ×10 probe");
    await gate.getByRole("button", { name: "Record reading" }).click();
    await gate.getByTestId("reading").first().waitFor();
    const gateReading = gate.getByTestId("reading").first();
    expect(await gateReading.getByTestId("reading-value").textContent()).toBe("41 kHz");
    expect(await gateReading.getByTestId("reading-value").getAttribute("value")).toBe("41");
    expect(await gateReading.getByTestId("reading-verdict").textContent()).toBe("Within");
    expect(await gateReading.textContent()).toContain("Entered as41000 Hz");
    expect(await gate.getByTestId("reading-caution").count()).toBe(0);
    await expect.poll(() => gate.getByTestId("reading-form-result").textContent()).toContain("Recorded 41 kHz: within the expected range.");
    await screenshot(page, "bring-up-gate-within");

    // A reading with a photo of the meter on the open-circuit output.
    const output = page.locator('[data-testid=checkpoint][data-checkpoint-name="Open-circuit output"]');
    await output.getByText("Record a reading").click();
    await output.getByRole("textbox", { name: "Reading", exact: true }).fill("62");
    await output.getByLabel("Add photos to photos of this reading").setInputFiles({ name: "ocv-meter.png", mimeType: "image/png", buffer: await benchPhoto() });
    await output.getByTestId("uploaded-photo").first().waitFor({ timeout: 30_000 });
    await output.getByLabel("Alt text for photo 1 (cover)").fill("Meter across the output terminals");
    await output.getByRole("button", { name: "Record reading" }).click();
    const photo = output.getByTestId("reading").first().getByTestId("reading-photo");
    await photo.waitFor();
    expect(await photo.getAttribute("alt")).toBe("Meter across the output terminals");
    // The stored photo is served (a re-encoded copy, not the file the browser sent).
    const served = await page.request.get((await photo.getAttribute("src"))!);
    expect(served.status()).toBe(200);
    expect(await output.getByTestId("reading").first().getByTestId("reading-verdict").textContent()).toBe("Within");
    await screenshot(page, "bring-up-photo");

    // The bus behind the series lamp far above 290–335 V.
    const bus = page.locator('[data-testid=checkpoint][data-checkpoint-name="Bus voltage behind the lamp"]');
    await bus.getByText("Record a reading").click();
    await bus.getByRole("textbox", { name: "Reading", exact: true }).fill("420");
    await bus.getByRole("button", { name: "Record reading" }).click();
    const high = bus.getByTestId("reading").first();
    await high.waitFor();
    expect(await high.getByTestId("reading-verdict").textContent()).toBe("Highfar outside the range");
    expect(await high.getByTestId("reading-caution").textContent()).toBe(DISCHARGE);
    expect(await high.getByTestId("reading-caution").getAttribute("data-caution")).toBe("discharge");
    await high.scrollIntoViewIfNeeded();
    await screenshot(page, "bring-up-bus-high");

    // Progress: control supply 1 of 3 (within), series lamp 2 of 3 (one within, one high).
    const row = (stage: string) => page.locator(`[data-testid=stage-progress] tr[data-stage=${stage}] td`).allTextContents();
    expect(await row("control-supply")).toEqual(["1 of 3", "1", "0", "0"]);
    expect(await row("series-lamp")).toEqual(["2 of 3", "1", "0", "1"]);
    expect(await row("low-current")).toEqual(["0 of 1", "0", "0", "0"]);
    expect(await row("rated-load")).toEqual(["0 of 2", "0", "0", "0"]);

    // A value that is not a number is refused beside the field.
    const valueField = gate.getByRole("textbox", { name: "Reading", exact: true });
    await valueField.fill("41,5");
    await gate.getByRole("button", { name: "Record reading" }).click();
    await expect.poll(() => valueField.getAttribute("aria-invalid")).toBe("true");
    // The form offers no unit of another quantity; one slipped into the page is refused by the server, beside the unit.
    const unitField = gate.getByLabel("Unit", { exact: true });
    await unitField.evaluate((select) => select.append(new Option("V", "V")));
    await unitField.selectOption("V");
    await valueField.fill("41");
    await gate.getByRole("button", { name: "Record reading" }).click();
    await expect.poll(() => unitField.getAttribute("aria-invalid")).toBe("true");
    const unitError = gate.locator(`[id="${(await unitField.getAttribute("aria-describedby"))!.split(" ").find((id) => id.endsWith("-error"))}"]`);
    expect(await unitError.textContent()).toBe("V measures voltage, but this checkpoint measures frequency in kHz. Enter the reading in one of Hz, kHz, MHz.");
    expect(await gate.getByTestId("reading").count()).toBe(1);
    await screenshot(page, "bring-up-unit-refused");

    // My bench lists the log with the same progress.
    await page.goto("/bench");
    const summary = page.getByTestId("log-summary").filter({ hasText: "Welder, first board" });
    expect(await summary.textContent()).toContain("3 of 9");
    expect(await summary.locator("tr[data-stage=series-lamp] td").allTextContents()).toEqual(["2 of 3", "1", "0", "1"]);
    await screenshot(page, "bring-up-bench-list");

    // Private by default: a visitor gets the same page as for a log that does not exist.
    visitor = await openBrowser();
    await visitor.page.goto(logUrl);
    await visitor.page.getByTestId("log-not-found").waitFor();
    expect(await visitor.page.getByText("Welder, first board").count()).toBe(0);

    // Made public, the visitor reads it without any form to change it.
    await page.goto(logUrl);
    await page.getByRole("button", { name: "Make it public" }).click();
    await page.getByRole("button", { name: "Make it private" }).waitFor();
    await visitor.page.goto(logUrl);
    await visitor.page.getByRole("heading", { level: 1, name: "Welder, first board" }).waitFor();
    expect(await visitor.page.getByTestId("log-page").getAttribute("data-access")).toBe("public");
    expect(await visitor.page.getByTestId("record-reading-form").count()).toBe(0);
    expect(await visitor.page.getByTestId("reading-caution").textContent()).toBe(DISCHARGE);
    await screenshot(visitor.page, "bring-up-public-visitor");
  });
});
