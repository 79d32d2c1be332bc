// Adds up the JSON reports that jest and vitest write (both use jest's report shape) and prints
// the one closing line CI reads: "N passed, N failed".
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';

const dir = process.argv[2];
let passed = 0;
let failed = 0;
for (const file of readdirSync(dir).filter((f) => f.endsWith('.json'))) {
  const report = JSON.parse(readFileSync(join(dir, file), 'utf8'));
  passed += report.numPassedTests ?? 0;
  failed += report.numFailedTests ?? 0;
  // A suite whose file failed to load counts its failed suites too, so an import error is not "0 failed".
  if ((report.numFailedTestSuites ?? 0) > 0 && (report.numFailedTests ?? 0) === 0) failed += report.numFailedTestSuites;
  if (report.crashed) console.error(`(${file.replace('.json', '')} did not report: counted as one failure)`);
}
console.log(`${passed} passed, ${failed} failed`);
