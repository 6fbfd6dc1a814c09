// Adds up vitest's JSON reports and prints the closing "N passed, N failed" line; exits 1 on any
// failure. A test file that crashed before its tests ran counts as one failure, and so does a
// suite that wrote no report: neither may read as green.
import { existsSync, readFileSync } from "node:fs";

let passed = 0;
let failed = 0;
for (const file of process.argv.slice(2)) {
  if (!existsSync(file)) {
    console.log(`No report at ${file}: that suite did not finish.`);
    failed += 1;
    continue;
  }
  const report = JSON.parse(readFileSync(file, "utf8"));
  const crashedFiles = (report.testResults ?? []).filter(
    (result) => result.status === "failed" && !result.assertionResults?.some((test) => test.status === "failed"),
  ).length;
  passed += report.numPassedTests ?? 0;
  failed += (report.numFailedTests ?? 0) + crashedFiles;
}
console.log(`${passed} passed, ${failed} failed`);
process.exit(failed > 0 ? 1 : 0);
