import { OptionError } from '../../errors';
import type { JobContext } from '../../job';
import { quietContext } from '../../job';
import { sampleIndices } from '../../metrics/sample';
import { seededRandom } from '../../random';
import { assign, initLloyd, lloydStep } from '../lloyd';
import { condensedDistances, condensedIndex } from './condensed';
import { validateLinkage } from './hierarchical';
import { toMergeTree, type Linkage, type MergeTree } from './merge-tree';
import { singleLinkageMst } from './mst-single';
import { nnChainCondensed } from './nn-chain';
import { wardFromPoints } from './ward-points';

/** Windows sampled per micro-cluster for its Lloyd iterations (when the study has more). */
const SAMPLE_PER_LEAF = 16;
/** Windows assigned to their nearest micro-cluster between checkpoints. */
const ASSIGN_SLICE = 2048;

/** Above this many windows the hierarchy is built in two stages by default. */
export const TWO_STAGE_THRESHOLD = 20_000;

export interface TwoStageOptions {
  linkage: Linkage;
  /** Micro-clusters (leaves of the tree); default 1,000. */
  microClusters?: number;
  /** Lloyd iterations for the micro-clusters; default 20. */
  maxIterations?: number;
  seed: number;
}

export interface TwoStageResult {
  /** The tree over micro-clusters: n = leaves, sizes and leafWeights in windows. */
  tree: MergeTree;
  /** Micro-cluster (leaf) of every window. */
  assignment: Int32Array;
  /** Micro-cluster centroids, row-major leaves × d. */
  centroids: Float64Array;
}

/**
 * Two-stage hierarchy for large n: k-means micro-clusters (seeded from distinct random windows,
 * a capped number of Lloyd iterations on a seeded sample of 8 windows per micro-cluster when there
 * are more, then every window to its nearest micro-cluster), then the linkage on the micro-cluster centroids with their
 * window counts as starting sizes. For Ward this is exactly Ward's criterion applied to clusters
 * that start as the micro-clusters (the within-micro-cluster sum of squares is a constant
 * offset); average weights centroids by their counts; complete and single see centroids only.
 */
export async function twoStageHierarchy(
  data: Float64Array, n: number, d: number, options: TwoStageOptions, ctx: JobContext = quietContext,
): Promise<TwoStageResult> {
  const linkage = validateLinkage(options.linkage);
  const requested = options.microClusters ?? 1000;
  const maxIterations = options.maxIterations ?? 20;
  if (!Number.isInteger(requested) || requested < 2) throw new OptionError('microClusters', requested, 'an integer of at least 2');
  if (!Number.isInteger(maxIterations) || maxIterations < 1) throw new OptionError('maxIterations', maxIterations, 'an integer of at least 1');
  if (data.length !== n * d || n < 2) throw new Error(`two-stage hierarchy: matrix shape does not fit its data: n = ${n}, d = ${d}`);
  const m = Math.min(requested, n);

  ctx.progress('micro-clusters', 0);
  const random = seededRandom(options.seed);
  // Above SAMPLE_PER_LEAF windows per micro-cluster, Lloyd runs on a seeded sample of that many
  // and every window then joins its nearest micro-cluster (whose centroid becomes its windows' mean).
  const sampled = n > SAMPLE_PER_LEAF * m;
  const fitIndex = sampled ? sampleIndices(n, SAMPLE_PER_LEAF * m, random) : null;
  const fit = fitIndex ? gatherRows(data, d, fitIndex) : data;
  const fitN = fitIndex ? fitIndex.length : n;
  const start = sampleIndices(fitN, m, random);
  const centres = new Float64Array(m * d);
  for (let c = 0; c < m; c++) centres.set(fit.subarray(start[c] * d, start[c] * d + d), c * d);
  const state = initLloyd(fit, fitN, d, centres, 0);
  const fitShare = sampled ? 0.7 : 1;
  while (!state.converged && state.iterations < maxIterations) {
    lloydStep(state);
    ctx.progress('micro-clusters', fitShare * (state.iterations / maxIterations));
    await ctx.checkpoint();
  }
  assign(state);
  let labels = state.labels;
  let micro = state.centres;
  if (sampled) {
    labels = new Int32Array(n);
    for (let from = 0; from < n; from += ASSIGN_SLICE) {
      nearestCentres(data, d, state.centres, m, from, Math.min(n, from + ASSIGN_SLICE), labels);
      ctx.progress('micro-clusters', fitShare + (1 - fitShare) * (Math.min(n, from + ASSIGN_SLICE) / n));
      await ctx.checkpoint();
    }
    micro = meansOf(data, n, d, labels, m, state.centres);
  }

  // Drop micro-clusters left empty; number the rest in order.
  const counts = new Int32Array(m);
  for (let i = 0; i < n; i++) counts[labels[i]]++;
  const index = new Int32Array(m).fill(-1);
  let leaves = 0;
  for (let c = 0; c < m; c++) if (counts[c] > 0) index[c] = leaves++;
  const weights = new Int32Array(leaves);
  const centroids = new Float64Array(leaves * d);
  for (let c = 0; c < m; c++) {
    if (index[c] < 0) continue;
    weights[index[c]] = counts[c];
    centroids.set(micro.subarray(c * d, c * d + d), index[c] * d);
  }
  const assignment = new Int32Array(n);
  for (let i = 0; i < n; i++) assignment[i] = index[labels[i]];

  ctx.progress('linkage', 0);
  let raw;
  if (linkage === 'ward') raw = await wardFromPoints(centroids, leaves, d, ctx, weights);
  else if (linkage === 'average') raw = await nnChainCondensed(condensedDistances(centroids, leaves, d), leaves, 'average', ctx, weights);
  else if (linkage === 'complete') raw = await nnChainCondensed(condensedDistances(centroids, leaves, d), leaves, 'complete', ctx);
  else {
    const dist = condensedDistances(centroids, leaves, d);
    raw = await singleLinkageMst(leaves, (i, j) => dist[condensedIndex(leaves, i, j)], ctx);
  }
  ctx.progress('linkage', 1);
  return { tree: toMergeTree(raw, weights), assignment, centroids };
}

/** The rows `index` of a row-major matrix, copied in order. */
function gatherRows(data: Float64Array, d: number, index: Int32Array): Float64Array {
  const out = new Float64Array(index.length * d);
  for (let t = 0; t < index.length; t++) out.set(data.subarray(index[t] * d, index[t] * d + d), t * d);
  return out;
}

/**
 * Nearest of k centres for rows [from, to), written to `labels` (lowest index on ties). The sum
 * over features stops once it passes the best distance so far (partial distance search).
 */
function nearestCentres(data: Float64Array, d: number, centres: Float64Array, k: number, from: number, to: number, labels: Int32Array): void {
  for (let i = from; i < to; i++) {
    const o = i * d;
    let best = 0;
    let bestDist = Infinity;
    for (let c = 0; c < k; c++) {
      const co = c * d;
      let s = 0;
      for (let j = 0; j < d && s < bestDist; j++) {
        const t = data[o + j] - centres[co + j];
        s += t * t;
      }
      if (s < bestDist) { bestDist = s; best = c; }
    }
    labels[i] = best;
  }
}

/** Means of each label's rows (k × d); a label with no rows keeps its row of `fallback`. */
function meansOf(data: Float64Array, n: number, d: number, labels: Int32Array, k: number, fallback: Float64Array): Float64Array {
  const sums = new Float64Array(k * d);
  const counts = new Int32Array(k);
  for (let i = 0; i < n; i++) {
    const c = labels[i];
    counts[c]++;
    for (let j = 0; j < d; j++) sums[c * d + j] += data[i * d + j];
  }
  for (let c = 0; c < k; c++) {
    for (let j = 0; j < d; j++) sums[c * d + j] = counts[c] > 0 ? sums[c * d + j] / counts[c] : fallback[c * d + j];
  }
  return sums;
}

/** Window labels from a cut of a two-stage tree: each window takes its micro-cluster's label. */
export function windowLabels(leafLabels: Int32Array, assignment: Int32Array): Int32Array {
  const out = new Int32Array(assignment.length);
  for (let i = 0; i < assignment.length; i++) out[i] = leafLabels[assignment[i]];
  return out;
}
