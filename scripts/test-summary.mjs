// Totals vitest's JSON reports into the single closing line CI reads: "N passed, N failed".
// A missing report (a suite that never ran), a failed type check and a failed lint each count as a failure.
import { existsSync, readFileSync } from "node:fs";
import path from "node:path";

const [dir, tscStatus, lintStatus] = process.argv.slice(2);
let passed = 0;
let failed = 0;
let skipped = 0;
for (const name of ["vitest.json", "browser.json"]) {
  const file = path.join(dir, name);
  if (!existsSync(file)) {
    console.log(`${name}: no report (suite did not run)`);
    failed += 1;
    continue;
  }
  const report = JSON.parse(readFileSync(file, "utf8"));
  passed += report.numPassedTests ?? 0;
  // A file that failed without a failing test (an import error, a crashed hook) counts once.
  const brokenFiles = (report.testResults ?? []).filter(
    (file) => file.status === "failed" && !(file.assertionResults ?? []).some((a) => a.status === "failed"),
  ).length;
  failed += (report.numFailedTests ?? 0) + brokenFiles;
  skipped += (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0);
  if ((report.numTotalTests ?? 0) === 0) failed += 1;
}
for (const [check, status] of [["type check", tscStatus], ["lint", lintStatus]]) {
  if (status !== "0") {
    console.log(`${check}: failed`);
    failed += 1;
  } else {
    passed += 1;
  }
}
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ""}`);
process.exit(failed === 0 ? 0 : 1);
