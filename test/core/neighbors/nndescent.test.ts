import { describe, expect, it } from 'vitest';
import { OptionError } from '../../../src/core/errors';
import { exactKnnSync } from '../../../src/core/neighbors/exact';
import { approximateKnn } from '../../../src/core/neighbors/nndescent';
import { exactKnnOfRows, neighbourRecall } from '../../../src/core/neighbors/recall';
import { normal, seededRandom } from '../../../src/core/random';

/** Seeded Gaussian blobs: `centres` centres drawn from N(0, 4²), unit noise around them. */
function blobs(n: number, d: number, centres: number, seed: number): Float64Array {
  const random = seededRandom(seed);
  const c = Float64Array.from({ length: centres * d }, () => 4 * normal(random));
  const x = new Float64Array(n * d);
  for (let i = 0; i < n; i++) {
    const b = Math.floor(random() * centres);
    for (let t = 0; t < d; t++) x[i * d + t] = c[b * d + t] + normal(random);
  }
  return x;
}

describe('approximateKnn (NN-descent)', () => {
  // Above the brute-force cut-off (1,024 rows), so the trees and the local joins do the work.
  const n = 3000;
  const d = 20;
  const data = blobs(n, d, 10, 11);

  it('finds at least 90% of the exact 15 nearest neighbours on seeded blobs (euclidean)', async () => {
    const approx = await approximateKnn(data, n, d, 15, { metric: 'euclidean', random: seededRandom(5) });
    const exact = exactKnnSync(data, n, d, 15, 'euclidean');
    expect(approx.k).toBe(15);
    expect(approx.n).toBe(n);
    // Recall target of the issue (≥ 0.9 at a few thousand points); exact neighbours by brute force.
    expect(neighbourRecall(approx, exact)).toBeGreaterThanOrEqual(0.9);
    let selfOrUnsorted = 0;
    for (let i = 0; i < n; i++) {
      for (let t = 0; t < 15; t++) {
        if (approx.indices[i * 15 + t] === i) selfOrUnsorted++;
        if (t > 0 && approx.distances[i * 15 + t] < approx.distances[i * 15 + t - 1]) selfOrUnsorted++;
      }
    }
    expect(selfOrUnsorted).toBe(0);
    // Reported distances are true Euclidean distances of the listed pairs.
    const i = 123;
    const j = approx.indices[i * 15];
    let s = 0;
    for (let t = 0; t < d; t++) s += (data[i * d + t] - data[j * d + t]) ** 2;
    expect(approx.distances[i * 15]).toBeCloseTo(Math.sqrt(s), 12);
  });

  it('is deterministic for a seed', async () => {
    const a = await approximateKnn(data, n, d, 10, { metric: 'euclidean', random: seededRandom(9) });
    const b = await approximateKnn(data, n, d, 10, { metric: 'euclidean', random: seededRandom(9) });
    expect(Array.from(a.indices)).toEqual(Array.from(b.indices));
    expect(Array.from(a.distances)).toEqual(Array.from(b.distances));
  });

  it('cosine equals euclidean on L2-normalized rows up to d_cos = d_euc² / 2 (common practice)', async () => {
    const unit = new Float64Array(n * d);
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let t = 0; t < d; t++) s += data[i * d + t] ** 2;
      for (let t = 0; t < d; t++) unit[i * d + t] = data[i * d + t] / Math.sqrt(s);
    }
    const cos = await approximateKnn(data, n, d, 10, { metric: 'cosine', random: seededRandom(3) });
    const euc = await approximateKnn(unit, n, d, 10, { metric: 'euclidean', random: seededRandom(3) });
    expect(Array.from(cos.indices)).toEqual(Array.from(euc.indices));
    for (let e = 0; e < cos.distances.length; e += 97) expect(cos.distances[e]).toBeCloseTo(euc.distances[e] ** 2 / 2, 12);
    // And the cosine distance is 1 − cos(a, b) computed directly.
    const i = 7;
    const j = cos.indices[i * 10 + 3];
    let dot = 0, na = 0, nb = 0;
    for (let t = 0; t < d; t++) {
      dot += data[i * d + t] * data[j * d + t];
      na += data[i * d + t] ** 2;
      nb += data[j * d + t] ** 2;
    }
    expect(cos.distances[i * 10 + 3]).toBeCloseTo(1 - dot / Math.sqrt(na * nb), 12);
    expect(neighbourRecall(cos, exactKnnSync(data, n, d, 10, 'cosine'))).toBeGreaterThanOrEqual(0.9);
  });

  it('checkpoints between slices of every phase (trees, candidate sampling, local joins), so a cancel stops it early', async () => {
    // Work per checkpoint bounded by rows, not by n: between two checkpoints at most about 1,024 rows
    // of leaves, candidate sampling or local join, so every tree and every round checkpoints
    // several times at 3,000 rows (counted with progress: reports at 0.3 end the trees).
    let checkpoints = 0, inTrees = 0, treesDone = false;
    const ctx = {
      checkpoint: async () => { checkpoints++; if (!treesDone) inTrees++; },
      progress: (_stage: string, fraction: number) => { if (fraction >= 0.3 - 1e-12) treesDone = true; },
    };
    const trees = 4;
    const rounds = 2;
    await approximateKnn(data, n, d, 15, { metric: 'euclidean', random: seededRandom(5), ctx, trees, maxIterations: rounds, delta: 0 });
    // Each tree: one checkpoint before it plus one per slice of leaves (≥ 3 slices at 3,000 rows).
    expect(inTrees).toBeGreaterThanOrEqual(trees * 4);
    // Each round: ≥ 3 slices each of sampling, marking and joining.
    expect(checkpoints - inTrees).toBeGreaterThanOrEqual(rounds * 9);
    // A checkpoint that rejects stops the search.
    let calls = 0;
    const cancelling = { checkpoint: async () => { if (++calls > 10) throw new Error('cancelled'); }, progress: () => {} };
    await expect(approximateKnn(data, n, d, 15, { metric: 'euclidean', random: seededRandom(5), ctx: cancelling })).rejects.toThrow('cancelled');
    expect(calls).toBe(11);
  });

  it('is exact on small inputs', async () => {
    const small = blobs(200, 5, 3, 2);
    const approx = await approximateKnn(small, 200, 5, 8, { metric: 'euclidean', random: seededRandom(1) });
    const exact = exactKnnSync(small, 200, 5, 8, 'euclidean');
    expect(neighbourRecall(approx, exact)).toBe(1);
  });

  it('rejects bad options and non-finite values', async () => {
    const small = blobs(50, 3, 2, 4);
    await expect(approximateKnn(small, 50, 3, 50, { metric: 'euclidean', random: seededRandom(1) })).rejects.toThrow(OptionError);
    await expect(approximateKnn(small, 50, 3, 5, { metric: 'manhattan' as never, random: seededRandom(1) })).rejects.toThrow(/metric/);
    const bad = Float64Array.from(small);
    bad[3 * 3 + 1] = NaN;
    await expect(approximateKnn(bad, 50, 3, 5, { metric: 'euclidean', random: seededRandom(1) })).rejects.toThrow(/row 4, feature 2/);
  });
});

describe('neighbourRecall and exactKnnOfRows', () => {
  it('exactKnnOfRows agrees with the full exact search on its rows', () => {
    const data = blobs(400, 6, 4, 8);
    const full = exactKnnSync(data, 400, 6, 5, 'euclidean');
    const rows = [0, 17, 399];
    const sample = exactKnnOfRows(data, 400, 6, rows, 5, 'euclidean');
    rows.forEach((r, s) => {
      expect(Array.from(sample.indices.subarray(s * 5, s * 5 + 5))).toEqual(Array.from(full.indices.subarray(r * 5, r * 5 + 5)));
    });
    expect(neighbourRecall(full, sample)).toBe(1);
  });

  it('counts the shared neighbours per row', () => {
    const approx = { n: 2, k: 2, indices: Int32Array.from([1, 0, 0, 1]), distances: new Float64Array(4) };
    // Row 1's exact list [0, 2] shares one of two entries with the approximate [0, 1].
    expect(neighbourRecall(approx, { k: 2, rows: [1], indices: Int32Array.from([0, 2]) })).toBe(0.5);
  });
});
