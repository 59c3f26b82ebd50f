import type { FeatureMatrix } from '../analysis.types';
import type { ClusterNote } from '../curation/curation.types';
import { DEFAULT_RECIPE, type Recipe } from '../recipe/recipe.types';
import { parseRecipe } from '../recipe/parse-recipe';
import { runCuration } from '../study/run-curation';
import type { StudyRun } from '../study/study.types';
import { squaredDistance } from '../cluster/distance';
import { fitRecipe, type FrozenRecipe } from './frozen-recipe';

/**
 * What `gleaner apply` needs of one study run, learned once from the study's own data: the frozen
 * recipe, and the centroid of every curated cluster in the recipe's output space.
 */
export interface StudyModel {
  runId: string;
  frozen: FrozenRecipe;
  /** Curated clusters that still hold windows (merged-away ones do not), ascending. */
  clusters: number[];
  /** Row-major clusters.length × d: the mean of each of those clusters' windows after the recipe. */
  centroids: Float64Array;
  d: number;
  /** Curation notes per curated cluster index (names, class, set aside). */
  notes: readonly Readonly<ClusterNote>[];
  /** The curated cluster of each analysed study window (as the exports of the study give it). */
  studyLabels: Int32Array;
  /** Input row of each analysed study window. */
  studyWindows: Int32Array;
}

/** A run apply cannot take, or a study input that does not fit its run: what was expected and found. */
export class ModelError extends Error {
  constructor(readonly expected: string, readonly found: string) {
    super(`expected ${expected}, found ${found}`);
    this.name = 'ModelError';
  }
}

/**
 * Learns the model of `run` from the matrix of the study's input (features in the run's role order,
 * subject codes attached when the recipe needs them). Throws a ModelError saying what does not fit:
 * runs clustered on the map or by HDBSCAN are refused (their clusters have no centroid rule here).
 */
export function studyModel(run: StudyRun, matrix: FeatureMatrix): StudyModel {
  const c = run.result.cluster;
  const wanted = 'a k-means or tree run clustered in the scaled feature space (apply assigns by nearest centroid there)';
  if (c.method === 'hdbscan') throw new ModelError(wanted, `run ${run.id}: HDBSCAN`);
  if (c.space === 'map') throw new ModelError(wanted, `run ${run.id}: clustered on the map`);
  const recipe: Recipe = run.params.recipe === undefined ? DEFAULT_RECIPE : parseRecipe(run.params.recipe);
  const fitted = fitRecipe(matrix.data, matrix.n, matrix.featureNames, matrix.subjectCodes, recipe);
  const { state } = fitted;
  const curation = runCuration(run);
  const labels = curation.labels;
  if (labels.length !== state.n) throw new ModelError(`run ${run.id}'s recipe to leave its ${labels.length} analysed windows of the study's input`, `${state.n}`);
  const saved = run.result.windows;
  if (saved && (saved.length !== state.windows.length || saved.some((w, i) => w !== state.windows[i]))) {
    throw new ModelError(`run ${run.id}'s recipe to keep the windows the saved run analysed`, 'other windows');
  }
  const k = curation.clusters.length;
  const d = state.d;
  const sums = new Float64Array(k * d);
  const counts = new Float64Array(k);
  for (let i = 0; i < state.n; i++) {
    const g = labels[i];
    counts[g]++;
    for (let j = 0; j < d; j++) sums[g * d + j] += state.data[i * d + j];
  }
  const clusters: number[] = [];
  for (let g = 0; g < k; g++) if (counts[g] > 0) clusters.push(g);
  const centroids = new Float64Array(clusters.length * d);
  clusters.forEach((g, r) => { for (let j = 0; j < d; j++) centroids[r * d + j] = sums[g * d + j] / counts[g]; });
  return { runId: run.id, frozen: fitted.frozen, clusters, centroids, d, notes: curation.clusters, studyLabels: labels, studyWindows: state.windows };
}

/**
 * Nearest-centroid assignment: each window goes to the curated cluster whose centroid is nearest
 * (Euclidean, in the recipe's output space; a tie goes to the lower cluster index), with confidence
 * 1 − d1/d2 (d1, d2: distances to the nearest and second-nearest centroid; 0 when d2 is 0 or there
 * is one cluster), the analysis's own confidence rule.
 */
export function assignWindows(model: StudyModel, data: Float64Array, n: number): { labels: Int32Array; confidence: Float32Array } {
  const { d, centroids, clusters } = model;
  const labels = new Int32Array(n);
  const confidence = new Float32Array(n);
  for (let i = 0; i < n; i++) {
    let d1 = Infinity;
    let d2 = Infinity;
    let best = 0;
    for (let r = 0; r < clusters.length; r++) {
      const dist = squaredDistance(data, i * d, centroids, r * d, d);
      if (dist < d1) { d2 = d1; d1 = dist; best = r; } else if (dist < d2) d2 = dist;
    }
    labels[i] = clusters[best];
    confidence[i] = d2 > 0 && Number.isFinite(d2) ? 1 - Math.sqrt(d1) / Math.sqrt(d2) : 0;
  }
  return { labels, confidence };
}
