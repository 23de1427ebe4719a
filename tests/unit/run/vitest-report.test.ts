// `npm test` repeats each failure at the end of its output from vitest's own JSON report. The report
// here is a real one: vitest runs a folder with a passing test, a failing one and a file that cannot load.
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { failureLines, type VitestReport } from "../../support/vitest-report";

const dir = mkdtempSync(path.join(os.tmpdir(), "fluxyard-report-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("failureLines", () => {
  it("names every failed test and every file that failed to load, with the first line of its message", () => {
    writeFileSync(path.join(dir, "sums.test.ts"), 'import { expect, it } from "vitest";\nit("adds", () => expect(1 + 1).toBe(2));\nit("is wrong", () => expect(2 + 2, "two and two").toBe(5));\n');
    writeFileSync(path.join(dir, "broken.test.ts"), 'throw new Error("cannot load\\nsecond line");\n');
    const out = path.join(dir, "report.json");
    const vitest = path.resolve(import.meta.dirname, "../../../node_modules/vitest/vitest.mjs");
    const run = spawnSync(process.execPath, [vitest, "run", "--root", dir, "--reporter=json", `--outputFile.json=${out}`], { encoding: "utf8" });
    expect(run.status).toBe(1);
    const report = JSON.parse(readFileSync(out, "utf8")) as VitestReport;
    expect(report.numPassedTests).toBe(1);
    expect(failureLines(report, dir).sort()).toEqual([
      "broken.test.ts: cannot load",
      "sums.test.ts > is wrong: AssertionError: two and two: expected 4 to be 5 // Object.is equality",
    ]);
  });
});
