// Prints the plain closing line CI reads, from vitest's JSON report.
import { readFileSync, existsSync } from 'node:fs';

const file = process.argv[2] ?? '.vitest-report.json';
if (!existsSync(file)) {
  console.log('no test report written');
  console.log('0 passed, 1 failed');
  process.exit(1);
}
const r = JSON.parse(readFileSync(file, 'utf8'));
const passed = r.numPassedTests ?? 0;
// A test file that fails outside its tests (it cannot load, or a beforeAll hook fails and its tests
// are skipped) has no failed test results; count it as one failure so it cannot pass silently.
const brokenFiles = (r.testResults ?? []).filter((s) => s.status === 'failed' && !(s.assertionResults ?? []).some((a) => a.status === 'failed')).length;
const failed = (r.numFailedTests ?? 0) + brokenFiles;
const skipped = (r.numPendingTests ?? 0) + (r.numTodoTests ?? 0);
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
process.exit(failed > 0 || passed === 0 ? 1 : 0);
