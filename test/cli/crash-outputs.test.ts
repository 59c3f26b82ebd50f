// Crash safety of the CLI's outputs: the CLI is killed with SIGKILL while it writes windows.csv,
// then summary.json, then study.gleaner (test/cli/slow-writes.mjs slows its writes of temporary files
// so the kill lands mid-write). Each output under its real name is always a whole file, the earlier
// one or the new one; the half-written temporary file is removed by the next run.
import { spawn } from 'node:child_process';
import { readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { ROOT, runCli, tempDir } from './run-cli';

/** 3,000 windows of 4 subjects and 3 features (seeded arithmetic, no randomness needed). */
function windowsTable(dir: string): string {
  const lines = ['window_id,subject,start,end,f1,f2,f3'];
  for (let i = 0; i < 3000; i++) lines.push(`w${i},S${i % 4},${i * 5},${i * 5 + 5},${(i * 37) % 101},${((i * 53) % 97) / 7},${(i % 7) * (i % 11)}`);
  const path = join(dir, 'windows.csv');
  writeFileSync(path, `${lines.join('\n')}\n`);
  return path;
}

// The study's createdAt follows SOURCE_DATE_EPOCH: fixed, so two runs with one seed write the same study.
process.env.SOURCE_DATE_EPOCH = '0';
let input = '';
const analyze = (seed: number, out: string) => ['analyze', input, '--k', '4', '--seed', String(seed), '--restarts', '1', '--progress', 'none', '--out', out];
const files = (dir: string) => ({ windows: readFileSync(join(dir, 'windows.csv')), summary: readFileSync(join(dir, 'summary.json')), study: readFileSync(join(dir, 'study.gleaner')) });
const OUTPUTS = ['study.gleaner', 'summary.json', 'windows.csv'];

/** Runs the CLI with slowed writes and kills it once a temporary file of `output` exists. */
async function killWhileWriting(args: string[], out: string, output: string): Promise<{ temp: string; size: number }> {
  const child = spawn(process.execPath, ['--import', join(ROOT, 'test/cli/slow-writes.mjs'), '--import', 'tsx', 'src/cli/main.ts', ...args], { cwd: ROOT, stdio: 'ignore' });
  const exited = new Promise<NodeJS.Signals | null>((resolve) => child.on('exit', (_code, signal) => resolve(signal)));
  const temp = `.${output}.${child.pid}.tmp`;
  const deadline = Date.now() + 120_000;
  try {
    while (!readdirSync(out).includes(temp)) {
      if (child.exitCode !== null || Date.now() > deadline) throw new Error(`the CLI never wrote ${temp}`);
      await new Promise((r) => setTimeout(r, 5));
    }
  } finally {
    child.kill('SIGKILL');
  }
  expect(await exited).toBe('SIGKILL');
  return { temp, size: statSync(join(out, temp)).size };
}

describe('the CLI killed while it writes its outputs', () => {
  it('leaves whole files under the real names, and the next run removes the half-written temporary file', { timeout: 300_000 }, async () => {
    input = windowsTable(tempDir('crash-in'));
    const fresh = tempDir('crash-new');
    expect(runCli(analyze(2, fresh)).status).toBe(0);
    const next = files(fresh);
    const out = tempDir('crash-out');
    expect(runCli(analyze(1, out)).status).toBe(0);
    const earlier = files(out);
    expect(earlier.windows.equals(next.windows)).toBe(false);

    // Killed during windows.csv: every output is the earlier one.
    const first = await killWhileWriting(analyze(2, out), out, 'windows.csv');
    expect(first.size).toBeLessThan(next.windows.length);
    expect(files(out)).toEqual(earlier);
    expect(readdirSync(out).sort()).toEqual([first.temp, ...OUTPUTS].sort());

    // Killed during summary.json: windows.csv is the new one, whole; summary.json the earlier one.
    const second = await killWhileWriting(analyze(2, out), out, 'summary.json');
    expect(second.size).toBeLessThan(next.summary.length);
    expect(files(out)).toEqual({ windows: next.windows, summary: earlier.summary, study: earlier.study });

    // Killed during study.gleaner: windows.csv and summary.json are the new ones; the study the earlier one.
    const third = await killWhileWriting(analyze(2, out), out, 'study.gleaner');
    expect(third.size).toBeLessThan(next.study.length);
    expect(files(out)).toEqual({ windows: next.windows, summary: next.summary, study: earlier.study });

    // The next run writes all three and removes what the killed runs left.
    expect(runCli(analyze(2, out)).status).toBe(0);
    expect(files(out)).toEqual(next);
    expect(readdirSync(out).sort()).toEqual(OUTPUTS);
  });
});
