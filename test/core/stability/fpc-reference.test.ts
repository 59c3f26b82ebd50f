/**
 * Our Jaccard matching and per-cluster figures against R's fpc::clusterboot (the implementation of
 * Hennig 2007 by its author), replaying the subsets and partitions it used: test/fixtures/stability/
 * (SOURCE.md there; written by make-reference.R with fpc 2.2-10).
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { matchClusters } from '../../../src/core/stability/jaccard';
import { summarizeStability } from '../../../src/core/stability/summarize';

const fixture = (name: string) => readFileSync(fileURLToPath(new URL(`../../fixtures/stability/${name}`, import.meta.url)), 'utf8');
const rows = (text: string) => text.trimEnd().split('\n').slice(1).map((l) => l.split(',').map((v) => Number(v.replace(/"/g, ''))));
const partitions = rows(fixture('partitions.csv'));
const reference = rows(fixture('jaccard.csv'));

describe.each([3, 6])('Ward on iris cut into k = %i, 20 subsets (fpc clusterboot, bootmethod "subset")', (k) => {
  const calls = new Map<number, { row: number; cluster: number }[]>();
  for (const [pk, call, row, cluster] of partitions) {
    if (pk !== k) continue;
    if (!calls.has(call)) calls.set(call, []);
    calls.get(call)!.push({ row, cluster });
  }
  const ref = reference.filter((r) => r[0] === k);
  const B = 20;

  it('has the partitions of the whole set and of every subset', () => {
    expect(calls.size).toBe(B + 1);
    expect(calls.get(0)!.length).toBe(150);
    expect(ref.length).toBe(k * B);
  });

  it('gives the same best Jaccard per cluster and resample, mean and dissolution count', () => {
    const original = new Int32Array(151).fill(-2);
    for (const { row, cluster } of calls.get(0)!) original[row] = cluster - 1;
    const jaccard = new Float64Array(B * k);
    for (let b = 1; b <= B; b++) {
      const subset = calls.get(b)!;
      const kr = Math.max(...subset.map((s) => s.cluster));
      const m = matchClusters(Int32Array.from(subset, (s) => original[s.row]), Int32Array.from(subset, (s) => s.cluster - 1), k, kr);
      jaccard.set(m.jaccard, (b - 1) * k);
    }
    for (const [, cluster, resample, j] of ref) expect(jaccard[(resample - 1) * k + cluster - 1]).toBeCloseTo(j, 12);
    const summary = summarizeStability(jaccard, k, Array.from({ length: B }, () => []), []);
    for (let c = 1; c <= k; c++) {
      const [, , , , mean, dissolved] = ref.find((r) => r[1] === c)!;
      expect(summary[c - 1].meanJaccard!).toBeCloseTo(mean, 12);
      expect(summary[c - 1].dissolvedShare! * B).toBeCloseTo(dissolved, 12);
    }
  });
});
