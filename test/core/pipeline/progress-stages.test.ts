import { describe, expect, it } from 'vitest';
import { DEFAULT_ANALYSIS_PARAMS, type AnalysisParams, type FeatureMatrix } from '../../../src/core/analysis.types';
import { analyze } from '../../../src/core/analyze';
import type { JobContext } from '../../../src/core/job';
import { normal, seededRandom } from '../../../src/core/random';

/** Seeded Gaussian blobs: 3 centres 6 apart on the axes, unit noise. */
function blobs(n: number, d: number): FeatureMatrix {
  const random = seededRandom(11);
  const data = new Float64Array(n * d);
  for (let i = 0; i < n; i++) for (let j = 0; j < d; j++) data[i * d + j] = (j % 3 === i % 3 ? 6 : 0) + normal(random);
  return { data, n, d, featureNames: Array.from({ length: d }, (_, j) => `f${j}`) };
}

interface Report { stage: string; fraction: number; detail?: string }

async function reports(params: Partial<AnalysisParams>): Promise<Report[]> {
  const out: Report[] = [];
  const ctx: JobContext = { progress: (stage, fraction, detail) => void out.push({ stage, fraction, ...(detail ? { detail } : {}) }), checkpoint: () => Promise.resolve() };
  await analyze(blobs(600, 6), { ...DEFAULT_ANALYSIS_PARAMS, k: 3, seed: 2, ...params }, ctx);
  return out;
}

/** The stage names in order of first appearance (each once). */
const order = (rs: Report[]) => rs.map((r) => r.stage).filter((s, i, all) => all.indexOf(s) === i);

describe('analyze: progress names each stage, with its own detail', () => {
  it('UMAP with sample-then-place: scaling, embedding (epochs), placing (windows), quality, clustering, silhouette', async () => {
    const rs = await reports({ embed: { method: 'umap', neighbors: 10, minDist: 0.1, metric: 'euclidean', epochs: 30 }, sampleAbove: 200 });
    expect(order(rs)).toEqual(['scaling', 'embedding', 'placing', 'quality', 'clustering', 'silhouette']);
    const embedding = rs.filter((r) => r.stage === 'embedding').map((r) => r.detail ?? '');
    expect(embedding).toContain('UMAP · epoch 30 / 30');
    const placing = rs.filter((r) => r.stage === 'placing');
    // Its own counter: 400 windows placed around the 200 of the sample; never an epoch.
    expect(placing[0].detail).toBe('0 / 400 windows');
    expect(placing[placing.length - 1].detail).toBe('400 / 400 windows');
    expect(placing.every((r) => /^[\d,]+ \/ 400 windows$/.test(r.detail ?? ''))).toBe(true);
    expect(rs.filter((r) => r.stage !== 'embedding').some((r) => /epoch|iteration/.test(r.detail ?? ''))).toBe(false);
    // The bar only moves forward.
    for (let i = 1; i < rs.length; i++) expect(rs[i].fraction, `${rs[i].stage} after ${rs[i - 1].stage}`).toBeGreaterThanOrEqual(rs[i - 1].fraction);
  });

  it('t-SNE: the embedding counts iterations; hierarchical clustering names its steps under clustering', async () => {
    const rs = await reports({ embed: { method: 'tsne', perplexity: 10, iterations: 60 }, cluster: { method: 'ward', k: 3 } });
    expect(order(rs)).toEqual(['scaling', 'embedding', 'quality', 'clustering', 'silhouette']);
    expect(rs.some((r) => r.stage === 'embedding' && r.detail === 't-SNE · iteration 60 / 60')).toBe(true);
    expect(rs.filter((r) => r.stage === 'clustering').some((r) => r.detail !== undefined && r.detail !== '')).toBe(true);
    for (let i = 1; i < rs.length; i++) expect(rs[i].fraction).toBeGreaterThanOrEqual(rs[i - 1].fraction);
  });

  it('PCA: the embedding says PCA', async () => {
    const rs = await reports({});
    expect(order(rs)).toEqual(['scaling', 'embedding', 'clustering', 'silhouette']);
    expect(rs.find((r) => r.stage === 'embedding')?.detail).toBe('PCA');
  });
});
