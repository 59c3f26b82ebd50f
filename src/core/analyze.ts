import type { AnalysisParams, AnalysisResult, FeatureMatrix } from './analysis.types';
import { centreConfidence } from './cluster/confidence';
import { kmeans } from './cluster/kmeans';
import { relabelBySize } from './cluster/relabel';
import { pca } from './embed/pca';
import { OptionError } from './errors';
import type { JobContext } from './job';
import { sampleIndices } from './metrics/sample';
import { mean, silhouetteSamples } from './metrics/silhouette';
import { seededRandom } from './random';
import { baselineRecipe } from './recipe/baseline';

/** Relative k-means tolerance (centre shift against mean feature variance), common practice. */
const KMEANS_TOL = 1e-4;

/** Share of the job's progress bar each stage takes, in order. */
const STAGES = { scaling: [0, 0.05], embedding: [0.05, 0.15], clustering: [0.15, 0.9], silhouette: [0.9, 1] } as const;

function isInt(v: unknown): v is number {
  return typeof v === 'number' && Number.isInteger(v);
}

/** Checks analysis parameters against each other and the matrix; throws OptionError or Error. */
export function validateAnalysis(matrix: FeatureMatrix, params: AnalysisParams): void {
  const { k, seed, restarts, maxIterations, silhouetteSample } = params;
  if (!isInt(k) || k < 2) throw new OptionError('k', k, 'an integer of at least 2');
  if (typeof seed !== 'number' || !Number.isFinite(seed)) throw new OptionError('seed', seed, 'a finite number');
  if (!isInt(restarts) || restarts < 1) throw new OptionError('restarts', restarts, 'an integer of at least 1');
  if (!isInt(maxIterations) || maxIterations < 1) throw new OptionError('maxIterations', maxIterations, 'an integer of at least 1');
  if (!isInt(silhouetteSample) || silhouetteSample < 2) throw new OptionError('silhouetteSample', silhouetteSample, 'an integer of at least 2');
  const { n, d, data } = matrix;
  if (!isInt(n) || !isInt(d) || d < 1 || data.length !== n * d) {
    throw new Error(`feature matrix shape does not fit its data: n = ${n}, d = ${d}, ${data.length} values`);
  }
  if (n < 2) throw new Error(`found ${n} window${n === 1 ? '' : 's'}; an analysis needs at least 2 windows`);
  if (n < k) throw new OptionError('k', k, `at most the number of windows: found ${n} windows, k = ${k} needs at least ${k}`);
}

/**
 * The baseline analysis: z-score + mean imputation, PCA to 2-D for the map, k-means with
 * k-means++ seeding and restarts in the scaled feature space, per-window confidence, and the
 * mean silhouette on a seeded sample. Same matrix, params and seed give identical results.
 */
export async function analyze(matrix: FeatureMatrix, params: AnalysisParams, ctx: JobContext): Promise<AnalysisResult> {
  validateAnalysis(matrix, params);
  const { n, d } = matrix;
  const { k, restarts, maxIterations, silhouetteSample } = params;
  const random = seededRandom(params.seed);
  const stage = (name: keyof typeof STAGES, f: number) => {
    const [a, b] = STAGES[name];
    ctx.progress(name, a + (b - a) * f);
  };

  stage('scaling', 0);
  const { data, recipe } = baselineRecipe(matrix);
  await ctx.checkpoint();

  stage('embedding', 0);
  const p = pca(data, n, d, 2);
  const coords = new Float32Array(2 * n);
  for (let i = 0; i < n; i++) {
    coords[2 * i] = p.scores[i * p.nComponents];
    coords[2 * i + 1] = p.nComponents > 1 ? p.scores[i * p.nComponents + 1] : 0;
  }
  const ratios = [p.explainedVarianceRatio[0], p.nComponents > 1 ? p.explainedVarianceRatio[1] : 0];
  await ctx.checkpoint();

  stage('clustering', 0);
  const km = await kmeans(data, n, d, { k, restarts, maxIterations, tol: KMEANS_TOL, random }, ctx, (f) => stage('clustering', f));
  const { labels, centres, sizes } = relabelBySize(km.labels, km.centres, k, d);
  const confidence = centreConfidence(data, n, d, centres, k);
  await ctx.checkpoint();

  stage('silhouette', 0);
  const sample = sampleIndices(n, silhouetteSample, random);
  const m = sample.length;
  const sampled = new Float64Array(m * d);
  const sampledLabels = new Int32Array(m);
  for (let s = 0; s < m; s++) {
    sampled.set(data.subarray(sample[s] * d, sample[s] * d + d), s * d);
    sampledLabels[s] = labels[sample[s]];
  }
  const silhouette = mean(silhouetteSamples({ data: sampled, n: m, d }, sampledLabels));
  stage('silhouette', 1);

  return {
    recipe,
    embed: { method: 'pca', components: 2, explainedVarianceRatio: ratios },
    coords,
    cluster: {
      method: 'kmeans', k, restarts, maxIterations, init: 'k-means++',
      iterations: km.iterations, inertia: km.inertia, converged: km.converged,
    },
    labels,
    confidence,
    centroids: centres,
    sizes,
    metrics: { silhouette, silhouetteSampleSize: m },
  };
}
