import type { FeatureMatrix } from '../analysis.types';
import type { ClusterNote } from '../curation/curation.types';
import { DEFAULT_RECIPE, type Recipe } from '../recipe/recipe.types';
import { parseRecipe } from '../recipe/parse-recipe';
import { runCuration } from '../study/run-curation';
import type { StudyRun } from '../study/study.types';
import { cutTree } from '../cluster/hierarchy/cut';
import { fitRecipe, type FrozenRecipe } from './frozen-recipe';

/**
 * What `gleaner apply` needs of one study run, learned once from the study's own data: the frozen
 * recipe, and centroids in the recipe's output space (of every curated cluster, and of the groups
 * windows are assigned by).
 */
export interface StudyModel {
  runId: string;
  frozen: FrozenRecipe;
  /** Curated clusters that still hold windows (merged-away ones do not), ascending. */
  clusters: number[];
  /** Row-major clusters.length × d: the mean of each of those clusters' windows after the recipe. */
  clusterCentroids: Float64Array;
  /**
   * Row-major groups × d: the centroids windows are assigned by. For k-means one per curated
   * cluster; for a tree one per part of a curated cluster (treeParts).
   */
  centroids: Float64Array;
  /** The curated cluster of each group centroid. */
  centroidCluster: Int32Array;
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
  // The groups windows are assigned to: the curated clusters themselves (k-means), or for a tree
  // each curated cluster's parts in the same tree cut finer (see treeParts).
  const part = run.result.tree && run.result.treeLeafOf ? treeParts(run, labels, k) : labels;
  const groupOf = new Int32Array(state.n);
  const groupCluster: number[] = [];
  const ids = new Map<number, number>();
  for (let i = 0; i < state.n; i++) {
    const key = part[i] * k + labels[i];
    let g = ids.get(key);
    if (g === undefined) { g = ids.size; ids.set(key, g); groupCluster.push(labels[i]); }
    groupOf[i] = g;
  }
  const centroids = means(state.data, state.n, d, groupOf, ids.size);
  const clusterMeans = means(state.data, state.n, d, labels, k);
  const clusters: number[] = [];
  const sizes = new Int32Array(k);
  for (const g of labels) sizes[g]++;
  for (let g = 0; g < k; g++) if (sizes[g] > 0) clusters.push(g);
  const clusterCentroids = new Float64Array(clusters.length * d);
  clusters.forEach((g, r) => clusterCentroids.set(clusterMeans.subarray(g * d, (g + 1) * d), r * d));
  return {
    runId: run.id, frozen: fitted.frozen, clusters, clusterCentroids, centroids, centroidCluster: Int32Array.from(groupCluster), d,
    notes: curation.clusters, studyLabels: labels, studyWindows: state.windows,
  };
}

/** A tree run's clusters are cut this many times finer to find the parts windows are assigned to. */
export const TREE_PARTS_PER_CLUSTER = 20;

/**
 * For a tree run: the part of each analysed window when the run's own tree is cut into
 * TREE_PARTS_PER_CLUSTER × k clusters (at most its leaves). The cut is nested in the run's cut, so
 * every part lies inside one of the run's clusters; crossed with the curation (moves, splits) each
 * part × curated cluster is one group with one centroid. Tree clusters are not the cells of their
 * centroids (a Ward or complete cluster can reach past another's centroid), and the finer parts
 * follow their shape: on the demo windows the nearest part centroid gives back Ward's clusters for
 * 99.98% of windows (k = 6) where the nearest cluster centroid gives 98.4% (docs/apply.md).
 */
function treeParts(run: StudyRun, labels: Int32Array, k: number): Int32Array {
  const tree = run.result.tree!;
  const leafOf = run.result.treeLeafOf!;
  const fine = cutTree(tree, { k: Math.min(tree.n, TREE_PARTS_PER_CLUSTER * Math.max(k, run.result.cluster.k)) });
  return Int32Array.from(labels, (_, i) => fine[leafOf[i]]);
}

/** Mean of each group's rows (row-major groups × d; 0 for an empty group). */
function means(data: Float64Array, n: number, d: number, groupOf: Int32Array, groups: number): Float64Array {
  const sums = new Float64Array(groups * d);
  const counts = new Float64Array(groups);
  for (let i = 0; i < n; i++) {
    const g = groupOf[i];
    counts[g]++;
    for (let j = 0; j < d; j++) sums[g * d + j] += data[i * d + j];
  }
  for (let g = 0; g < groups; g++) if (counts[g] > 0) for (let j = 0; j < d; j++) sums[g * d + j] /= counts[g];
  return sums;
}

/**
 * Nearest-centroid assignment: each window goes to the curated cluster of the nearest group
 * centroid (Euclidean, in the recipe's output space; a tie goes to the earlier group). Its
 * confidence is the analysis's: 1 − d1/d2 with d1, d2 the distances to the nearest and
 * second-nearest curated cluster centroid (0 when d2 is 0 or there is one cluster).
 */
export function assignWindows(model: StudyModel, data: Float64Array, n: number): { labels: Int32Array; confidence: Float32Array } {
  const { d, centroids, centroidCluster, clusterCentroids, clusters } = model;
  const groups = centroidCluster.length;
  const k = clusters.length;
  const labels = new Int32Array(n);
  const confidence = new Float32Array(n);
  for (let i = 0; i < n; i++) {
    const o = i * d;
    let nearest = Infinity;
    let best = 0;
    for (let g = 0; g < groups; g++) {
      const dist = distance2(data, o, centroids, g * d, d, nearest);
      if (dist < nearest) { nearest = dist; best = g; }
    }
    labels[i] = centroidCluster[best];
    let d1 = Infinity;
    let d2 = Infinity;
    for (let r = 0; r < k; r++) {
      const dist = distance2(data, o, clusterCentroids, r * d, d, d2);
      if (dist < d1) { d2 = d1; d1 = dist; } else if (dist < d2) d2 = dist;
    }
    confidence[i] = d2 > 0 && Number.isFinite(d2) ? 1 - Math.sqrt(d1) / Math.sqrt(d2) : 0;
  }
  return { labels, confidence };
}

/**
 * Squared Euclidean distance, summed in feature order (as squaredDistance), stopping early once
 * the partial sum exceeds `bound` (the result is then some value above `bound`, never used).
 */
function distance2(a: Float64Array, ao: number, b: Float64Array, bo: number, d: number, bound: number): number {
  let s = 0;
  let j = 0;
  while (j < d) {
    const end = Math.min(d, j + 8);
    for (; j < end; j++) {
      const t = a[ao + j] - b[bo + j];
      s += t * t;
    }
    if (s > bound) return s;
  }
  return s;
}
