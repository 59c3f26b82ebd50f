import { describe, expect, it } from 'vitest';
import { DEFAULT_ANALYSIS_PARAMS, type AnalysisParams, type FeatureMatrix } from '../../src/core/analysis.types';
import { analyze } from '../../src/core/analyze';
import { CancelledError, OptionError } from '../../src/core/errors';
import { quietContext, type JobContext } from '../../src/core/job';
import { adjustedRandIndex } from '../../src/core/metrics/ari';
import { normal, seededRandom } from '../../src/core/random';
import { irisMatrix } from './iris';

const params = (p: Partial<AnalysisParams> = {}): AnalysisParams => ({ ...DEFAULT_ANALYSIS_PARAMS, k: 3, ...p });

/** Seeded Gaussian blobs: k centres 8 apart on the axes, unit noise, some missing values. */
function blobs(n: number, d: number, k: number, seed: number): FeatureMatrix & { truth: Int32Array } {
  const random = seededRandom(seed);
  const data = new Float64Array(n * d);
  const truth = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const c = i % k;
    truth[i] = c;
    for (let j = 0; j < d; j++) data[i * d + j] = (j % k === c ? 8 : 0) + normal(random);
  }
  for (let i = 0; i < n; i += 17) data[i * d + (i % d)] = NaN;
  return { data, n, d, featureNames: Array.from({ length: d }, (_, j) => `f${j}`), truth };
}

describe('analyze(matrix, params, ctx)', () => {
  it('runs the baseline recipe, PCA and k-means on iris', async () => {
    const m = irisMatrix();
    const r = await analyze(m, params({ seed: 1 }), quietContext);
    expect(r.recipe.map((s) => s.step)).toEqual(['zscore', 'impute']);
    expect(r.coords).toHaveLength(300);
    // Standardized iris PCA: PC1+PC2 ≈ 72.96% + 22.85% (R prcomp(scale. = TRUE), from memory).
    if (r.embed.method !== 'pca') throw new Error(`expected a PCA map, got ${r.embed.method}`);
    expect(r.embed.explainedVarianceRatio[0]).toBeCloseTo(0.7296, 3);
    expect(r.embed.explainedVarianceRatio[1]).toBeCloseTo(0.2285, 3);
    // Standardized iris, k = 3: best inertia 139.82 (scikit-learn KMeans on StandardScaler'd iris, from memory;
    // a nearby local optimum, 139.8254, is what some seeds reach).
    if (r.cluster.method !== 'kmeans') throw new Error(`expected k-means, got ${r.cluster.method}`);
    expect(r.cluster.inertia).toBeCloseTo(139.8205, 3);
    expect(Array.from(r.sizes)).toEqual([53, 50, 47]);
    expect(r.sizes.reduce((a, b) => a + b, 0)).toBe(150);
    for (let i = 0; i < 150; i++) {
      expect(r.confidence[i]).toBeGreaterThanOrEqual(0);
      expect(r.confidence[i]).toBeLessThanOrEqual(1);
    }
    expect(r.metrics.silhouetteSampleSize).toBe(150);
    expect(r.metrics.silhouette).toBeGreaterThan(0.4);
    expect(r.metrics.silhouette).toBeLessThan(0.5);
  });

  it('recovers planted blobs, with missing values filled', async () => {
    const m = blobs(600, 10, 4, 3);
    const r = await analyze(m, params({ k: 4, seed: 2, restarts: 3, silhouetteSample: 200 }), quietContext);
    expect(adjustedRandIndex(r.labels, m.truth)).toBeGreaterThan(0.99);
    expect((r.recipe[1].effect as { filled: number }).filled).toBe(Math.ceil(600 / 17));
    expect(r.metrics.silhouetteSampleSize).toBe(200);
  });

  it('gives identical results for the same seed', async () => {
    const m = blobs(400, 6, 3, 9);
    const a = await analyze(m, params({ seed: 42, restarts: 2, silhouetteSample: 100 }), quietContext);
    const b = await analyze(m, params({ seed: 42, restarts: 2, silhouetteSample: 100 }), quietContext);
    expect(b.labels).toEqual(a.labels);
    expect(b.coords).toEqual(a.coords);
    expect(b.confidence).toEqual(a.confidence);
    expect(b.metrics.silhouette).toBe(a.metrics.silhouette);
  });

  it('reports progress in order and ends at 1', async () => {
    const seen: number[] = [];
    const ctx: JobContext = { progress: (_s, f) => seen.push(f), checkpoint: () => Promise.resolve() };
    await analyze(blobs(200, 4, 3, 1), params({ restarts: 2 }), ctx);
    expect(seen.at(-1)).toBe(1);
    for (let i = 1; i < seen.length; i++) expect(seen[i]).toBeGreaterThanOrEqual(seen[i - 1]);
  });

  it('rejects with CancelledError when a checkpoint is cancelled', async () => {
    let calls = 0;
    const ctx: JobContext = {
      progress() {},
      checkpoint: () => (++calls >= 3 ? Promise.reject(new CancelledError()) : Promise.resolve()),
    };
    await expect(analyze(blobs(200, 4, 3, 1), params(), ctx)).rejects.toBeInstanceOf(CancelledError);
  });

  it('validates parameters at the edge', async () => {
    const m = blobs(10, 2, 2, 1);
    await expect(analyze(m, params({ k: 1 }), quietContext)).rejects.toBeInstanceOf(OptionError);
    await expect(analyze(m, params({ k: 2.5 }), quietContext)).rejects.toThrow(/invalid k/);
    await expect(analyze(m, params({ restarts: 0 }), quietContext)).rejects.toThrow(/restarts/);
    await expect(analyze(m, params({ maxIterations: -1 }), quietContext)).rejects.toThrow(/maxIterations/);
    await expect(analyze(m, params({ seed: NaN }), quietContext)).rejects.toThrow(/seed/);
  });

  it('says how many windows were found and how many are needed', async () => {
    const five = blobs(5, 2, 2, 1);
    await expect(analyze(five, params({ k: 8 }), quietContext)).rejects.toThrow(/found 5 windows, k = 8 needs at least 8/);
    const one = { data: Float64Array.from([1, 2]), n: 1, d: 2, featureNames: ['a', 'b'] };
    await expect(analyze(one, params({ k: 2 }), quietContext)).rejects.toThrow(/found 1 window; .* at least 2/);
  });
});
