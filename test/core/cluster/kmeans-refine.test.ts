import { describe, expect, it } from 'vitest';
import { kmeans } from '../../../src/core/cluster/kmeans';
import { inertia, runLloyd } from '../../../src/core/cluster/lloyd';
import { refineKMeans } from '../../../src/core/cluster/refine';
import { proposeMove, splitCluster } from '../../../src/core/cluster/split-merge';
import { CancelledError } from '../../../src/core/errors';
import { quietContext } from '../../../src/core/job';
import { adjustedRandIndex } from '../../../src/core/metrics/ari';
import { normal, seededRandom } from '../../../src/core/random';

/** Within-cluster sum of squares of a labelling, written out (definition: common practice). */
function sse(data: Float64Array, n: number, d: number, labels: ArrayLike<number>, k: number): number {
  const sums = new Float64Array(k * d);
  const counts = new Float64Array(k);
  for (let i = 0; i < n; i++) { counts[labels[i]]++; for (let j = 0; j < d; j++) sums[labels[i] * d + j] += data[i * d + j]; }
  let s = 0;
  for (let i = 0; i < n; i++) for (let j = 0; j < d; j++) s += (data[i * d + j] - sums[labels[i] * d + j] / counts[labels[i]]) ** 2;
  return s;
}

/**
 * Planted data (seeded generator): three unit-variance blobs in d = 3, 150 windows each, A at the
 * origin and B, C at (60, ∓10, 0). B and C are 20 standard deviations apart and 60 from A, so the
 * planted partition is the optimum for k = 3 (every window is far nearer its own blob's mean).
 * The forced seeding puts two centres inside A (its mean ± 1 along x) and one midway between B and
 * C: Lloyd splits A in two halves and keeps B and C merged, a fixed point, since B's and C's windows
 * are about 10 from the shared centre and about 60 from either half of A.
 */
function planted() {
  const random = seededRandom(20240701);
  const per = 150;
  const d = 3;
  const blobs = [[0, 0, 0], [60, -10, 0], [60, 10, 0]];
  const n = per * blobs.length;
  const data = new Float64Array(n * d);
  const truth = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const c = i % blobs.length;
    truth[i] = c;
    for (let j = 0; j < d; j++) data[i * d + j] = blobs[c][j] + normal(random);
  }
  const meanA = [0, 0, 0];
  for (let i = 0; i < n; i += 3) for (let j = 0; j < d; j++) meanA[j] += data[i * d + j] / per;
  const bad = Float64Array.from([meanA[0] - 1, meanA[1], meanA[2], meanA[0] + 1, meanA[1], meanA[2], 60, 0, 0]);
  return { data, n, d, truth, bad };
}

describe('split–merge refinement', () => {
  it('leaves a planted split-one-merge-two optimum that plain Lloyd keeps', async () => {
    const { data, n, d, truth, bad } = planted();
    const best = sse(data, n, d, truth, 3);
    // Plain Lloyd from the forced seeding stays in the bad optimum (reasoning in `planted`).
    const lloyd = await runLloyd(data, n, d, bad, 0, 300, () => Promise.resolve());
    expect(lloyd.converged).toBe(true);
    expect(inertia(lloyd)).toBeGreaterThan(10 * best);
    expect(adjustedRandIndex(lloyd.labels, truth)).toBeLessThan(0.7);
    // The move merges the two halves of A (clusters 0 and 1) and splits the B + C cluster (2).
    const move = proposeMove(data, n, d, 3, lloyd.labels, 0);
    expect(move).not.toBeNull();
    expect(move?.merged).toEqual([0, 1]);
    expect(move?.split).toBe(2);
    expect(move?.predicted).toBeLessThan(0);
    // Refined from the same centres: the planted partition (ARI 1 up to relabelling) and its sum of squares.
    const refined = await refineKMeans(data, n, d, bad, 300, 3, quietContext);
    expect(refined.refinements).toBe(1);
    expect(adjustedRandIndex(refined.labels, truth)).toBe(1);
    expect(refined.inertia).toBeCloseTo(best, 6);
    expect(refined.inertia).toBeCloseTo(sse(data, n, d, refined.labels, 3), 6);
    expect(refined.converged).toBe(true);
  });

  it('splits two groups where they part, with the gain in sum of squares written out', () => {
    // Two groups of four windows on a line, at 0..0.3 and 10..10.3 (d = 1): the best split is between
    // the groups; gain = SS(all) − SS(left) − SS(right) (definition: common practice).
    const xs = [0, 0.1, 0.2, 0.3, 10, 10.1, 10.2, 10.3];
    const data = Float64Array.from(xs);
    const mean = Float64Array.from([xs.reduce((a, b) => a + b) / xs.length]);
    const ss = (v: number[]) => { const m = v.reduce((a, b) => a + b) / v.length; return v.reduce((a, b) => a + (b - m) ** 2, 0); };
    const { halves, gain } = splitCluster(data, 1, Int32Array.from(xs.keys()), mean);
    expect(gain).toBeCloseTo(ss(xs) - ss(xs.slice(0, 4)) - ss(xs.slice(4)), 10);
    expect([halves[0], halves[1]].sort((a, b) => a - b)).toEqual([expect.closeTo(0.15, 10), expect.closeTo(10.15, 10)]);
  });

  it('is deterministic for a seed and never ends above plain restarted Lloyd', async () => {
    const random = seededRandom(7);
    const n = 600;
    const d = 4;
    const data = new Float64Array(n * d);
    for (let i = 0; i < n; i++) for (let j = 0; j < d; j++) data[i * d + j] = 6 * (i % 6 === j ? 1 : 0) + normal(random);
    const opts = (refineRounds?: number) => ({ k: 6, restarts: 2, maxIterations: 300, tol: 1e-4, random: seededRandom(11), refineRounds });
    const a = await kmeans(data, n, d, opts());
    const b = await kmeans(data, n, d, opts());
    expect(b.labels).toEqual(a.labels);
    expect(b.centres).toEqual(a.centres);
    expect(b.inertia).toBe(a.inertia);
    const plain = await kmeans(data, n, d, opts(0));
    expect(a.inertia).toBeLessThanOrEqual(plain.inertia);
    expect(a.inertia).toBeCloseTo(sse(data, n, d, a.labels, 6), 6);
  });
});

describe('kmeans edge cases with the refinement', () => {
  const opts = (k: number) => ({ k, restarts: 2, maxIterations: 100, tol: 1e-4, random: seededRandom(3) });

  it('k = 1 gives the total sum of squares about the mean', async () => {
    const data = Float64Array.from([1, 2, 3, 5, 8, 13]);
    const r = await kmeans(data, 3, 2, opts(1));
    expect(Array.from(r.labels)).toEqual([0, 0, 0]);
    // Windows (1, 2), (3, 5), (8, 13): means (4, 20/3); the sum of squares about them, written out
    // as the definition (common practice), is 26 + 582/9.
    const total = (1 - 4) ** 2 + (3 - 4) ** 2 + (8 - 4) ** 2 + (2 - 20 / 3) ** 2 + (5 - 20 / 3) ** 2 + (13 - 20 / 3) ** 2;
    expect(r.inertia).toBeCloseTo(total, 10);
  });

  it('k = n puts every window in its own cluster', async () => {
    const data = Float64Array.from([0, 0, 5, 1, -3, 7, 2, 2, 9, -4]);
    const r = await kmeans(data, 5, 2, opts(5));
    expect(new Set(r.labels).size).toBe(5);
    expect(r.inertia).toBe(0);
  });

  it('handles duplicate windows, with more clusters than distinct windows', async () => {
    // Three distinct windows, five copies each.
    const rows = [[0, 0], [4, 0], [0, 4]];
    const data = Float64Array.from(Array.from({ length: 15 }, (_, i) => rows[i % 3]).flat());
    const three = await kmeans(data, 15, 2, opts(3));
    expect(three.inertia).toBe(0);
    expect(adjustedRandIndex(three.labels, Array.from({ length: 15 }, (_, i) => i % 3))).toBe(1);
    const five = await kmeans(data, 15, 2, opts(5));
    expect(five.inertia).toBe(0);
    expect(five.centres.every(Number.isFinite)).toBe(true);
    // Every centre, even one left without windows, sits on a window.
    for (let c = 0; c < 5; c++) expect(rows.some((r) => r[0] === five.centres[c * 2] && r[1] === five.centres[c * 2 + 1])).toBe(true);
  });
});

describe('kmeans progress and cancellation through the refinement', () => {
  it('reports rising progress ending at 1 and stops at a cancelled checkpoint inside the refinement', async () => {
    const { data, n, d } = planted();
    const opts = (refineRounds?: number) => ({ k: 3, restarts: 2, maxIterations: 300, tol: 1e-4, random: seededRandom(5), refineRounds });
    // Checkpoints taken by the restarts alone (refinement off).
    let plainCalls = 0;
    await kmeans(data, n, d, opts(0), { progress() {}, checkpoint: () => { plainCalls++; return Promise.resolve(); } });
    const fractions: number[] = [];
    let calls = 0;
    await kmeans(data, n, d, opts(), { progress() {}, checkpoint: () => { calls++; return Promise.resolve(); } }, (f) => fractions.push(f));
    expect(calls).toBeGreaterThan(plainCalls);
    for (let i = 1; i < fractions.length; i++) expect(fractions[i]).toBeGreaterThanOrEqual(fractions[i - 1]);
    expect(fractions[fractions.length - 1]).toBe(1);
    // Cancel at the first checkpoint after the restarts: the refinement must stop there.
    let seen = 0;
    const cancelling = { progress() {}, checkpoint: () => (++seen > plainCalls ? Promise.reject(new CancelledError()) : Promise.resolve()) };
    await expect(kmeans(data, n, d, opts(), cancelling)).rejects.toBeInstanceOf(CancelledError);
  });
});
