// Totals the test runners' JSON reports for scripts/test.sh.
//   node scripts/lib/summarize-tests.mjs <report.json>…
// Vitest's JSON reporter (Jest-compatible): numPassedTests, numFailedTests.
// Playwright's JSON reporter: stats.expected (passed), stats.unexpected (failed), stats.flaky
// (passed after a retry: counted as passed, and reported).
// Prints "<passed> <failed> <flaky>" on stdout; a missing or unreadable report is an error.
import { readFileSync } from "node:fs";

let passed = 0;
let failed = 0;
let flaky = 0;
for (const file of process.argv.slice(2)) {
  const report = JSON.parse(readFileSync(file, "utf8"));
  if (report.stats && typeof report.stats.expected === "number") {
    passed += report.stats.expected + (report.stats.flaky ?? 0);
    failed += report.stats.unexpected ?? 0;
    flaky += report.stats.flaky ?? 0;
  } else if (typeof report.numPassedTests === "number") {
    passed += report.numPassedTests;
    failed += report.numFailedTests ?? 0;
  } else {
    throw new Error(`${file} is neither a vitest nor a Playwright JSON report`);
  }
}
process.stdout.write(`${passed} ${failed} ${flaky}\n`);
