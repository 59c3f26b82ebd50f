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
 * a capped number of Lloyd iterations), then the linkage on the micro-cluster centroids with their
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
  const start = sampleIndices(n, m, seededRandom(options.seed));
  const centres = new Float64Array(m * d);
  for (let c = 0; c < m; c++) centres.set(data.subarray(start[c] * d, start[c] * d + d), c * d);
  const state = initLloyd(data, n, d, centres, 0);
  while (!state.converged && state.iterations < maxIterations) {
    lloydStep(state);
    ctx.progress('micro-clusters', state.iterations / maxIterations);
    await ctx.checkpoint();
  }
  assign(state);

  // Drop micro-clusters left empty; number the rest in order.
  const counts = new Int32Array(m);
  for (let i = 0; i < n; i++) counts[state.labels[i]]++;
  const index = new Int32Array(m).fill(-1);
  let leaves = 0;
  for (let c = 0; c < m; c++) if (counts[c] > 0) index[c] = leaves++;
  const weights = new Int32Array(leaves);
  const centroids = new Float64Array(leaves * d);
  for (let c = 0; c < m; c++) {
    if (index[c] < 0) continue;
    weights[index[c]] = counts[c];
    centroids.set(state.centres.subarray(c * d, c * d + d), index[c] * d);
  }
  const assignment = new Int32Array(n);
  for (let i = 0; i < n; i++) assignment[i] = index[state.labels[i]];

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

/** Window labels from a cut of a two-stage tree: each window takes its micro-cluster's label. */
export function windowLabels(leafLabels: Int32Array, assignment: Int32Array): Int32Array {
  const out = new Int32Array(assignment.length);
  for (let i = 0; i < assignment.length; i++) out[i] = leafLabels[assignment[i]];
  return out;
}
