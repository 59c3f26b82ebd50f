/**
 * The demo study holds what it promises: activity clusters and a subject-bound (loose-watch)
 * cluster. Checked with ml-kmeans 7.0.1 (an outside reference library) on the committed
 * demo-data/windows.csv, z-scored, k = 7, the lowest-inertia of 10 seeded k-means++ starts.
 */
import { join } from 'node:path';
import { kmeans } from 'ml-kmeans';
import { describe, expect, it } from 'vitest';
import { FEATURE_NAMES } from '../../src/core/features';
import { adjustedRand, readDemoCsv } from './demo-csv';

const DIR = join(import.meta.dirname, '../../demo-data');

describe('adjustedRand (test helper)', () => {
  it('matches scikit-learn adjusted_rand_score docstring values', () => {
    // scikit-learn sklearn/metrics/cluster/_supervised.py docstrings (adjusted_rand_score).
    expect(adjustedRand([0, 0, 1, 1], [1, 1, 0, 0])).toBe(1);
    expect(adjustedRand([0, 0, 1, 2], [0, 0, 1, 1])).toBeCloseTo(4 / 7, 12);
    expect(adjustedRand([0, 0, 1, 1], [0, 1, 0, 1])).toBeCloseTo(-0.5, 12);
    // JuliaStats/Clustering.jl test/randindex.jl: ARI 0.403669.
    expect(adjustedRand([1, 1, 1, 2, 2, 2, 3, 3, 3, 3], [1, 1, 1, 1, 2, 2, 2, 2, 2, 2])).toBeCloseTo(0.403669, 5);
  });
});

describe('demo-data/windows.csv planted structure', () => {
  it('z-score + k-means (k = 7) finds the activities (ARI ≥ 0.5) and a loose-watch cluster', () => {
    const windows = readDemoCsv(join(DIR, 'windows.csv'));
    const truth = readDemoCsv(join(DIR, 'truth.csv'));
    const first = windows.header.indexOf(FEATURE_NAMES[0]);
    const X = windows.rows.map((r) => r.slice(first).map(Number));
    const d = X[0].length;
    for (let j = 0; j < d; j++) {
      let m = 0;
      for (const x of X) m += x[j];
      m /= X.length;
      let ss = 0;
      for (const x of X) ss += (x[j] - m) ** 2;
      const sd = Math.sqrt(ss / X.length) || 1;
      for (const x of X) x[j] = (x[j] - m) / sd;
    }
    let best: { clusters: number[]; inertia: number } | null = null;
    for (let seed = 1; seed <= 10; seed++) {
      const r = kmeans(X, 7, { seed, initialization: 'kmeans++', maxIterations: 300 });
      const inertia = r.computeInformation(X).reduce((s, c) => s + c.error * c.size, 0);
      if (!best || inertia < best.inertia) best = { clusters: r.clusters, inertia };
    }
    const clusters = best!.clusters;
    const activity = truth.rows.map((r) => r[1]);
    const loose = truth.rows.map((r) => r[2] === '1');
    // Target from the demo scenario: clearly above chance (ARI 0 is chance; Hubert & Arabie 1985).
    expect(adjustedRand(clusters, activity)).toBeGreaterThanOrEqual(0.5);
    const looseTotal = loose.filter(Boolean).length;
    const shares = Array.from({ length: 7 }, (_, c) => {
      const members = clusters.flatMap((v, i) => (v === c ? [i] : []));
      const looseIn = members.filter((i) => loose[i]).length;
      return { purity: looseIn / members.length, recall: looseIn / looseTotal };
    });
    const trap = shares.find((s) => s.purity >= 0.9 && s.recall >= 0.7);
    expect(trap, JSON.stringify(shares)).toBeDefined();
  });
});
