import { beforeAll, describe, expect, it } from 'vitest';
import { kmeans } from '../../../../src/core/cluster/kmeans';
import { FFT_MIN_N, TSNE_DEFAULTS, Tsne, learningRateOf, repulsionOf, resolveTsneOptions, runTsne } from '../../../../src/core/embed/tsne';
import { pca } from '../../../../src/core/embed/pca';
import { CancelledError, OptionError } from '../../../../src/core/errors';
import { quietContext } from '../../../../src/core/job';
import { adjustedRandIndex } from '../../../../src/core/metrics/ari';
import { trustworthiness } from '../../../../src/core/metrics/trustworthiness';
import { normal, seededRandom } from '../../../../src/core/random';

/** Seeded blobs: k centres N(0, 4²) per feature, unit noise; window i belongs to blob i mod k. */
function blobs(n: number, d: number, k: number, seed: number) {
  const random = seededRandom(seed);
  const centres = Float64Array.from({ length: k * d }, () => 4 * normal(random));
  const data = new Float64Array(n * d);
  const truth = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    truth[i] = i % k;
    for (let j = 0; j < d; j++) data[i * d + j] = centres[truth[i] * d + j] + normal(random);
  }
  return { data, truth };
}

describe('t-SNE options', () => {
  it('defaults follow scikit-learn and openTSNE; learning rate auto = max(n / exaggeration / 4, 50)', () => {
    // scikit-learn TSNE defaults (sklearn/manifold/_t_sne.py): perplexity 30,
    // early exaggeration 12, learning rate "auto" = max(N / 12 / 4, 50), angle 0.5. Iterations: openTSNE's
    // defaults, 250 exaggerated + 500 (from memory); scikit-learn runs 1000 in all.
    expect(TSNE_DEFAULTS).toMatchObject({ perplexity: 30, earlyExaggeration: 12, iterations: 750, theta: 0.5, learningRate: 'auto', exaggerationIterations: 250 });
    expect(learningRateOf(resolveTsneOptions({}, 24_000), 24_000)).toBe(500);
    expect(learningRateOf(resolveTsneOptions({}, 1000), 1000)).toBe(50);
    expect(learningRateOf(resolveTsneOptions({ learningRate: 200 }, 1000), 1000)).toBe(200);
  });

  it('rejects bad options with an OptionError naming the option', () => {
    expect(() => resolveTsneOptions({ perplexity: 0 }, 100)).toThrow(OptionError);
    expect(() => resolveTsneOptions({ perplexity: 100 }, 100)).toThrow(/perplexity/);
    expect(() => resolveTsneOptions({ theta: 1.5 }, 100)).toThrow(/theta/);
    expect(() => resolveTsneOptions({ iterations: 2.5 }, 100)).toThrow(/iterations/);
    expect(() => resolveTsneOptions({ learningRate: -1 }, 100)).toThrow(/learningRate/);
    expect(() => resolveTsneOptions({}, 3)).toThrow(/windows/);
    expect(() => resolveTsneOptions({ repulsion: 'grid' as never }, 100)).toThrow(/repulsion/);
    expect(() => new Tsne(Float64Array.from([1, 2, NaN, 4, 5, 6, 7, 8]), 4, 2, { perplexity: 1 }).init()).toThrow(/window 2, feature 1/);
  });
});

describe('repulsion option', () => {
  it("'auto' picks Barnes–Hut below FFT_MIN_N windows and the FFT from there; an explicit choice is kept", () => {
    expect(repulsionOf(resolveTsneOptions({}, FFT_MIN_N - 1), FFT_MIN_N - 1)).toBe('barnes-hut');
    expect(repulsionOf(resolveTsneOptions({}, FFT_MIN_N), FFT_MIN_N)).toBe('fft');
    expect(repulsionOf(resolveTsneOptions({ repulsion: 'fft' }, 100), 100)).toBe('fft');
    expect(repulsionOf(resolveTsneOptions({ repulsion: 'barnes-hut' }, 50_000), 50_000)).toBe('barnes-hut');
    expect(new Tsne(new Float64Array(400), 100, 4, { perplexity: 5, repulsion: 'fft' }).repulsion).toBe('fft');
  });
});

describe('Tsne determinism', () => {
  const { data } = blobs(300, 10, 3, 5);
  const run = (seed: number) => {
    const t = new Tsne(data, 300, 10, { seed, iterations: 120, exaggerationIterations: 60 });
    t.init();
    while (t.step()) { /* run to the end */ }
    return t.coords();
  };

  it('the same seed gives identical coordinates, a different seed different ones', () => {
    const a = run(7);
    expect(run(7)).toEqual(a);
    const b = run(8);
    let moved = 0;
    for (let t = 0; t < a.length; t++) moved = Math.max(moved, Math.abs(a[t] - b[t]));
    expect(moved).toBeGreaterThan(1e-3);
  });

  it('with FFT repulsion, the same seed gives identical coordinates', () => {
    const go = () => {
      const t = new Tsne(data, 300, 10, { seed: 7, iterations: 80, exaggerationIterations: 40, repulsion: 'fft' });
      t.init();
      while (t.step()) { /* run to the end */ }
      return t.coords();
    };
    const a = go();
    expect(go()).toEqual(a);
    expect(a.every(Number.isFinite)).toBe(true);
  });

  it('step() counts iterations and returns false once finished', () => {
    const t = new Tsne(data, 300, 10, { iterations: 3, exaggerationIterations: 1 });
    expect(() => t.step()).toThrow(/init/);
    t.init();
    expect([t.step(), t.step(), t.step(), t.step()]).toEqual([true, true, true, false]);
    expect(t.iteration).toBe(3);
    expect(t.cost).toBeGreaterThan(0); // evaluated on the last iteration
  });
});

describe('Tsne on seeded blobs (1,000 windows, d = 20, 5 blobs)', () => {
  const n = 1000, d = 20;
  const { data, truth } = blobs(n, d, 5, 42);
  let coords: Float32Array;
  const costs = new Map<number, number>();

  beforeAll(() => {
    const t = new Tsne(data, n, d, { seed: 3 });
    t.init();
    while (t.step()) if (t.iteration % 50 === 0 && t.cost !== undefined) costs.set(t.iteration, t.cost);
    coords = t.coords();
  }, 180_000);

  it('keeps neighbourhoods: trustworthiness(k = 10) at least 0.95 and above a 2-D PCA of the same data', () => {
    // Floor: blobs in 20-D with unit noise have no 2-D linear structure inside a blob, so PCA (the best
    // linear map) is the baseline a neighbour-preserving map must beat; t-SNE maps of separated clusters
    // commonly score >= 0.95 at k = 10 (common practice; scikit-learn's own t-SNE tests use floors 0.9-0.95).
    const tw = trustworthiness(data, n, d, coords, 2, 10);
    const linear = trustworthiness(data, n, d, pca(data, n, d, 2).scores, 2, 10);
    expect(tw).toBeGreaterThanOrEqual(0.95);
    expect(tw).toBeGreaterThan(linear);
  });

  it('separates the blobs: k-means on the map recovers the truth (ARI >= 0.99)', async () => {
    const map = Float64Array.from(coords);
    const km = await kmeans(map, n, 2, { k: 5, restarts: 5, maxIterations: 300, tol: 1e-6, random: seededRandom(1) });
    expect(adjustedRandIndex(km.labels, truth)).toBeGreaterThanOrEqual(0.99);
  });

  it('KL divergence is reported every 50 iterations and decreases after early exaggeration', () => {
    expect([...costs.keys()]).toEqual(Array.from({ length: TSNE_DEFAULTS.iterations / 50 }, (_, i) => 50 * (i + 1)));
    const after = [...costs.entries()].filter(([it]) => it >= 300).map(([, c]) => c);
    for (let i = 1; i < after.length; i++) expect(after[i]).toBeLessThanOrEqual(after[i - 1] + 1e-3);
    expect(after[after.length - 1]).toBeLessThan(after[0]);
  });
});

describe('Tsne with FFT repulsion on seeded blobs (1,000 windows, d = 20, 5 blobs)', () => {
  const n = 1000, d = 20;
  const { data, truth } = blobs(n, d, 5, 42);
  let coords: Float32Array;
  const costs: number[] = [];

  beforeAll(() => {
    const t = new Tsne(data, n, d, { seed: 3, repulsion: 'fft' });
    t.init();
    while (t.step()) if (t.iteration % 50 === 0 && t.cost !== undefined) costs.push(t.cost);
    coords = t.coords();
  }, 300_000);

  it('keeps neighbourhoods as well as the Barnes–Hut run: trustworthiness(k = 10) at least 0.95, above PCA', () => {
    // Same floor and baseline as the Barnes–Hut test above (common practice).
    const tw = trustworthiness(data, n, d, coords, 2, 10);
    expect(tw).toBeGreaterThanOrEqual(0.95);
    expect(tw).toBeGreaterThan(trustworthiness(data, n, d, pca(data, n, d, 2).scores, 2, 10));
  });

  it('separates the blobs (ARI >= 0.99) and the KL divergence falls after early exaggeration', async () => {
    const km = await kmeans(Float64Array.from(coords), n, 2, { k: 5, restarts: 5, maxIterations: 300, tol: 1e-6, random: seededRandom(1) });
    expect(adjustedRandIndex(km.labels, truth)).toBeGreaterThanOrEqual(0.99);
    expect(costs).toHaveLength(TSNE_DEFAULTS.iterations / 50);
    expect(costs[costs.length - 1]).toBeLessThan(costs[5]);
  });
});

describe('runTsne', () => {
  const { data } = blobs(200, 6, 2, 9);

  it('equals the stepped run, reports progress up to 1 and hands frames to onFrame', async () => {
    const options = { seed: 4, iterations: 60, exaggerationIterations: 20, perplexity: 10 };
    const fractions: number[] = [];
    const frames: number[] = [];
    const ctx = { progress: (stage: string, f: number) => { expect(stage).toBe('t-SNE'); fractions.push(f); }, checkpoint: () => Promise.resolve() };
    const y = await runTsne(data, 200, 6, options, ctx, (c, it) => { expect(c.length).toBe(400); frames.push(it); });
    const t = new Tsne(data, 200, 6, options);
    t.init();
    while (t.step()) { /* run to the end */ }
    expect(y).toEqual(t.coords());
    expect(frames).toEqual([10, 20, 30, 40, 50, 60]);
    for (let i = 1; i < fractions.length; i++) expect(fractions[i]).toBeGreaterThanOrEqual(fractions[i - 1]);
    expect(fractions[fractions.length - 1]).toBe(1);
  });

  it('stops with CancelledError when a checkpoint rejects', async () => {
    let calls = 0;
    const ctx = { ...quietContext, checkpoint: () => (++calls > 8 ? Promise.reject(new CancelledError()) : Promise.resolve()) };
    await expect(runTsne(data, 200, 6, { perplexity: 10 }, ctx)).rejects.toBeInstanceOf(CancelledError);
    expect(calls).toBe(9);
  });

  it('searches neighbours approximately when asked and still separates two blobs', async () => {
    // 1,100 windows: above the size NN-descent solves by brute force.
    const { data: two, truth } = blobs(1100, 8, 2, 12);
    const y = await runTsne(two, 1100, 8, { neighbors: 'approximate', iterations: 150, exaggerationIterations: 100, seed: 2 }, quietContext);
    const km = await kmeans(Float64Array.from(y), 1100, 2, { k: 2, restarts: 3, maxIterations: 100, tol: 1e-6, random: seededRandom(1) });
    expect(adjustedRandIndex(km.labels, truth)).toBe(1);
  });
});
