import { spawn } from 'node:child_process';

/**
 * Runs `node [nodeArgs] --import tsx script ...args` as a child process (a peer library gets its own
 * process, so its memory and crashes stay its own), kills it after `budgetS` seconds, and resolves
 * with the JSON object on its last stdout line, or with the reason it was skipped.
 */
export function runChild<T>(script: string, args: string[], budgetS: number, nodeArgs: string[] = []): Promise<T | { skipped: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, [...nodeArgs, '--import', 'tsx', script, ...args], { stdio: ['ignore', 'pipe', 'pipe'] });
    let out = '';
    let err = '';
    child.stdout.on('data', (b: Buffer) => { out += b.toString(); });
    child.stderr.on('data', (b: Buffer) => { err += b.toString(); });
    const timer = setTimeout(() => child.kill('SIGKILL'), budgetS * 1000);
    child.on('close', (code, signal) => {
      clearTimeout(timer);
      if (signal === 'SIGKILL') return resolve({ skipped: `killed at the ${budgetS} s budget` });
      const line = out.trim().split('\n').pop() ?? '';
      if (code !== 0 || !line.startsWith('{')) return resolve({ skipped: `failed (exit ${code}): ${reason(err)}` });
      resolve(JSON.parse(line) as T);
    });
  });
}

/** The telling line of a dead child's stderr: its last error or abort message, else its last line. */
function reason(stderr: string): string {
  const lines = stderr.split('\n').map((l) => l.trim()).filter((l) => l.length > 0 && !/^at /.test(l) && !/^Node\.js v/.test(l));
  const telling = lines.filter((l) => /error|abort|memory/i.test(l));
  return (telling.at(-1) ?? lines.at(-1) ?? '').slice(0, 200);
}
