import { describe, expect, it } from 'vitest';
import { join } from 'node:path';
import { writeFileSync } from 'node:fs';
import { parseSweepArgs } from '../../src/cli/sweep-command';
import { UsageError } from '../../src/cli/args';
import { hasStackTrace, runCli, tempDir } from './run-cli';

/** Fisher's iris (R/Fisher version, test/fixtures/iris.csv): its four measurements are features. */
const IRIS = 'test/fixtures/iris.csv';

describe('gleaner sweep', () => {
  it('prints one row of metrics per k, as a table and as JSON', () => {
    const table = runCli(['sweep', IRIS, '--k-min', '2', '--k-max', '4', '--progress', 'none']);
    expect(table.stderr).toBe('');
    expect(table.status).toBe(0);
    const lines = table.stdout.trim().split('\n');
    expect(lines[0].trim().split(/\s+/)).toEqual(['k', 'inertia', 'silhouette', 'calinski_harabasz', 'davies_bouldin']);
    expect(lines.slice(1).map((l) => l.trim().split(/\s+/)[0])).toEqual(['2', '3', '4']);

    const json = runCli(['sweep', IRIS, '--k-min', '2', '--k-max', '4', '--json', '--progress', 'none']);
    expect(json.status).toBe(0);
    const out = JSON.parse(json.stdout) as { windows: number; features: number; rows: { k: number; inertia: number }[] };
    expect(out.windows).toBe(150);
    expect(out.features).toBe(4);
    expect(out.rows.map((r) => r.k)).toEqual([2, 3, 4]);
    // The table shows the JSON's inertia to 2 decimals.
    expect(lines[2].trim().split(/\s+/)[1]).toBe(out.rows[1].inertia.toFixed(2));
    // Deterministic for a seed (default seed 1).
    expect(runCli(['sweep', IRIS, '--k-min', '2', '--k-max', '4', '--json', '--progress', 'none']).stdout).toBe(json.stdout);
  });

  it('exits 2 with one line on a bad range, 1 on a missing file', () => {
    const bad = runCli(['sweep', IRIS, '--k-min', '5', '--k-max', '3']);
    expect(bad.status).toBe(2);
    expect(bad.stderr).toMatch(/--k-max: "3"/);
    expect(hasStackTrace(bad.stderr)).toBe(false);
    const tooMany = runCli(['sweep', IRIS, '--k-max', '150', '--progress', 'none']);
    expect(tooMany.status).toBe(2);
    expect(tooMany.stderr).toMatch(/below the number of windows \(150\)/);
    const missing = runCli(['sweep', join(tempDir('sweep'), 'nope.csv')]);
    expect(missing.status).toBe(1);
    expect(missing.stderr).toMatch(/no such file/);
  });

  it('names file, row and column for a malformed table', () => {
    const dir = tempDir('sweep-bad');
    const file = join(dir, 'w.csv');
    writeFileSync(file, 'window_id,a,b\nw1,1,2\nw2,3,x\nw3,5,6\n');
    const r = runCli(['sweep', file, '--k-max', '2', '--progress', 'none']);
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/w.csv, row 3, column "b": expected a number/);
    expect(r.stderr.split('\n').filter(Boolean)).toHaveLength(1);
    expect(hasStackTrace(r.stderr)).toBe(false);
  });
});

describe('parseSweepArgs', () => {
  it('defaults to k 2..12 and rejects unknown flags', () => {
    expect(parseSweepArgs(['w.csv'])).toMatchObject({ input: 'w.csv', kMin: 2, kMax: 12, json: false });
    expect(parseSweepArgs(['--help'])).toBeNull();
    expect(() => parseSweepArgs(['w.csv', '--k', '3'])).toThrow(UsageError);
    expect(() => parseSweepArgs(['w.csv', '--k-min', '1'])).toThrow(/k-min/);
  });
});
