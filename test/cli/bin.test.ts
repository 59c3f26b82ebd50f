import { spawnSync } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { BAD_INPUTS } from '../fixtures/bad-inputs';
import { ROOT, tempDir } from './run-cli';

// The installable `gleaner` command: bin/gleaner.js running the bundle scripts/build-cli.mjs writes.
function gleaner(args: string[], cwd: string) {
  const r = spawnSync(process.execPath, [join(ROOT, 'bin/gleaner.js'), ...args], { cwd, encoding: 'utf8', timeout: 120_000 });
  if (r.error) throw r.error;
  return r;
}

beforeAll(() => {
  const r = spawnSync(process.execPath, ['scripts/build-cli.mjs'], { cwd: ROOT, encoding: 'utf8', timeout: 120_000 });
  expect(r.stderr).toBe('');
  expect(r.status).toBe(0);
}, 120_000);

describe('bin/gleaner.js (built CLI)', () => {
  it('runs from any folder and reports its version', () => {
    const pkg = JSON.parse(readFileSync(join(ROOT, 'package.json'), 'utf8')) as { version: string };
    const r = gleaner(['--version'], tempDir('bin'));
    expect(r.status).toBe(0);
    expect(r.stdout.trim()).toBe(`gleaner ${pkg.version}`);
  });

  it('runs the analysis in its worker thread and writes both outputs', () => {
    const dir = tempDir('bin-run');
    const r = gleaner(['analyze', join(ROOT, 'demo-data/windows.csv'), '--k', '3', '--restarts', '1', '--out', 'out'], dir);
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    expect(readFileSync(join(dir, 'out/windows.csv'), 'utf8').split('\n')[0]).toBe('id,subject,start,end,x,y,cluster,cluster_name,confidence');
    expect(JSON.parse(readFileSync(join(dir, 'out/summary.json'), 'utf8')).cluster.k).toBe(3);
  });

  it('reports bad input in one line, exit 1', () => {
    const dir = tempDir('bin-bad');
    const bad = BAD_INPUTS.find((b) => b.name.startsWith('ragged'))!;
    writeFileSync(join(dir, bad.fileName), bad.content);
    const r = gleaner(['analyze', bad.fileName, '--out', 'out'], dir);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(bad.expected);
    expect(r.stderr.trimEnd().split('\n')).toHaveLength(1);
  });
});
