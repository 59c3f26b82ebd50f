/**
 * The CLI bundled once with esbuild into a temporary folder, so that the many golden cases start
 * in a fraction of a second each instead of compiling the sources through tsx every time. Same
 * entries as scripts/build-cli.mjs (main, thread-entry, csv-part-thread), chunks beside them.
 */
import { spawn } from 'node:child_process';
import { join, resolve } from 'node:path';
import { build } from 'esbuild';
import { tempDir } from '../temp';

const ROOT = resolve(import.meta.dirname, '../..');

export async function buildCliBundle(): Promise<string> {
  // Removed after the test file, like every folder made with tempDir.
  const outdir = tempDir('golden-cli');
  await build({
    absWorkingDir: ROOT,
    entryPoints: { main: 'src/cli/main.ts', 'thread-entry': 'src/cli/thread-entry.ts', 'csv-part-thread': 'src/cli/csv-part-thread.ts' },
    bundle: true,
    splitting: true,
    format: 'esm',
    platform: 'node',
    target: 'node20',
    outdir,
    chunkNames: '[name]-[hash]',
    logLevel: 'error',
  });
  return join(outdir, 'main.js');
}

export interface CliResult {
  status: number | null;
  stdout: string;
  stderr: string;
}

/** At most this many CLI processes at once (the cases run concurrently; two cores). */
const AT_ONCE = 2;
let running = 0;
const waiting: (() => void)[] = [];

/** Runs the bundled CLI with `args` in the folder `cwd` (queued behind AT_ONCE others). */
export async function runBundled(main: string, args: string[], cwd: string): Promise<CliResult> {
  if (running >= AT_ONCE) await new Promise<void>((go) => waiting.push(go));
  running++;
  try {
    return await spawnOnce(main, args, cwd);
  } finally {
    running--;
    waiting.shift()?.();
  }
}

function spawnOnce(main: string, args: string[], cwd: string): Promise<CliResult> {
  return new Promise((done, fail) => {
    // SOURCE_DATE_EPOCH=0: the times outputs record (a study's createdAt) are fixed, so goldens hold.
    const child = spawn(process.execPath, [main, ...args], { cwd, stdio: ['ignore', 'pipe', 'pipe'], env: { ...process.env, SOURCE_DATE_EPOCH: '0' } });
    let stdout = '';
    let stderr = '';
    child.stdout.setEncoding('utf8').on('data', (s: string) => (stdout += s));
    child.stderr.setEncoding('utf8').on('data', (s: string) => (stderr += s));
    child.on('error', fail);
    child.on('close', (status) => done({ status, stdout, stderr }));
  });
}
