import { describe, expect, it } from 'vitest';
import { DEFAULT_ANALYSIS_PARAMS, type AnalysisParams, type AnalysisPartial } from '../../../src/core/analysis.types';
import { analyze } from '../../../src/core/analyze';
import { cutTree, hierarchical, windowLabels } from '../../../src/core/cluster/hierarchy';
import { OptionError } from '../../../src/core/errors';
import { quietContext, type JobContext } from '../../../src/core/job';
import { applyRecipe } from '../../../src/core/recipe/apply';
import { DEFAULT_RECIPE } from '../../../src/core/recipe/recipe.types';
import { blobs } from './blobs';

const params = (p: Partial<AnalysisParams>): AnalysisParams => ({ ...DEFAULT_ANALYSIS_PARAMS, k: 3, restarts: 3, ...p });
const TSNE = { method: 'tsne', perplexity: 10, iterations: 120 } as const;
const UMAP = { method: 'umap', neighbors: 8, minDist: 0.1, metric: 'euclidean', epochs: 40 } as const;

describe('analyze: embedding choices', () => {
  it('keeps the default run unchanged: no choices = PCA + k-means, no quality, nothing placed', async () => {
    const a = await analyze(blobs(3, 40, 6), params({}), quietContext);
    const b = await analyze(blobs(3, 40, 6), params({ embed: { method: 'pca' }, cluster: { method: 'kmeans', k: 3, restarts: 3, maxIterations: 300 }, space: 'features' }), quietContext);
    expect(b.coords).toEqual(a.coords);
    expect(b.labels).toEqual(a.labels);
    expect(b.confidence).toEqual(a.confidence);
    expect(Object.keys(a.embed)).toEqual(['method', 'components', 'explainedVarianceRatio']);
    expect(Object.keys(a.cluster)).toEqual(['method', 'k', 'restarts', 'maxIterations', 'init', 'iterations', 'inertia', 'converged', 'refinements']);
    expect(a.placed).toBeUndefined();
    expect(a.tree).toBeUndefined();
  });

  it('t-SNE: same seed, identical map and clusters; another seed, another map', async () => {
    const a = await analyze(blobs(3, 40, 6), params({ embed: TSNE }), quietContext);
    const b = await analyze(blobs(3, 40, 6), params({ embed: TSNE }), quietContext);
    const c = await analyze(blobs(3, 40, 6), params({ embed: TSNE, seed: 2 }), quietContext);
    expect(b.coords).toEqual(a.coords);
    expect(b.labels).toEqual(a.labels);
    expect(c.coords).not.toEqual(a.coords);
    expect(a.embed).toMatchObject({ method: 'tsne', perplexity: 10, iterations: 120, preReduced: null, sampleSize: 120, qualitySampleSize: 120 });
  });

  it('PCA map of rank-2 data keeps every neighbourhood: trustworthiness 1 and all 10 neighbours kept', async () => {
    // Features that are two independent columns and linear mixes of them: after z-scoring the data
    // still spans a plane, which PCA maps isometrically (up to rotation), so ranks are preserved
    // (a property of orthogonal projection onto the data's own span; common practice).
    const base = blobs(1, 150, 2, 11);
    const n = base.n, d = 4;
    const data = new Float64Array(n * d);
    for (let i = 0; i < n; i++) {
      const x = base.data[2 * i], y = base.data[2 * i + 1];
      data.set([x, y, x + y, x - y], i * d);
    }
    // z-scoring rescales columns, which changes distances; a recipe with no scaling keeps them.
    const r = await analyze({ data, n, d, featureNames: ['a', 'b', 'c', 'e'] }, params({ quality: true, recipe: { version: 1, steps: [] } }), quietContext);
    expect(r.embed.trustworthiness).toBeCloseTo(1, 10);
    expect(r.embed.neighbourhoodPreservation).toBeCloseTo(1, 10);
  });

  it('pre-reduces to preReduce principal axes when there are more features, and says so', async () => {
    const r = await analyze(blobs(3, 30, 12), params({ embed: TSNE, preReduce: 5 }), quietContext);
    expect(r.embed).toMatchObject({ method: 'tsne', preReduced: 5 });
    const s = await analyze(blobs(3, 30, 4), params({ embed: TSNE, preReduce: 5 }), quietContext);
    expect(s.embed).toMatchObject({ preReduced: null });
  });

  it('samples then places above sampleAbove: the sample is embedded, the rest placed and marked', async () => {
    const r = await analyze(blobs(3, 100, 6), params({ embed: UMAP, sampleAbove: 100 }), quietContext);
    expect(r.placed).toBeDefined();
    const placed = r.placed!.reduce((s, v) => s + v, 0);
    expect(placed).toBe(200);
    expect(r.embed).toMatchObject({ method: 'umap', sampleSize: 100, sampling: { threshold: 100, embedded: 100, placed: 200, neighbours: 10, stratifiedBy: 'subject' } });
    expect(r.coords).toHaveLength(600);
    for (const v of r.coords) expect(Number.isFinite(v)).toBe(true);
    // Placed windows land among their own blob: clusters on the map still match the planted blobs.
    const m = new Map<string, number>();
    const truth = blobs(3, 100, 6).truth;
    for (let i = 0; i < 300; i++) m.set(`${truth[i]}:${r.labels[i]}`, (m.get(`${truth[i]}:${r.labels[i]}`) ?? 0) + 1);
    expect(Math.max(...m.values())).toBeGreaterThanOrEqual(95);
  });

  it('offers the layout so far through ctx.partial only when the driver wants one', async () => {
    const offers: AnalysisPartial[] = [];
    const ctx = (wants: boolean): JobContext => ({ ...quietContext, wantsPartial: () => wants, partial: (v) => offers.push(v as AnalysisPartial) });
    await analyze(blobs(3, 40, 6), params({ embed: UMAP }), ctx(false));
    expect(offers).toHaveLength(0);
    await analyze(blobs(3, 40, 6), params({ embed: UMAP }), ctx(true));
    expect(offers.length).toBeGreaterThanOrEqual(2); // runUmap offers a frame per slice of edges that completed an epoch
    expect(offers[0]).toMatchObject({ kind: 'layout', unit: 'epoch', steps: 40 });
    expect(offers[0].coords).toHaveLength(240);
    expect(offers[offers.length - 1].step).toBe(40);
    expect(offers[0].windows).toBeUndefined(); // all rows, in order
  });

  it('names the input row of each live point when a sample is embedded; the final map keeps the last frame as it is', async () => {
    const offers: AnalysisPartial[] = [];
    const ctx: JobContext = { ...quietContext, wantsPartial: () => true, partial: (v) => offers.push(v as AnalysisPartial) };
    const r = await analyze(blobs(3, 60, 6), params({ embed: UMAP, sampleAbove: 100 }), ctx);
    const last = offers[offers.length - 1];
    expect(last.step).toBe(40);
    const rows = last.windows!;
    expect(rows).toHaveLength(100);
    expect(new Set(rows).size).toBe(100);
    expect(Math.max(...rows)).toBeLessThan(180);
    expect(offers[0].windows).not.toBe(rows); // a copy per partial (posted partials are transferred)
    // No centring or scaling after the last epoch: the embedded windows sit where the last frame drew them.
    for (let s = 0; s < rows.length; s++) {
      expect(r.coords[2 * rows[s]]).toBe(last.coords[2 * s]);
      expect(r.coords[2 * rows[s] + 1]).toBe(last.coords[2 * s + 1]);
      expect(r.placed![rows[s]]).toBe(0);
    }
  });
});

describe('analyze: clustering choices', () => {
  it('hierarchical labels are the cut of the returned tree, and of the tree built directly on the scaled features', async () => {
    const m = blobs(4, 25, 5);
    const r = await analyze(m, params({ cluster: { method: 'average', k: 4 } }), quietContext);
    expect(r.tree).toBeDefined();
    expect(r.labels).toEqual(windowLabels(cutTree(r.tree!, { k: 4 }), r.treeLeafOf!));
    const prepared = await applyRecipe(blobs(4, 25, 5), {}, DEFAULT_RECIPE);
    const direct = await hierarchical(prepared.data, prepared.n, prepared.d, { linkage: 'average' });
    expect(r.labels).toEqual(cutTree(direct, { k: 4 }));
    expect(r.cluster).toMatchObject({ method: 'hierarchical', linkage: 'average', k: 4, path: 'exact', space: 'features' });
    expect(Array.from(r.sizes).reduce((a, b) => a + b, 0)).toBe(100);
  });

  it('cuts at a height: every cluster joined at or below it, k recorded', async () => {
    const r = await analyze(blobs(4, 25, 5), params({ cluster: { method: 'ward', cutHeight: 20 } }), quietContext);
    expect(r.labels).toEqual(cutTree(r.tree!, { height: 20 }));
    expect(r.cluster).toMatchObject({ method: 'hierarchical', linkage: 'ward', cutHeight: 20 });
    expect(r.cluster.k).toBe(new Set(r.labels).size);
  });

  it("space 'map' clusters the map coordinates: each window is nearest its own cluster's centre in the map", async () => {
    const r = await analyze(blobs(3, 40, 6), params({ embed: TSNE, space: 'map' }), quietContext);
    expect(r.cluster).toMatchObject({ method: 'kmeans', space: 'map', converged: true });
    const k = r.cluster.k, n = r.labels.length;
    const cx = new Float64Array(k), cy = new Float64Array(k), cnt = new Float64Array(k);
    for (let i = 0; i < n; i++) { cx[r.labels[i]] += r.coords[2 * i]; cy[r.labels[i]] += r.coords[2 * i + 1]; cnt[r.labels[i]]++; }
    for (let c = 0; c < k; c++) { cx[c] /= cnt[c]; cy[c] /= cnt[c]; }
    // A converged Lloyd iteration leaves every window with its nearest centre (common practice).
    for (let i = 0; i < n; i++) {
      let best = 0, bestD = Infinity;
      for (let c = 0; c < k; c++) {
        const dd = (r.coords[2 * i] - cx[c]) ** 2 + (r.coords[2 * i + 1] - cy[c]) ** 2;
        if (dd < bestD) { bestD = dd; best = c; }
      }
      expect(best).toBe(r.labels[i]);
    }
    // Centroids stay in the scaled feature space (k × d).
    expect(r.centroids).toHaveLength(k * 6);
  });

  it('rejects a tree choice with both k and a cut height, and a cut that leaves one cluster', async () => {
    await expect(analyze(blobs(3, 20, 4), params({ cluster: { method: 'ward', k: 3, cutHeight: 1 } as never }), quietContext)).rejects.toBeInstanceOf(OptionError);
    await expect(analyze(blobs(3, 20, 4), params({ cluster: { method: 'single', cutHeight: 1e9 } }), quietContext)).rejects.toThrow(/leaves 1/);
    await expect(analyze(blobs(3, 20, 4), params({ embed: { method: 'umap', neighbors: 1, minDist: 0.1, metric: 'euclidean' } }), quietContext)).rejects.toBeInstanceOf(OptionError);
  });
});
