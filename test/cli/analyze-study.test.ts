/**
 * `gleaner analyze` leaves <out>/study.gleaner: it decodes, names the input by its SHA-256 (computed
 * here with node:crypto), holds the run with the labels windows.csv lists, records the time
 * SOURCE_DATE_EPOCH gives, and `gleaner run` on it writes weak labels with those same clusters.
 */
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { copyFileSync, existsSync, readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { decodeStudy } from '../../src/core/study/decode';
import { outputTime } from '../../src/cli/source-date';
import { ROOT, tempDir } from './run-cli';

const DEMO = join(ROOT, 'demo-data/windows.csv');

/** The CLI run from the repository root (where tsx resolves) on files of `dir`, named relative to it. */
function cli(args: string[], dir: string, env: Record<string, string | undefined>) {
  const inDir = (a: string) => (/^(windows\.csv|out|again|exports)(\/|$)/.test(a) ? join(dir, a) : a);
  const r = spawnSync(process.execPath, ['--import', 'tsx', 'src/cli/main.ts', ...args.map(inDir)], {
    cwd: ROOT, encoding: 'utf8', timeout: 180_000, env: { ...process.env, ...env },
  });
  if (r.error) throw r.error;
  return r;
}

/** The values of one column of a CSV file without quoted fields (both files here have none in these columns). */
function column(csv: string, name: string): string[] {
  const [header, ...lines] = csv.trimEnd().split('\n');
  const j = header.split(',').indexOf(name);
  expect(j, `${name} in ${header}`).toBeGreaterThanOrEqual(0);
  return lines.map((l) => l.split(',')[j]);
}

describe('gleaner analyze writes study.gleaner', () => {
  for (const c of [
    { name: 'k-means', flags: ['--k', '5', '--seed', '3'] },
    { name: 'ward tree, windows dropped by the recipe', flags: ['--cluster', 'ward', '--k', '6', '--impute', 'drop'], blank: [5, 17, 40] },
  ]) {
    it(`${c.name}: the study holds the run of windows.csv, and gleaner run reproduces it`, () => {
      const dir = tempDir('analyze-study');
      copyFileSync(DEMO, join(dir, 'windows.csv'));
      if (c.blank) {
        // Leave the first feature (acc_x_mean, column 9) of a few windows empty.
        const lines = readFileSync(DEMO, 'utf8').split('\n');
        for (const row of c.blank) lines[row] = lines[row].split(',').map((v, j) => (j === 8 ? '' : v)).join(',');
        writeFileSync(join(dir, 'windows.csv'), lines.join('\n'));
      }
      const a = cli(['analyze', 'windows.csv', '--out', 'out', '--progress', 'none', ...c.flags], dir, { SOURCE_DATE_EPOCH: '0' });
      expect(a.status, a.stderr).toBe(0);
      expect(a.stdout).toContain('study.gleaner');
      const bytes = readFileSync(join(dir, 'out/study.gleaner'));
      const study = decodeStudy(new Uint8Array(bytes), 'study.gleaner');
      const input = readFileSync(join(dir, 'windows.csv'));
      expect(study.inputs).toEqual([{ fileName: 'windows.csv', path: '../windows.csv', sha256: createHash('sha256').update(input).digest('hex'), rows: input.toString('utf8').trimEnd().split('\n').length - 1 }]);
      expect(study.runs).toHaveLength(1);
      const run = study.runs[0];
      // SOURCE_DATE_EPOCH=0 is the Unix epoch itself.
      expect(run.createdAt).toBe('1970-01-01T00:00:00.000Z');
      expect(run.curation).toEqual({ actions: [], undone: [] });
      const windows = readFileSync(join(dir, 'out/windows.csv'), 'utf8');
      expect(Array.from(run.result.labels, (c) => String(c + 1))).toEqual(column(windows, 'cluster')); // files number clusters index + 1
      if (c.flags.includes('drop')) {
        expect(run.result.windows, 'the recipe dropped windows').toBeDefined();
        expect(run.result.windows!.length).toBe(study.inputs[0].rows - c.blank!.length);
      }

      // The same command again gives the same bytes.
      const again = cli(['analyze', 'windows.csv', '--out', 'again', '--progress', 'none', ...c.flags], dir, { SOURCE_DATE_EPOCH: '0' });
      expect(again.status, again.stderr).toBe(0);
      expect(readFileSync(join(dir, 'again/study.gleaner')).equals(bytes)).toBe(true);

      const r = cli(['run', 'out/study.gleaner', '--out', 'exports', '--progress', 'none'], dir, { SOURCE_DATE_EPOCH: '86400' });
      expect(r.status, r.stderr).toBe(0);
      expect(r.stderr, 'recomputed clusters equal the saved ones').not.toContain('differ');
      const weak = readFileSync(join(dir, 'exports/run-1/windows-weak-labels.csv'), 'utf8');
      expect(column(weak, 'cluster')).toEqual(column(windows, 'cluster'));
      expect(column(weak, 'window_id')).toEqual(column(windows, 'id'));
      expect(column(weak, 'confidence')).toEqual(column(windows, 'confidence'));
      const provenance = JSON.parse(readFileSync(join(dir, 'exports/run-1/windows-provenance.json'), 'utf8'));
      expect(provenance.createdAt).toBe('1970-01-02T00:00:00.000Z');
    }, 240_000);
  }

  it('refuses a malformed SOURCE_DATE_EPOCH with one line, before writing anything', () => {
    const dir = tempDir('analyze-study-bad');
    copyFileSync(DEMO, join(dir, 'windows.csv'));
    const a = cli(['analyze', 'windows.csv', '--out', 'out', '--progress', 'none'], dir, { SOURCE_DATE_EPOCH: '1.5e9' });
    expect(a.status).toBe(2);
    expect(a.stderr).toBe('gleaner: SOURCE_DATE_EPOCH must be a whole number of seconds since 1970-01-01 UTC, found "1.5e9" (see gleaner --help)\n');
    expect(existsSync(join(dir, 'out'))).toBe(false);
  }, 120_000);
});

describe('outputTime', () => {
  it('reads SOURCE_DATE_EPOCH as seconds, else takes the clock', () => {
    // 1700000000 s is 2023-11-14T22:13:20Z (as `date -u -d @1700000000` prints it).
    expect(outputTime({ SOURCE_DATE_EPOCH: '1700000000' })).toBe('2023-11-14T22:13:20.000Z');
    expect(outputTime({}, () => new Date(Date.UTC(2026, 0, 2, 3, 4, 5)))).toBe('2026-01-02T03:04:05.000Z');
    expect(outputTime({ SOURCE_DATE_EPOCH: '' }, () => new Date(Date.UTC(2026, 0, 2)))).toBe('2026-01-02T00:00:00.000Z');
    for (const bad of ['-1', 'now', ' 5', '99999999999999']) expect(() => outputTime({ SOURCE_DATE_EPOCH: bad })).toThrow(/SOURCE_DATE_EPOCH/);
  });
});
