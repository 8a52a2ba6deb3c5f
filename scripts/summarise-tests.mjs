// Prints the suite's last line, "N passed, N failed", from vitest's JSON report; exits 1 when none ran.
import fs from 'node:fs';

const file = process.argv[2];
if (!fs.existsSync(file)) {
  console.log('0 passed, 1 failed');
  console.error('no test report was written: the test run did not complete');
  process.exit(1);
}
const report = JSON.parse(fs.readFileSync(file, 'utf8'));
// A file that fails to load counts as a failure even though it has no test results.
const brokenFiles = report.testResults.filter((f) => f.status === 'failed' && f.assertionResults.length === 0).length;
const failed = report.numFailedTests + brokenFiles;
console.log(`${report.numPassedTests} passed, ${failed} failed`);
process.exit(failed > 0 || report.numPassedTests === 0 ? 1 : 0);
