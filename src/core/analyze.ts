import type { AnalysisParams, AnalysisResult, FeatureMatrix } from './analysis.types';
import { OptionError } from './errors';
import type { JobContext } from './job';
import { sampleIndices } from './metrics/sample';
import { silhouetteOfSample } from './metrics/silhouette';
import { pipelineChoices, requestedK, type PipelineChoices } from './pipeline/choices';
import { clusterStage } from './pipeline/cluster-stage';
import { embedStage } from './pipeline/embed-stage';
import { mapQuality } from './pipeline/quality';
import { seededRandom } from './random';
import { applyRecipe } from './recipe/apply';
import { parseRecipe } from './recipe/parse-recipe';
import type { RecipeCache } from './recipe/recipe-cache';
import { DEFAULT_RECIPE } from './recipe/recipe.types';

type Span = readonly [number, number];
type StageName = 'scaling' | 'embedding' | 'placing' | 'quality' | 'clustering' | 'silhouette';

/**
 * Share of the job's progress bar each stage takes, in order: PCA runs as in the first slice.
 * Placing (sample-then-place) reports within the embedding's share, after the layout.
 */
const PCA_STAGES: Record<StageName, Span> = { scaling: [0, 0.05], embedding: [0.05, 0.15], placing: [0.05, 0.15], quality: [0.15, 0.15], clustering: [0.15, 0.9], silhouette: [0.9, 1] };
const LAYOUT_STAGES: Record<StageName, Span> = { scaling: [0, 0.02], embedding: [0.02, 0.8], placing: [0.02, 0.8], quality: [0.8, 0.86], clustering: [0.86, 0.98], silhouette: [0.98, 1] };

function isInt(v: unknown): v is number {
  return typeof v === 'number' && Number.isInteger(v);
}

/** Checks analysis parameters against each other and the matrix; throws OptionError or Error. */
export function validateAnalysis(matrix: FeatureMatrix, params: AnalysisParams): PipelineChoices {
  const { seed, silhouetteSample } = params;
  if (typeof seed !== 'number' || !Number.isFinite(seed)) throw new OptionError('seed', seed, 'a finite number');
  if (!isInt(silhouetteSample) || silhouetteSample < 2) throw new OptionError('silhouetteSample', silhouetteSample, 'an integer of at least 2');
  const choices = pipelineChoices(params);
  const { n, d, data } = matrix;
  if (!isInt(n) || !isInt(d) || d < 1 || data.length !== n * d) {
    throw new Error(`feature matrix shape does not fit its data: n = ${n}, d = ${d}, ${data.length} values`);
  }
  if (n < 2) throw new Error(`found ${n} window${n === 1 ? '' : 's'}; an analysis needs at least 2 windows`);
  const k = requestedK(choices.cluster);
  if (k !== undefined && n < k) throw new OptionError('k', k, `at most the number of windows: found ${n} windows, k = ${k} needs at least ${k}`);
  return choices;
}

/** After the recipe: no missing value may remain, and enough windows must remain for k clusters. */
function checkPrepared(p: { data: Float64Array; n: number; featureNames: string[]; d: number }, k: number | undefined): void {
  for (let i = 0; i < p.data.length; i++) {
    if (p.data[i] !== p.data[i]) {
      throw new OptionError('recipe', `missing value left in feature "${p.featureNames[i % p.d]}"`, 'a recipe that fills or drops every missing value (add an impute or drop-missing step)');
    }
  }
  if (k !== undefined && p.n < k) throw new OptionError('k', k, `at most the number of windows the recipe keeps (${p.n})`);
}

/**
 * The analysis: the recipe (by default z-score + mean imputation), the map (PCA, t-SNE or UMAP,
 * with sample-then-place for large studies), its quality, flat clusters (k-means or a tree cut) in
 * feature or map space, per-window confidence, and the mean silhouette (scaled features) on a
 * seeded sample. Same matrix, params and seed give identical results. `cache` keeps recipe step
 * results between runs on the same matrix (only the changed steps re-run).
 */
export async function analyze(matrix: FeatureMatrix, params: AnalysisParams, ctx: JobContext, cache?: RecipeCache): Promise<AnalysisResult> {
  const choices = validateAnalysis(matrix, params);
  const random = seededRandom(params.seed);
  const spans = choices.embed.method === 'pca' ? PCA_STAGES : LAYOUT_STAGES;
  // Every report names one of the stages below; what a kernel says of itself goes in the detail.
  const stage = (name: StageName, f: number, detail?: string, span: Span = spans[name]) => {
    const [a, b] = span;
    ctx.progress(name, a + (b - a) * f, detail);
  };

  stage('scaling', 0);
  // Payloads are an edge: a recipe that came through a job is validated here.
  const steps = params.recipe === undefined ? DEFAULT_RECIPE : parseRecipe(params.recipe);
  const prepared = await applyRecipe(matrix, { subjectCodes: matrix.subjectCodes }, steps, undefined, cache);
  const { data, n, d, records: recipe } = prepared;
  checkPrepared(prepared, requestedK(choices.cluster));
  await ctx.checkpoint();

  stage('embedding', 0, { pca: 'PCA', tsne: 't-SNE', umap: 'UMAP' }[choices.embed.method]);
  const subjectCodes = matrix.subjectCodes && (n < matrix.n ? Int32Array.from(prepared.windows, (w) => matrix.subjectCodes![w]) : matrix.subjectCodes);
  const embedded = await embedStage({ data, n, d, subjectCodes, ...(n < matrix.n ? { windows: prepared.windows } : {}), seed: params.seed }, choices, ctx, (name, f, detail) => stage(name, f, detail, spans.embedding));
  const { coords } = embedded;
  await ctx.checkpoint();

  let embed = embedded.record;
  if (choices.quality) {
    stage('quality', 0, 'trustworthiness');
    embed = { ...embed, ...mapQuality(data, n, d, coords, params.seed, embed.method === 'umap' ? embed.metric : 'euclidean') };
    await ctx.checkpoint();
  }

  stage('clustering', 0);
  const c = await clusterStage({ data, n, d, coords, seed: params.seed }, choices, random, ctx, (f, detail) => stage('clustering', f, detail));
  const { labels } = c;
  await ctx.checkpoint();

  stage('silhouette', 0);
  const sample = sampleIndices(n, params.silhouetteSample, random);
  const m = sample.length;
  const silhouette = silhouetteOfSample(data, d, sample, labels);
  stage('silhouette', 1);

  return {
    recipe,
    ...(n < matrix.n ? { windows: prepared.windows } : {}),
    embed,
    ...(embedded.placed ? { placed: embedded.placed } : {}),
    ...(c.tree ? { tree: c.tree, treeLeafOf: c.treeLeafOf } : {}),
    coords,
    cluster: c.record,
    labels,
    confidence: c.confidence,
    centroids: c.centroids,
    sizes: c.sizes,
    metrics: { silhouette, silhouetteSampleSize: m },
  };
}
