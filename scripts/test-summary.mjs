// Prints the closing line of `npm test` from vitest's JSON report; the lint, the type check and the
// builds count as one test each, so a broken build is never hidden behind green tests.
// Usage: node scripts/test-summary.mjs REPORT.json LINT_RC TSC_RC BUILD_RC
import { existsSync, readFileSync } from "node:fs";

const [file, ...stepRcs] = process.argv.slice(2);
let passed = 0, failed = 0, skipped = 0;
if (existsSync(file)) {
  const r = JSON.parse(readFileSync(file, "utf8"));
  passed = r.numPassedTests ?? 0;
  failed = (r.numFailedTests ?? 0) + (r.testResults ?? []).filter((t) => t.status === "failed" && (t.assertionResults ?? []).length === 0).length;
  skipped = (r.numPendingTests ?? 0) + (r.numTodoTests ?? 0);
} else {
  failed += 1; // vitest did not even report
}
for (const rc of stepRcs) Number(rc) === 0 ? passed++ : failed++;
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ""}`);
process.exit(failed ? 1 : 0);
