// `npm test`: lint, typecheck, build the renderer, then every Vitest project (unit, CLI, browser
// end-to-end). Ends with one count line, "tests: N passed, N failed", read by CI.
import { spawnSync } from 'node:child_process';
import { mkdirSync, readFileSync } from 'node:fs';

function step(title, cmd, args) {
  console.log(`\n== ${title}: ${cmd} ${args.join(' ')}`);
  const r = spawnSync(cmd, args, { stdio: 'inherit', shell: false });
  return r.status === 0;
}

const npx = 'npx';
const failed = [];
if (!step('lint', 'npm', ['run', 'lint', '--silent'])) failed.push('lint');
if (!step('typecheck', 'npm', ['run', 'typecheck', '--silent'])) failed.push('typecheck');
if (!step('build', 'npm', ['run', 'build', '--silent'])) failed.push('build');

mkdirSync('test-output', { recursive: true });
const report = 'test-output/vitest.json';
const vitestOk = step('tests', npx, ['vitest', 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${report}`]);
let passed = 0;
let failedTests = 0;
let skipped = 0;
try {
  const r = JSON.parse(readFileSync(report, 'utf8'));
  passed = r.numPassedTests;
  failedTests = r.numFailedTests;
  skipped = r.numPendingTests + r.numTodoTests;
} catch {
  failedTests += 1;
}
if (!vitestOk && failedTests === 0) failedTests = 1; // a suite that failed to load counts as a failure
if (failed.length) console.log(`\nfailed steps: ${failed.join(', ')}`);
const stepsFailed = failed.length;
console.log(`\ntests: ${passed} passed, ${failedTests + stepsFailed} failed${skipped ? `, ${skipped} skipped` : ''}`);
process.exit(failedTests + stepsFailed === 0 ? 0 : 1);
