/**
 * A whole cohort on an engine a lab already runs: examples/dask-apply.py starts a real Dask
 * LocalCluster (a scheduler and two worker processes on loopback, started and stopped by the
 * script this test runs), maps `gleaner apply` over four subject partitions, and the labels it
 * writes equal the single-process apply of the whole file, row for row. Needs Debian's
 * python3-distributed under /usr/bin/python3 (.ci/run installs it; scripts/test.mjs does when it can).
 */
import { spawnSync } from 'node:child_process';
import { copyFileSync, mkdirSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { CAUTIONS } from '../../src/core/cautions';
import { ROOT, tempDir } from './run-cli';

const PYTHON = '/usr/bin/python3';
const DEMO = join(ROOT, 'demo-data/windows.csv');
const LINES = readFileSync(DEMO, 'utf8').trimEnd().split('\n');
const SUBJECT = LINES[0].split(',').indexOf('subject');
const GLEANER = `${process.execPath} --import tsx ${join(ROOT, 'src/cli/main.ts')}`;

function cli(args: string[]) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', 'src/cli/main.ts', ...args], { cwd: ROOT, encoding: 'utf8', timeout: 240_000, env: { ...process.env, SOURCE_DATE_EPOCH: '0' } });
  if (r.error) throw r.error;
  return r;
}

/** Every *.labels.csv under a folder, in path order. */
function labelFiles(dir: string): string[] {
  const out: string[] = [];
  for (const name of readdirSync(dir).sort()) {
    const p = join(dir, name);
    if (statSync(p).isDirectory()) out.push(...labelFiles(p));
    else if (name.endsWith('.labels.csv')) out.push(p);
  }
  return out;
}
const body = (path: string) => readFileSync(path, 'utf8').trimEnd().split('\n').slice(1);

describe('examples/dask-apply.py on a local Dask cluster', { timeout: 600_000 }, () => {
  it('labels four subject partitions exactly as one process labels the whole file', () => {
    const probe = spawnSync(PYTHON, ['-c', 'import distributed; print(distributed.__version__)'], { encoding: 'utf8' });
    expect(probe.status, `Dask's distributed package is missing under ${PYTHON}: install Debian's python3-distributed (apt-get install python3-distributed)`).toBe(0);

    const dir = tempDir('dask-apply');
    copyFileSync(DEMO, join(dir, 'windows.csv'));
    const a = cli(['analyze', join(dir, 'windows.csv'), '--out', join(dir, 'study'), '--k', '6', '--seed', '4', '--progress', 'none']);
    expect(a.status, a.stderr).toBe(0);
    const study = join(dir, 'study', 'study.gleaner');

    // Four partitions holding whole subjects, as docs/apply.md asks.
    const groups = [['S01', 'S02', 'S03'], ['S04', 'S05', 'S06'], ['S07', 'S08', 'S09'], ['S10', 'S11', 'S12']];
    mkdirSync(join(dir, 'dataset'));
    groups.forEach((g, t) => {
      const lines = LINES.slice(1).filter((l) => g.includes(l.split(',')[SUBJECT]));
      writeFileSync(join(dir, 'dataset', `part-${t}.csv`), `${[LINES[0], ...lines].join('\n')}\n`);
    });

    const whole = cli(['apply', study, join(dir, 'windows.csv'), '--out', join(dir, 'whole'), '--progress', 'none']);
    expect(whole.status, whole.stderr).toBe(0);

    const dask = spawnSync(PYTHON, [join(ROOT, 'examples/dask-apply.py'), study, join(dir, 'dataset'), '--out', join(dir, 'cohort'), '--workers', '2', '--gleaner', GLEANER], {
      // Dask's workers keep their scratch space inside this test's folder (removed with it).
      cwd: ROOT, encoding: 'utf8', timeout: 480_000, env: { ...process.env, SOURCE_DATE_EPOCH: '0', DASK_TEMPORARY_DIRECTORY: join(dir, 'dask-scratch') },
    });
    if (dask.error) throw dask.error;
    expect(dask.status, `${dask.stdout}\n${dask.stderr}`).toBe(0);

    const parts = labelFiles(join(dir, 'cohort'));
    expect(parts).toHaveLength(4);
    const joined = parts.flatMap(body);
    expect(joined).toHaveLength(LINES.length - 1);
    // The demo file lists subjects in order, so the partitions in path order concatenate to the whole.
    expect(joined).toEqual(body(join(dir, 'whole', 'windows.labels.csv')));

    const cohort = JSON.parse(readFileSync(join(dir, 'cohort', 'cohort.json'), 'utf8'));
    expect(cohort.cautions).toEqual(CAUTIONS);
  });
});
