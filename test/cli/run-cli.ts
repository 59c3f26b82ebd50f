import { spawn, spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';

/** The repository root (this file is test/cli/run-cli.ts). */
export const ROOT = fileURLToPath(new URL('../../', import.meta.url));
const CLI_ARGS = ['--import', 'tsx', 'src/cli/main.ts'];

export interface CliRun {
  status: number | null;
  stdout: string;
  stderr: string;
}

/** Runs `node --import tsx src/cli/main.ts ...args` from the repository root, as a user would. */
export function runCli(args: string[]): CliRun {
  const r = spawnSync(process.execPath, [...CLI_ARGS, ...args], { cwd: ROOT, encoding: 'utf8', timeout: 120_000 });
  if (r.error) throw r.error;
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

/** Starts the CLI without waiting, for tests that signal it. */
export function startCli(args: string[]) {
  return spawn(process.execPath, [...CLI_ARGS, ...args], { cwd: ROOT, stdio: ['ignore', 'pipe', 'pipe'] });
}

/** A fresh temp folder, removed after the test file (test/temp.ts). */
export { tempDir } from '../temp';

/** True when the text carries a JavaScript stack trace ("    at f (file:1:2)"). */
export function hasStackTrace(text: string): boolean {
  return /^\s+at .+[:(]/m.test(text);
}
