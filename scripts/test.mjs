// `npm test`: make sure the browser tests' Chromium and the Dask test's python3-distributed are there
// (scripts/browser.mjs, scripts/dask.mjs: install Debian's packages as root when missing, else stop
// with one line saying what to install), then lint,
// typecheck, build the renderer, and every Vitest project (unit, CLI, browser end-to-end). Ends with
// one count line, "tests: N passed, N failed" (plus ", N skipped" when any were skipped), read by CI.
//
// Everything runs with TMPDIR set to a fresh folder of this run, removed at the end (also after a
// failure or Ctrl-C); anything the steps left in it is listed first.
import { spawn } from 'node:child_process';
import { mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { ensureBrowser, machine } from './browser.mjs';
import { ensureDask } from './dask.mjs';

const browser = ensureBrowser(machine());
if (!browser.ok) {
  console.error(browser.message);
  process.exit(1);
}
const dask = ensureDask(machine());
if (!dask.ok) {
  console.error(dask.message);
  process.exit(1);
}

const runTemp = mkdtempSync(join(tmpdir(), 'gleaner-npm-test-'));
const env = { ...process.env, TMPDIR: runTemp };
let child = null;

/** Lists and removes what is left in this run's temp folder; returns how many entries were left. */
function cleanTemp() {
  let left;
  try {
    left = readdirSync(runTemp);
  } catch {
    return 0;
  }
  rmSync(runTemp, { recursive: true, force: true, maxRetries: 10, retryDelay: 100 });
  return left.length;
}

for (const signal of ['SIGINT', 'SIGTERM']) {
  process.on(signal, () => {
    child?.kill(signal);
    cleanTemp();
    process.exit(130);
  });
}

function step(title, cmd, args) {
  console.log(`\n== ${title}: ${cmd} ${args.join(' ')}`);
  return new Promise((resolve) => {
    child = spawn(cmd, args, { stdio: 'inherit', env });
    child.on('error', () => resolve(false));
    child.on('exit', (code) => resolve(code === 0));
  }).finally(() => {
    child = null;
  });
}

const failed = [];
if (!(await step('lint', 'npm', ['run', 'lint', '--silent']))) failed.push('lint');
if (!(await step('typecheck', 'npm', ['run', 'typecheck', '--silent']))) failed.push('typecheck');
if (!(await step('build', 'npm', ['run', 'build', '--silent']))) failed.push('build');

mkdirSync('test-output', { recursive: true });
const report = 'test-output/vitest.json';
const vitestOk = await step('tests', 'npx', ['vitest', 'run', '--reporter=default', '--reporter=json', `--outputFile.json=${report}`]);
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
const left = cleanTemp();
if (left) console.log(`\ntemp: the steps left ${left} entr${left === 1 ? 'y' : 'ies'} in TMPDIR (${runTemp}), removed now`);
if (failed.length) console.log(`\nfailed steps: ${failed.join(', ')}`);
const stepsFailed = failed.length;
console.log(`\ntests: ${passed} passed, ${failedTests + stepsFailed} failed${skipped ? `, ${skipped} skipped` : ''}`);
process.exit(failedTests + stepsFailed === 0 ? 0 : 1);
