import type { AnalysisParams, ClusterRecord, FeatureMatrix } from '../analysis.types';
import { validateAnalysis } from '../analyze';
import { OptionError } from '../errors';
import type { JobContext } from '../job';
import { clusterStage } from '../pipeline/cluster-stage';
import { embedStage } from '../pipeline/embed-stage';
import { seededRandom } from '../random';
import { applyRecipe } from '../recipe/apply';
import { parseRecipe } from '../recipe/parse-recipe';
import { DEFAULT_RECIPE } from '../recipe/recipe.types';
import { subjectCodes } from '../recipe/subject-codes';
import type { Roles } from '../table/roles.types';
import { featureMatrix } from '../table/matrix';
import { findColumn, type Table } from '../table/table';
import { matchClusters } from './jaccard';
import { drawLeftOut, subjectsToLeaveOut } from './leave-out';
import type { StabilityOptions, StabilityResult } from './stability.types';
import { DISSOLUTION, summarizeStability } from './summarize';

export type { StabilityOptions, StabilityResult } from './stability.types';

/** Default share of subjects left out of each resample. */
export const DEFAULT_LEAVE_OUT_SHARE = 0.25;
/** Most resamples one assessment may ask for. */
export const MAX_RESAMPLES = 1000;
/** Offset of the subject-draw stream from the seed, so it never shares a stream with a run's own draws. */
const DRAW_SEED = 0x51ab1e;

/** What was clustered in the run being assessed. */
export interface StabilityRun {
  /** Cluster per analysed window. */
  labels: Int32Array;
  /** Input row of each analysed window, when the recipe dropped some (AnalysisResult.windows). */
  windows?: Int32Array;
  cluster: ClusterRecord;
}

export interface StabilityInput {
  /** The run's feature matrix before its recipe, with the subject code of every window. */
  matrix: FeatureMatrix;
  /** Name of each subject code. */
  subjectNames: readonly string[];
  /** The run's parameters: each resample runs the same recipe, map (when clustering on it) and clustering. */
  params: AnalysisParams;
  run: StabilityRun;
}

function noiseOf(c: ClusterRecord): number {
  return c.method === 'hdbscan' && c.noiseCluster !== null ? c.noiseCluster : -1;
}

/** Checks the options; returns B, the share and the seed. */
export function validateStability(o: StabilityOptions, runSeed: number): { resamples: number; share: number; seed: number } {
  const { resamples } = o;
  if (typeof resamples !== 'number' || !Number.isInteger(resamples) || resamples < 1 || resamples > MAX_RESAMPLES) {
    throw new OptionError('stability', resamples, `an integer from 1 to ${MAX_RESAMPLES} (resamples)`);
  }
  const share = o.leaveOutShare ?? DEFAULT_LEAVE_OUT_SHARE;
  if (typeof share !== 'number' || !(share >= 0 && share < 1)) throw new OptionError('leaveOutShare', share, 'a number from 0 up to (not including) 1');
  const seed = o.seed ?? runSeed;
  if (typeof seed !== 'number' || !Number.isFinite(seed)) throw new OptionError('seed', seed, 'a finite number');
  return { resamples, share, seed };
}

/** The kept rows of the matrix as a matrix of their own (subject codes kept as they are). */
function keepRows(matrix: FeatureMatrix, rows: Int32Array): FeatureMatrix {
  const { d } = matrix;
  const data = new Float64Array(rows.length * d);
  for (let r = 0; r < rows.length; r++) data.set(matrix.data.subarray(rows[r] * d, rows[r] * d + d), r * d);
  return { data, n: rows.length, d, featureNames: matrix.featureNames, subjectCodes: Int32Array.from(rows, (w) => matrix.subjectCodes![w]) };
}

/**
 * The run's recipe and clustering on a sub-matrix, as `analyze` does them (the same seed, so the same
 * draws on the same windows); the map is made only when the run clusters on it. Returns the
 * cluster of each analysed sub-matrix row (the recipe may drop rows: `windows`), noise as -1.
 */
async function clusterAgain(sub: FeatureMatrix, params: AnalysisParams, ctx: JobContext, report: (f: number) => void): Promise<{ labels: Int32Array; k: number; windows?: Int32Array }> {
  const choices = validateAnalysis(sub, params);
  const steps = params.recipe === undefined ? DEFAULT_RECIPE : parseRecipe(params.recipe);
  const prepared = await applyRecipe(sub, { subjectCodes: sub.subjectCodes }, steps);
  const { data, n, d } = prepared;
  await ctx.checkpoint();
  let coords: Float32Array = new Float32Array(0);
  if (choices.space === 'map') {
    const subjects = n < sub.n ? Int32Array.from(prepared.windows, (w) => sub.subjectCodes![w]) : sub.subjectCodes;
    coords = (await embedStage({ data, n, d, subjectCodes: subjects, seed: params.seed }, choices, ctx, (_s, f) => report(0.5 * f))).coords;
    await ctx.checkpoint();
  }
  const from = choices.space === 'map' ? 0.5 : 0;
  const c = await clusterStage({ data, n, d, coords, seed: params.seed }, choices, seededRandom(params.seed), ctx, (f) => report(from + (1 - from) * f));
  const noise = noiseOf(c.record);
  const labels = noise < 0 ? c.labels : c.labels.map((l) => (l === noise ? -1 : l));
  return { labels, k: c.record.k, ...(n < sub.n ? { windows: prepared.windows } : {}) };
}

/**
 * Stability of each cluster across subjects (Hennig 2007, "Cluster-wise assessment of cluster
 * stability", subsetting scheme, with subjects as the units left out): B times, leave out a seeded
 * random share of the subjects, run the same recipe and clustering on the windows kept, and take
 * each original cluster's best Jaccard similarity with the resample's clusters on the windows both
 * clustered. Per cluster: the mean Jaccard, the share of resamples in which it dissolved (≤ 0.5) and
 * the subjects whose absence dissolved it most often. Windows without a subject are always kept. A
 * set-aside noise cluster (HDBSCAN) is neither assessed nor a counterpart. Same inputs and seed give
 * identical results; the resamples are drawn from one stream, so the first B of a longer
 * assessment are those of a shorter one.
 */
export async function clusterStability(input: StabilityInput, options: StabilityOptions, ctx: JobContext): Promise<StabilityResult> {
  const { matrix, subjectNames, params, run } = input;
  const { resamples: B, share, seed } = validateStability(options, params.seed);
  const codes = matrix.subjectCodes;
  if (!codes) throw new OptionError('stability', B, 'a table with a subject column (resamples leave subjects out)');
  if (codes.length !== matrix.n) throw new Error(`expected ${matrix.n} subject codes, got ${codes.length}`);
  const S = subjectNames.length;
  if (S < 2) throw new OptionError('stability', B, `a table with at least 2 subjects (found ${S})`);
  for (let i = 0; i < codes.length; i++) if (codes[i] >= S) throw new Error(`window ${i}: subject code ${codes[i]} has no name`);
  const k = run.cluster.k;
  const analysed = run.windows ?? null;
  if (run.labels.length !== (analysed ? analysed.length : matrix.n)) throw new Error(`expected one label per analysed window, got ${run.labels.length}`);

  // Cluster of each input row in the run (-1: noise, -2: not analysed).
  const noise = noiseOf(run.cluster);
  const originalOfRow = new Int32Array(matrix.n).fill(-2);
  for (let w = 0; w < run.labels.length; w++) originalOfRow[analysed ? analysed[w] : w] = run.labels[w] === noise ? -1 : run.labels[w];

  const count = subjectsToLeaveOut(S, share);
  const random = seededRandom((Math.floor(seed) >>> 0) ^ DRAW_SEED);
  const jaccard = new Float64Array(B * k);
  const leftOut: number[][] = [];
  const out = new Uint8Array(S);
  for (let b = 0; b < B; b++) {
    const left = drawLeftOut(S, count, random);
    leftOut.push(left);
    out.fill(0);
    for (const s of left) out[s] = 1;
    let kept = 0;
    for (let i = 0; i < matrix.n; i++) if (codes[i] < 0 || !out[codes[i]]) kept++;
    const rows = new Int32Array(kept);
    for (let i = 0, r = 0; i < matrix.n; i++) if (codes[i] < 0 || !out[codes[i]]) rows[r++] = i;

    const stage = `resample ${b + 1}/${B}`;
    ctx.progress(stage, b / B);
    const again = await clusterAgain(keepRows(matrix, rows), params, ctx, (f) => ctx.progress(stage, (b + f) / B));
    // Pair the two clusterings on the windows both analysed.
    const orig: number[] = [];
    const res: number[] = [];
    for (let w = 0; w < again.labels.length; w++) {
      const row = rows[again.windows ? again.windows[w] : w];
      if (originalOfRow[row] === -2) continue;
      orig.push(originalOfRow[row]);
      res.push(again.labels[w]);
    }
    const m = matchClusters(Int32Array.from(orig), Int32Array.from(res), k, again.k);
    for (let c = 0; c < k; c++) jaccard[b * k + c] = c === noise ? Number.NaN : m.jaccard[c];
    await ctx.checkpoint();
  }
  ctx.progress(`resample ${B}/${B}`, 1);
  return {
    resamples: B, leaveOutShare: share, subjectsLeftOut: count, subjects: S, seed, dissolution: DISSOLUTION,
    clusters: summarizeStability(jaccard, k, leftOut, subjectNames), leftOut, jaccard,
  };
}

/**
 * The same from the table and its roles (the subject column is the one with the subject role), as
 * the CLI and the app hold a run: builds the feature matrix and the subject codes first.
 */
export async function tableStability(
  table: Table, roles: Roles, params: AnalysisParams, run: StabilityRun, options: StabilityOptions, ctx: JobContext,
): Promise<StabilityResult> {
  const matrix = featureMatrix(table, roles);
  const entry = roles.find((r) => r.role === 'subject');
  const column = entry ? findColumn(table, entry.name) : undefined;
  if (!column) throw new OptionError('stability', options.resamples, 'a table with a subject column (resamples leave subjects out)');
  const subjects = subjectCodes(column);
  return clusterStability({ matrix: { ...matrix, subjectCodes: subjects.codes }, subjectNames: subjects.names, params, run }, options, ctx);
}
