import { readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { describe, expect, it } from 'vitest';
import { hdbscan } from '../../../src/core/cluster/hdbscan';
import { adjustedRandIndex } from '../../../src/core/metrics/ari';

// Reference labels computed with R's dbscan package, hdbscan(x, minPts) (Debian r-cran-dbscan
// 1.1.11), by test/fixtures/hdbscan/make-reference.R on three open datasets of R's `datasets`
// package (iris, faithful, quakes; sources in test/fixtures/hdbscan/SOURCE.md). R numbers noise 0.
const DIR = resolve(import.meta.dirname, '../../fixtures/hdbscan');

function table(name: string): { data: Float64Array; n: number; d: number } {
  const lines = readFileSync(join(DIR, `${name}.csv`), 'utf8').trim().split('\n').slice(1);
  const rows = lines.map((l) => l.split(',').map(Number));
  return { data: Float64Array.from(rows.flat()), n: rows.length, d: rows[0].length };
}

const reference = new Map<string, number[]>();
for (const line of readFileSync(join(DIR, 'labels.csv'), 'utf8').trim().split('\n').slice(1)) {
  const [set, minPts, , cluster] = line.split(',');
  const key = `${set.replaceAll('"', '')} ${minPts}`;
  if (!reference.has(key)) reference.set(key, []);
  reference.get(key)!.push(Number(cluster));
}

describe('HDBSCAN against R dbscan::hdbscan', () => {
  it.each([...reference.keys()])('%s: same noise windows, ARI ≥ 0.99', async (key) => {
    const [set, minPts] = key.split(' ');
    const { data, n, d } = table(set);
    const expected = reference.get(key)!;
    expect(expected).toHaveLength(n);
    const result = await hdbscan(data, n, d, { minClusterSize: Number(minPts) });
    const ours = Array.from(result.labels);
    const noiseOurs = ours.flatMap((c, i) => (c < 0 ? [i] : []));
    const noiseR = expected.flatMap((c, i) => (c === 0 ? [i] : []));
    expect(noiseOurs).toEqual(noiseR);
    expect(result.clusters).toBe(new Set(expected.filter((c) => c > 0)).size);
    expect(adjustedRandIndex(ours, expected)).toBeGreaterThanOrEqual(0.99);
  });
});

describe('HDBSCAN basics', () => {
  it('finds two separated groups and calls the far window noise (worked example, common practice)', async () => {
    // Two tight groups of 6 on a line and one window far from both.
    const xs = [0, 0.1, 0.2, 0.3, 0.4, 0.5, 10, 10.1, 10.2, 10.3, 10.4, 10.5, 50];
    const r = await hdbscan(Float64Array.from(xs), xs.length, 1, { minClusterSize: 3 });
    expect(r.clusters).toBe(2);
    expect(Array.from(r.labels)).toEqual([0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 1, -1]);
    expect(r.stability.every((s) => s > 0)).toBe(true);
  });

  it('refuses a minimum cluster size below 2 and more samples than windows', async () => {
    const x = Float64Array.from([0, 1, 2]);
    await expect(hdbscan(x, 3, 1, { minClusterSize: 1 })).rejects.toThrow('invalid minClusterSize: 1 (expected an integer ≥ 2)');
    await expect(hdbscan(x, 3, 1, { minClusterSize: 2, minSamples: 4 })).rejects.toThrow('invalid minSamples: 4 (expected at most the 3 windows)');
  });
});
