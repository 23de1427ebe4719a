// What tests/run.ts reads from vitest's JSON reporter (its documented `--reporter=json` output).
import path from "node:path";

export type VitestReport = {
  numPassedTests: number;
  numFailedTests: number;
  numPendingTests: number;
  numTodoTests: number;
  numFailedTestSuites: number;
  testResults?: { name: string; status: string; message?: string; assertionResults?: { fullName: string; status: string; failureMessages?: string[] }[] }[];
};

/** One line per failed test (file, name, the first line of its message), or per file that failed to load. */
export function failureLines(report: VitestReport, root: string): string[] {
  const firstLine = (text: string | undefined) => (text ?? "").split("\n").find((l) => l.trim())?.trim().slice(0, 300) ?? "";
  const lines: string[] = [];
  for (const file of report.testResults ?? []) {
    const where = path.relative(root, file.name);
    const failedTests = (file.assertionResults ?? []).filter((a) => a.status === "failed");
    for (const test of failedTests) lines.push(`${where} > ${test.fullName}: ${firstLine(test.failureMessages?.[0])}`);
    if (file.status === "failed" && failedTests.length === 0) lines.push(`${where}: ${firstLine(file.message)}`);
  }
  return lines;
}
