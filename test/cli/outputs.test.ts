import { copyFileSync, existsSync, readFileSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { hasStackTrace, ROOT, runCli, startCli, tempDir } from './run-cli';

const DEMO = join(ROOT, 'demo-data/windows.csv');

describe('gleaner analyze output safety', () => {
  it('refuses an --out that would overwrite the input file, and leaves the input untouched', () => {
    const dir = tempDir('same');
    const input = join(dir, 'windows.csv');
    copyFileSync(DEMO, input);
    const before = readFileSync(input);
    const r = runCli(['analyze', input, '--k', '3', '--out', dir]);
    expect(r.status).toBe(2);
    expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
    expect(r.stderr).toMatch(/refusing to write .*windows\.csv: it is the input file/);
    expect(readFileSync(input).equals(before)).toBe(true);
    expect(existsSync(join(dir, 'summary.json'))).toBe(false);
  });

  it('creates a missing --out folder (nested) and leaves no temporary files behind', () => {
    const out = join(tempDir('nested'), 'a', 'b');
    const r = runCli(['analyze', DEMO, '--k', '3', '--restarts', '1', '--out', out]);
    expect(r.status).toBe(0);
    expect(readdirSync(out).sort()).toEqual(['study.gleaner', 'summary.json', 'windows.csv']);
  });

  it('fails with one line when --k exceeds the number of windows', () => {
    const dir = tempDir('bigk');
    const r = runCli(['analyze', DEMO, '--k', '999999', '--out', dir]);
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/^gleaner: invalid --k: 999999 \(expected at most the number of windows \(\d+\)\)/);
    expect(hasStackTrace(r.stderr)).toBe(false);
  });

  it('names a missing input file in one line, exit 1', () => {
    const dir = tempDir('missing');
    const r = runCli(['analyze', join(dir, 'nope.csv'), '--out', dir]);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/^gleaner: cannot open .*nope\.csv: no such file or folder\n$/);
  });

  it('cancels cleanly on Ctrl-C (SIGINT): exit 130, a one-line notice, nothing written', async () => {
    const out = join(tempDir('cancel'), 'out');
    // 2000 restarts make clustering run far longer than the test waits, so only a working cancel
    // ends it within the 20 s bound below.
    const child = startCli(['analyze', DEMO, '--k', '7', '--restarts', '2000', '--progress', 'lines', '--out', out]);
    let stderr = '';
    const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
    await new Promise<void>((resolve, reject) => {
      child.stderr.on('data', (chunk: Buffer) => {
        stderr += chunk.toString();
        if (/clustering/.test(stderr)) resolve();
      });
      child.on('exit', () => reject(new Error(`exited before clustering: ${stderr}`)));
    });
    child.kill('SIGINT');
    const code = await Promise.race([exited, new Promise((r) => setTimeout(() => r('still running'), 20_000))]);
    if (code === 'still running') child.kill('SIGKILL');
    expect(code).toBe(130);
    expect(stderr.trimEnd().split('\n').pop()).toBe('gleaner: cancelled; nothing written');
    expect(existsSync(join(out, 'windows.csv'))).toBe(false);
  });
});
