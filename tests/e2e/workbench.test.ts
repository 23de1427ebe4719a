import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openBrowser, screenshot, type Session } from "./support/browser";

describe("workbench calculators in Chromium", () => {
  let s: Session;
  beforeAll(async () => {
    s = await openBrowser();
  });
  afterAll(async () => {
    await s.close();
  });

  it("the mains calculator updates as you type, without reloading, and shows the cautions", async () => {
    await s.page.goto("/workbench/mains");
    await s.page.evaluate(() => ((window as unknown as { __marker: number }).__marker = 42));
    const main = s.page.locator("main");
    // 230 V +10 %: √2 · 230 · 1.1 = 357.8 V
    await expect.poll(() => main.textContent()).toContain("358 V");
    expect(await main.textContent()).toMatch(/estimates for checking a design, not a certification/i);
    expect(await main.textContent()).toMatch(/charged capacitors can kill/i);

    const capacitance = s.page.getByLabel("Bulk capacitance on the bus");
    await capacitance.fill("1000");
    // ½ · 1000 µF · 357.8² = 64.0 J
    await expect.poll(() => main.textContent()).toContain("64 J");
    await capacitance.fill("-5");
    await expect.poll(async () => capacitance.getAttribute("aria-invalid")).toBe("true");
    expect(await s.page.evaluate(() => (window as unknown as { __marker?: number }).__marker)).toBe(42);
    await screenshot(s.page, "workbench-mains");
  });
});
