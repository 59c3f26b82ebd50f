import { describe, expect, it } from 'vitest';
import { runUmap, Umap } from '../../../../src/core/embed/umap/index';
import { CancelledError, OptionError } from '../../../../src/core/errors';
import { quietContext, type JobContext } from '../../../../src/core/job';
import { trustworthiness } from '../../../../src/core/metrics/trustworthiness';
import { irisMatrix } from '../../iris';

const iris = irisMatrix();

async function irisMap(seed: number, init: 'spectral' | 'pca' = 'spectral'): Promise<Float32Array> {
  return runUmap(iris.data, iris.n, iris.d, { neighbors: 10, minDist: 0.01, seed, init }, quietContext);
}

describe('UMAP on iris', () => {
  it('reaches trustworthiness(k = 10) ≥ 0.97 with n_neighbors 10, min_dist 0.01', async () => {
    // Source: lmcinnes/umap umap/tests (iris, n_neighbors 10, min_dist 0.01, trustworthiness ≥ 0.97);
    // iris is the R/Fisher version.
    for (const init of ['spectral', 'pca'] as const) {
      const coords = await irisMap(42, init);
      expect(coords.length).toBe(300);
      expect(coords.every(Number.isFinite)).toBe(true);
      expect(trustworthiness(iris.data, iris.n, iris.d, coords, 2, 10)).toBeGreaterThanOrEqual(0.97);
    }
  });

  it('gives identical coordinates for the same seed and different ones for another seed', async () => {
    const a = await irisMap(7);
    const b = await irisMap(7);
    const c = await irisMap(8);
    expect(Array.from(a)).toEqual(Array.from(b));
    expect(Array.from(a)).not.toEqual(Array.from(c));
  });

  it('runs with the cosine metric, building its graph from cosine distances', async () => {
    const umap = new Umap(iris.data, iris.n, iris.d, { neighbors: 10, metric: 'cosine', epochs: 50, seed: 5 });
    await umap.init();
    // Every listed distance is a cosine distance: in [0, 2].
    expect(umap.knn!.distances.every((v) => v >= 0 && v <= 2)).toBe(true);
    while (umap.step());
    expect(umap.coords().every(Number.isFinite)).toBe(true);
  });

  it('steps one epoch at a time and ends after the requested epochs', async () => {
    const umap = new Umap(iris.data, iris.n, iris.d, { neighbors: 10, epochs: 30, seed: 3 });
    expect(() => umap.step()).toThrow(/before init/);
    await umap.init();
    const start = umap.coords();
    let more = true;
    let steps = 0;
    while (more) {
      more = umap.step();
      steps++;
      expect(umap.epoch).toBe(steps);
    }
    expect(steps).toBe(30);
    expect(Array.from(umap.coords())).not.toEqual(Array.from(start));
    // Stepping by small edge slices reaches exactly the same layout as whole epochs.
    const sliced = new Umap(iris.data, iris.n, iris.d, { neighbors: 10, epochs: 30, seed: 3 });
    await sliced.init();
    while (sliced.stepEdges(37));
    expect(Array.from(sliced.coords())).toEqual(Array.from(umap.coords()));
  });
});

describe('UMAP options', () => {
  it('defaults as UMAP does: 15 neighbours, min_dist 0.1, spread 1, 500 epochs up to 10k windows, else 200', () => {
    // Defaults: lmcinnes/umap (n_neighbors 15, min_dist 0.1, umap/umap_.py); the epoch
    // rule (500 for ≤ 10,000 samples, else 200) from the same implementation's docs (from memory).
    const o = new Umap(iris.data, iris.n, iris.d).options;
    expect(o).toMatchObject({ neighbors: 15, minDist: 0.1, spread: 1, metric: 'euclidean', epochs: 500, negativeSampleRate: 5, learningRate: 1, init: 'spectral' });
    const big = new Umap(new Float64Array(10_001), 10_001, 1).options;
    expect(big.epochs).toBe(200);
  });

  it('rejects bad values naming the option', () => {
    const make = (o: object) => () => new Umap(iris.data, iris.n, iris.d, o);
    expect(make({ neighbors: 150 })).toThrow(OptionError);
    expect(make({ neighbors: 1 })).toThrow(/neighbors/);
    expect(make({ minDist: 2 })).toThrow(/minDist/);
    expect(make({ spread: 0 })).toThrow(/spread/);
    expect(make({ metric: 'l1' })).toThrow(/metric/);
    expect(make({ epochs: 0 })).toThrow(/epochs/);
    expect(make({ init: 'random' })).toThrow(/init/);
    expect(make({ learningRate: -1 })).toThrow(/learningRate/);
  });
});

describe('runUmap as a job', () => {
  it('reports rising progress under "UMAP" and checkpoints between slices', async () => {
    const fractions: number[] = [];
    let checkpoints = 0;
    const ctx: JobContext = {
      progress(stage, f) {
        expect(stage).toBe('UMAP');
        fractions.push(f);
      },
      checkpoint: () => { checkpoints++; return Promise.resolve(); },
    };
    const frames: number[] = [];
    await runUmap(iris.data, iris.n, iris.d, { neighbors: 10, epochs: 50, seed: 1 }, ctx, (_c, epoch) => frames.push(epoch));
    expect(fractions[0]).toBe(0);
    expect(fractions[fractions.length - 1]).toBe(1);
    for (let t = 1; t < fractions.length; t++) expect(fractions[t]).toBeGreaterThanOrEqual(fractions[t - 1]);
    expect(frames[frames.length - 1]).toBe(50);
    expect(checkpoints).toBeGreaterThan(5);
  });

  it('stops with CancelledError at the first checkpoint after a cancel, with no further frames', async () => {
    let cancelled = false;
    let framesAfterCancel = 0;
    const ctx: JobContext = {
      progress() {},
      checkpoint: () => (cancelled ? Promise.reject(new CancelledError()) : Promise.resolve()),
    };
    const run = runUmap(iris.data, iris.n, iris.d, { neighbors: 10, epochs: 400, seed: 1 }, ctx, (_c, epoch) => {
      if (cancelled) framesAfterCancel++;
      if (epoch >= 20) cancelled = true;
    });
    await expect(run).rejects.toBeInstanceOf(CancelledError);
    expect(framesAfterCancel).toBe(0);
  });
});
