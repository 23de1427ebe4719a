// Scope captures in Chromium: the demo builder starts a log from the welder kit, records the
// gate-drive frequency from the scope's readout, attaches a capture generated here (a 40 kHz,
// 44 % gate drive with finite edges and noise, two channels), reads the figures, confirms the
// proposed value (the reading turns from low to within), zooms into the trace; a big capture is
// measured by the worker with its progress shown, a broken one names its bad line; a reviewer of
// an accepted session pins a comment to a time on the trace, and the builder sees it.
// Run alone with `FLUXYARD_TEST_SLOT=1 npm test -- --e2e-only tests/e2e/captures.test.ts`.
import pg from "pg";
import type { Locator, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { captureCsv, pulseTrain } from "../support/captures";
import { openBrowser, screenshot, type Session } from "./support/browser";
import { signInThroughOutbox } from "./support/sign-in";

const DATABASE_URL = process.env.E2E_DATABASE_URL ?? "";
const BUILDER = { id: "demo-builder", email: "noor.builds@larkspur.test" };
const REVIEWER = { id: "demo-reviewer", email: "tamsin.reviews@larkspur.test" };
const DEMO_KIT = "0b7d1c3e-5a21-4c6e-9f10-000000000001";
const TITLE = `Gate drive captures ${Date.now().toString(36)}`;

// A two-transistor forward converter's gate drive runs below 50 % duty in the tens of kHz (common
// practice); the kit expects 38–42 kHz and 40–48 %. By the IEEE Std 181 definitions this train has
// a 25 µs period, an 11 µs pulse duration, 0 V and 15 V state levels and a 0.32 µs rise (0.8 of the ramp).
const GATE = { sampleRateHz: 25e6, frequencyHz: 40e3, dutyCyclePct: 44, lowV: 0, highV: 15, riseRampS: 400e-9, fallRampS: 300e-9, noiseRmsV: 0.04 };

function gateCapture(samples: number): Buffer {
  const ch1 = pulseTrain({ ...GATE, samples, seed: 11 });
  const ch2 = pulseTrain({ ...GATE, samples, highV: 12, delayS: 0.5e-6, seed: 12 });
  return Buffer.from(
    captureCsv(ch1.timeS, [
      { name: "Gate A", unit: "V", values: ch1.values },
      { name: "Gate B", unit: "V", values: ch2.values },
    ], { metadata: ["Instrument,Bench scope", "Probe,x10"] }),
  );
}

let pool: pg.Pool;

/** Points at the middle of the trace until its readout answers: the viewer is live (hydrated) from then on. */
async function pointAtTrace(page: Page, name: string) {
  const area = page.getByTestId("capture-plot-area");
  await area.scrollIntoViewIfNeeded();
  try {
    await expect
      .poll(async () => {
        // Measured each time: the page may still settle (fonts, scrolling) after it is shown.
        const box = (await area.boundingBox())!;
        await page.mouse.move(box.x + box.width * 0.45, box.y + box.height * (0.5 + Math.random() * 0.01));
        return page.getByTestId("capture-readout").textContent();
      })
      .toMatch(/^[\d.]+ µsGate A −?[\d.]+ [mµ]?VGate B −?[\d.]+ [mµ]?V$/);
  } catch (error) {
    await screenshot(page, `captures-debug-${name}`);
    throw error;
  }
  return (await area.boundingBox())!;
}

/** Opens the attach form under a checkpoint unless it is open already (it stays open after an attach). */
async function openAttach(drawer: Locator): Promise<void> {
  const details = drawer.getByTestId("attach-capture-details");
  if ((await details.getAttribute("open")) === null) await details.locator("summary").click();
}

beforeAll(async () => {
  if (!DATABASE_URL) throw new Error("E2E_DATABASE_URL is not set: run through `npm test -- --e2e-only`");
  pool = new pg.Pool({ connectionString: DATABASE_URL, max: 2 });
});

afterAll(async () => {
  await pool?.end();
});

describe("scope captures in Chromium", () => {
  let builder: Session;
  let reviewer: Session;
  let logUrl = "";
  let viewerUrl = "";
  let captureId = "";

  beforeAll(async () => {
    builder = await openBrowser();
  });
  afterAll(async () => {
    await builder?.close();
    await reviewer?.close();
  });

  it("a builder attaches a capture to a reading, reads its figures, confirms the proposed value and zooms into the trace", async () => {
    const { page } = builder;
    await signInThroughOutbox(page, BUILDER.email, "/bench");
    await page.waitForURL(/\/bench$/);
    await page.getByLabel("What are you building?").selectOption(DEMO_KIT);
    await page.getByLabel("Title", { exact: true }).fill(TITLE);
    await page.getByRole("button", { name: "Start the log" }).click();
    await page.waitForURL(/\/bench\/logs\/[0-9a-f-]{36}$/);
    logUrl = page.url();

    // The scope's readout, typed in: 37.5 kHz is a little below 38–42 kHz.
    const gate = page.locator('[data-testid=checkpoint][data-checkpoint-name="Gate-drive frequency"]');
    await gate.getByText("Record a reading").click();
    await gate.getByRole("textbox", { name: "Reading", exact: true }).fill("37.5");
    await gate.getByLabel("Instrument", { exact: true }).fill("Bench scope, ×10 probe");
    await gate.getByRole("button", { name: "Record reading" }).click();
    await expect.poll(() => gate.getByTestId("reading").first().getByTestId("reading-verdict").textContent()).toBe("Low");

    const drawer = page.locator('[data-testid=checkpoint-captures][data-checkpoint-name="Gate-drive frequency"]');
    await openAttach(drawer);
    // A gate-drive trace carries the short probing caution.
    expect(await drawer.getByTestId("probe-caution").getAttribute("data-kind")).toBe("gate-drive");
    await drawer.getByLabel("Capture file for Gate-drive frequency").setInputFiles({ name: "gate-drive.csv", mimeType: "text/csv", buffer: gateCapture(6000) });
    const card = drawer.getByTestId("capture").first();
    await card.waitFor({ timeout: 30_000 });
    await expect.poll(() => card.getAttribute("data-state"), { timeout: 30_000 }).toBe("measured");
    captureId = (await card.getAttribute("data-capture-id"))!;

    // The figures per channel: 40 kHz and 44 % on both gates, 15 V and 12 V swings.
    const rows = card.getByTestId("capture-summary-row");
    expect(await rows.count()).toBe(2);
    expect(await rows.nth(0).locator("[data-figure=frequencyHz]").textContent()).toMatch(/^(39\.9\d*|40(\.0\d*)?) kHz$/);
    expect(await rows.nth(0).locator("[data-figure=dutyCyclePct]").textContent()).toMatch(/^4[34](\.\d+)? %$/);
    expect(await rows.nth(1).locator("[data-figure=amplitudeV]").textContent()).toMatch(/^1[12](\.\d+)? V$/);

    // The proposal: the measured frequency in the checkpoint's kHz; nothing changed yet.
    const proposed = card.getByTestId("proposed-value");
    const value = Number(await proposed.getAttribute("value"));
    expect(value).toBeGreaterThan(39.9);
    expect(value).toBeLessThan(40.1);
    expect(await gate.getByTestId("reading").first().getByTestId("reading-verdict").textContent()).toBe("Low");
    await card.scrollIntoViewIfNeeded();
    await screenshot(page, "captures-01-proposal");

    await card.getByRole("button", { name: /^Use .* kHz as the reading$/ }).click();
    await expect.poll(() => card.getByTestId("capture-message").textContent()).toMatch(/^The reading is now [\d.]+ kHz \(frequency of Gate A\): within the expected range\.$/);
    await expect.poll(() => gate.getByTestId("reading").first().getByTestId("reading-verdict").textContent()).toBe("Within");
    expect(Number(await gate.getByTestId("reading").first().getByTestId("reading-value").getAttribute("value"))).toBeCloseTo(value, 6);
    await expect.poll(() => card.getByTestId("capture-applied").textContent()).toContain("it was 37.5 kHz");
    await screenshot(page, "captures-02-confirmed");

    // The viewer: the whole capture first, the levels and the measured period marked.
    await card.getByRole("link", { name: "Open the trace" }).click();
    await page.waitForURL(/\/bench\/captures\/[0-9a-f-]{36}$/);
    viewerUrl = page.url();
    const plot = page.getByTestId("capture-plot");
    await plot.waitFor();
    expect(await page.getByTestId("capture-plot-area").getAttribute("aria-label")).toBe("Trace of gate-drive.csv");
    expect(await plot.locator("path[data-channel]").count()).toBe(2);
    expect(await plot.locator("[data-level]").count()).toBe(5);
    expect(await page.getByTestId("mark-period").textContent()).toMatch(/^Period 2[45](\.\d+)? µs$/);
    expect(await page.getByTestId("mark-pulse-width").textContent()).toMatch(/^Pulse width 1[01](\.\d+)? µs$/);
    expect(await page.getByTestId("capture-samples-in-window").textContent()).toBe("6,000");
    const figures = page.getByTestId("capture-figures");
    expect(await figures.locator("tr[data-figure=periodS] td[data-channel='0']").textContent()).toMatch(/^2[45](\.\d+)? µs$/);
    expect(await figures.locator("tr[data-figure=riseTimeS] td[data-channel='0']").textContent()).toMatch(/ ns$/);
    await screenshot(page, "captures-03-viewer");

    await pointAtTrace(page, "builder");
    // Zoom with the button: a finer window is fetched from the route.
    const windowAnswer = page.waitForResponse((r) => r.url().includes(`/api/captures/${captureId}/window?`) && r.status() === 200);
    await page.getByRole("button", { name: "Zoom in" }).click();
    const zoomed = await (await windowAnswer).json();
    expect(zoomed.to - zoomed.from).toBeCloseTo((5999 / 25e6) / 2, 9);
    // Half the capture's 6 000 samples, give or take one at each edge.
    await expect.poll(async () => Math.abs(Number((await page.getByTestId("capture-samples-in-window").textContent())!.replace(/,/g, "")) - 3000)).toBeLessThanOrEqual(2);

    // Drag across a range: about a fifth of the plot's width.
    const box = (await page.getByTestId("capture-plot-area").boundingBox())!;
    const y = box.y + box.height / 2;
    const before = Number(await plot.getAttribute("data-to")) - Number(await plot.getAttribute("data-from"));
    await page.mouse.move(box.x + box.width * 0.4, y);
    await page.mouse.down();
    await page.mouse.move(box.x + box.width * 0.5, y, { steps: 5 });
    await page.mouse.move(box.x + box.width * 0.6, y, { steps: 5 });
    await page.mouse.up();
    await expect.poll(async () => (Number(await plot.getAttribute("data-to")) - Number(await plot.getAttribute("data-from"))) / before).toBeLessThan(0.3);
    await expect.poll(async () => Number((await page.getByTestId("capture-samples-in-window").textContent())!.replace(/,/g, ""))).toBeLessThan(1000);
    // Keys on the focused plot: out, then the whole capture.
    await page.getByTestId("capture-plot-area").focus();
    await page.keyboard.press("-");
    await expect.poll(async () => (Number(await plot.getAttribute("data-to")) - Number(await plot.getAttribute("data-from"))) / before).toBeGreaterThan(0.3);
    await page.getByRole("button", { name: "Show the measured period" }).click();
    await expect.poll(() => page.getByTestId("capture-samples-in-window").textContent()).not.toBe("6,000");
    await page.waitForTimeout(400);
    await screenshot(page, "captures-04-zoomed-period");
    await page.getByTestId("capture-plot-area").focus();
    await page.keyboard.press("Home");
    await expect.poll(() => page.getByTestId("capture-samples-in-window").textContent()).toBe("6,000");

    // Opened afresh, the viewer asks nothing more of the capture while it loads: the page carries the
    // whole trace (its times packed on the sample grid, lib/captures/packed-window.ts) and the measured
    // state, which no poll asks for again.
    const asked: string[] = [];
    const onRequest = (r: { url(): string }) => {
      if (r.url().includes(`/api/captures/${captureId}`)) asked.push(r.url());
    };
    page.on("request", onRequest);
    await page.goto(viewerUrl);
    await pointAtTrace(page, "reopened");
    await page.waitForTimeout(1500);
    page.off("request", onRequest);
    expect(asked).toEqual([]);
    // The trace drawn in the browser from the unpacked window is the one the server drew into the
    // HTML: hide and show a channel so that React draws its path again, and compare.
    const html = await (await page.request.get(viewerUrl)).text();
    const served = /<path d="([^"]+)" data-channel="0"/.exec(html)?.[1];
    expect(served?.length).toBeGreaterThan(1000);
    const toggle = page.getByRole("checkbox", { name: "Show Gate A" });
    await toggle.uncheck();
    await expect.poll(() => plot.locator("path[data-channel='0']").count()).toBe(0);
    await toggle.check();
    await expect.poll(() => plot.locator("path[data-channel='0']").getAttribute("d")).toBe(served);
  });

  it("a big capture is measured by the worker with its progress shown, and a broken one names its bad line", async () => {
    const { page } = builder;
    await page.goto(logUrl);
    const duty = page.locator('[data-testid=checkpoint][data-checkpoint-name="Gate-drive duty cycle"]');
    await duty.getByText("Record a reading").click();
    await duty.getByRole("textbox", { name: "Reading", exact: true }).fill("50");
    await duty.getByRole("button", { name: "Record reading" }).click();
    await expect.poll(() => duty.getByTestId("reading").first().getByTestId("reading-verdict").textContent()).toBe("High");

    const drawer = page.locator('[data-testid=checkpoint-captures][data-checkpoint-name="Gate-drive duty cycle"]');
    await openAttach(drawer);
    // About 4 MB: above the 2 MB measured inline, so the worker takes it.
    const big = gateCapture(90_000);
    expect(big.length).toBeGreaterThan(2 * 1024 * 1024);
    await drawer.getByLabel("Capture file for Gate-drive duty cycle").setInputFiles({ name: "gate-long.csv", mimeType: "text/csv", buffer: big });
    const card = drawer.getByTestId("capture").first();
    await card.waitFor({ timeout: 60_000 });
    expect(["queued", "measuring", "measured"]).toContain(await card.getAttribute("data-state"));
    if ((await card.getAttribute("data-state")) !== "measured") {
      expect(await card.getByRole("progressbar").count()).toBe(1);
      await screenshot(page, "captures-05-measuring");
    }
    await expect.poll(() => card.getAttribute("data-state"), { timeout: 60_000 }).toBe("measured");
    expect(Number(await card.getByTestId("proposed-value").getAttribute("value"))).toBeCloseTo(44, 0);

    await openAttach(drawer);
    const broken = "Time (s),Gate A (V)\n0,0.02\n4e-8,15.01\n8e-8,15,01\n1.2e-7,0.01\n";
    await drawer.getByLabel("Capture file for Gate-drive duty cycle").setInputFiles({ name: "broken.csv", mimeType: "text/csv", buffer: Buffer.from(broken) });
    const failed = drawer.locator("[data-testid=capture][data-state=failed]");
    await failed.waitFor({ timeout: 30_000 });
    expect(await failed.getByTestId("capture-state").textContent()).toBe("Not measured");
    expect(await failed.getByTestId("capture-error").textContent()).toMatch(/^Line 4\b/);
    await failed.scrollIntoViewIfNeeded();
    await screenshot(page, "captures-06-broken-file");
  });

  it("a reviewer of an accepted session pins a comment to a time on the trace, and the builder sees it", async () => {
    const { rows } = await pool.query(
      `insert into review_sessions (log_id, builder_id, reviewer_id, stages, state, price_minor, currency, fee_bps, fee_minor, reviewer_share_minor, respond_by, accepted_at, message)
       select id, owner_id, $2, '["control-supply"]', 'accepted', 4500, 'EUR', 1000, 450, 4050, now() + interval '2 days', now(), 'Please look at the gate drive.'
       from bring_up_logs where title = $1 returning id`,
      [TITLE, REVIEWER.id],
    );
    const sessionId = rows[0].id as string;

    reviewer = await openBrowser();
    const r = reviewer.page;
    await signInThroughOutbox(r, REVIEWER.email, `/reviews/${sessionId}`);
    await r.waitForURL(new RegExp(`/reviews/${sessionId}$`));
    const list = r.getByTestId("review-captures");
    await list.waitFor();
    await list.getByRole("link", { name: "gate-drive.csv" }).click();
    await r.waitForURL(new RegExp(`/reviews/${sessionId}/captures/${captureId}$`));
    await r.getByTestId("capture-plot").waitFor();

    // Pointing at the trace reads its values (once the page is live), and a click picks the time for the comment.
    const box = await pointAtTrace(r, "reviewer");
    await r.mouse.click(box.x + box.width * 0.45, box.y + box.height * 0.5);
    const time = r.getByRole("textbox", { name: "Time on the trace", exact: true });
    await expect.poll(() => time.inputValue()).toMatch(/ µs$/);
    expect(await r.getByTestId("plot-draft-pin").count()).toBe(1);
    await r.getByLabel("About the channel").selectOption({ label: "Gate A" });
    const comment = "Ringing after this falling edge looks small; <b>fine</b> for the 15 V gate.";
    await r.getByRole("textbox", { name: "Comment", exact: true }).fill(comment);
    await r.getByRole("button", { name: "Pin the comment" }).click();
    await expect.poll(() => r.getByTestId("pin-form-result").textContent()).toMatch(/^Comment pinned at .* µs\. The builder sees it on the trace\.$/);
    const pin = r.getByTestId("pin").first();
    await pin.waitFor();
    // Plain text: the markup is shown as written, not rendered.
    expect(await pin.getByTestId("pin-body").textContent()).toBe(comment);
    expect(await r.getByTestId("plot-pin").count()).toBe(1);
    await screenshot(r, "captures-07-reviewer-pin");

    // The builder sees the pin on the trace and in the list.
    await builder.page.goto(viewerUrl);
    await builder.page.getByTestId("capture-plot").waitFor();
    expect(await builder.page.getByTestId("plot-pin").count()).toBe(1);
    expect(await builder.page.getByTestId("pin").first().getByTestId("pin-body").textContent()).toBe(comment);
    expect(await builder.page.getByTestId("pin-form").count()).toBe(0);
    await builder.page.getByRole("button", { name: "Show pin 1 on the trace" }).click();
    await screenshot(builder.page, "captures-08-builder-sees-pin");
  });
});
