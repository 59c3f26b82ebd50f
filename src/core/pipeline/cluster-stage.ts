import type { ClusterRecord, ClusterSpace } from '../analysis.types';
import { centreConfidence } from '../cluster/confidence';
import { clusterHierarchy, cutTree, windowLabels, type MergeTree } from '../cluster/hierarchy';
import { hdbscan } from '../cluster/hdbscan';
import { kmeans } from '../cluster/kmeans';
import { pca } from '../embed/pca';
import { relabelBySize } from '../cluster/relabel';
import { OptionError } from '../errors';
import type { JobContext } from '../job';
import type { Random } from '../random';
import { MAX_CUT_CLUSTERS, type PipelineChoices } from './choices';

/** Relative k-means tolerance (centre shift against mean feature variance), common practice. */
const KMEANS_TOL = 1e-4;

export interface ClusterInput {
  /** Scaled features, n × d (centroids are always reported here). */
  data: Float64Array;
  n: number;
  d: number;
  /** Map coordinates, for clustering in map space. */
  coords: Float32Array;
  seed: number;
}

export interface ClusterOutput {
  record: ClusterRecord;
  labels: Int32Array;
  confidence: Float32Array;
  centroids: Float64Array;
  sizes: Int32Array;
  tree?: MergeTree;
  treeLeafOf?: Int32Array;
}

/**
 * Flat clusters in feature space or map space: k-means (clusters renumbered by size) or an
 * agglomerative tree cut into k clusters or at a height (labels exactly as cutTree numbers them,
 * so they match the tree). Confidence is 1 − d1/d2 to the cluster centres in the clustered space;
 * centroids are cluster means of the scaled features whatever the space.
 */
export async function clusterStage(
  input: ClusterInput, choices: PipelineChoices, random: Random, ctx: JobContext, report: (f: number, detail?: string) => void,
): Promise<ClusterOutput> {
  const { n, d, data } = input;
  const space: ClusterSpace = choices.space;
  const x = space === 'map' ? Float64Array.from(input.coords) : data;
  const dx = space === 'map' ? 2 : d;
  const c = choices.cluster;
  if (c.method === 'kmeans') {
    if (n < c.k) throw new OptionError('k', c.k, `at most the number of windows the recipe keeps (${n})`);
    const km = await kmeans(x, n, dx, { k: c.k, restarts: c.restarts, maxIterations: c.maxIterations, tol: KMEANS_TOL, random }, ctx, (f) => report(f, 'k-means'));
    const { labels, centres, sizes } = relabelBySize(km.labels, km.centres, c.k, dx);
    const confidence = centreConfidence(x, n, dx, centres, c.k);
    const record: ClusterRecord = {
      method: 'kmeans', k: c.k, restarts: c.restarts, maxIterations: c.maxIterations, init: 'k-means++',
      iterations: km.iterations, inertia: km.inertia, converged: km.converged, refinements: km.refinements, ...(space !== 'features' ? { space } : {}),
    };
    return { record, labels, confidence, centroids: space === 'map' ? clusterMeans(data, n, d, labels, c.k) : centres, sizes };
  }

  const treeCtx: JobContext = { checkpoint: () => ctx.checkpoint(), progress: (stage, f) => report(f, stage) };
  if (c.method === 'hdbscan') return hdbscanStage(input, x, dx, c, choices, treeCtx);
  const h = await clusterHierarchy(x, n, dx, { linkage: c.method, seed: input.seed }, treeCtx);
  const { tree, assignment } = h;
  if (c.k !== undefined && c.k > tree.n) {
    throw new OptionError('k', c.k, `at most the number of tree leaves (${tree.n})`);
  }
  const leafLabels = cutTree(tree, c.k !== undefined ? { k: c.k } : { height: c.cutHeight! });
  const labels = windowLabels(leafLabels, assignment);
  let k = 0;
  for (let i = 0; i < n; i++) if (labels[i] + 1 > k) k = labels[i] + 1;
  if (k < 2 || k > MAX_CUT_CLUSTERS) {
    const top = tree.height.length ? tree.height[tree.height.length - 1] : 0;
    throw new OptionError('cutHeight', c.cutHeight, `a height that leaves 2 to ${MAX_CUT_CLUSTERS} clusters (it leaves ${k}; merge heights run from ${tree.height[0] ?? 0} to ${top})`);
  }
  report(1);
  const centresX = clusterMeans(x, n, dx, labels, k);
  const sizes = new Int32Array(k);
  for (let i = 0; i < n; i++) sizes[labels[i]]++;
  return {
    record: {
      method: 'hierarchical', linkage: c.method, k, ...(c.cutHeight !== undefined ? { cutHeight: c.cutHeight } : {}), path: h.path, space,
    },
    labels,
    confidence: centreConfidence(x, n, dx, centresX, k),
    centroids: space === 'map' ? clusterMeans(data, n, d, labels, k) : centresX,
    sizes,
    tree,
    treeLeafOf: assignment,
  };
}

/**
 * HDBSCAN in the clustered space (features first projected onto choices.preReduce principal axes
 * when there are more, as for t-SNE and UMAP). Dense clusters are numbered by size, largest first
 * (ties: the one holding the lower window first); noise windows form the last cluster, which the
 * curation sets aside from the start. Confidence is R dbscan's membership probability: within a
 * cluster, (largest core distance − the window's) / largest core distance; 0 for noise.
 */
async function hdbscanStage(
  input: ClusterInput, x: Float64Array, dx: number, c: Extract<PipelineChoices['cluster'], { method: 'hdbscan' }>,
  choices: PipelineChoices, ctx: JobContext,
): Promise<ClusterOutput> {
  const { n, d, data } = input;
  let points = x, dim = dx, preReduced: number | null = null;
  if (choices.space === 'features' && dx > choices.preReduce) {
    points = pca(x, n, dx, choices.preReduce).scores;
    dim = choices.preReduce;
    preReduced = choices.preReduce;
  }
  const minSamples = c.minSamples ?? c.minClusterSize;
  const h = await hdbscan(points, n, dim, { minClusterSize: c.minClusterSize, minSamples }, ctx);
  const found = h.clusters;
  const count = new Int32Array(found);
  const first = new Int32Array(found).fill(n);
  for (let i = 0; i < n; i++) {
    const l = h.labels[i];
    if (l < 0) continue;
    count[l]++;
    if (i < first[l]) first[l] = i;
  }
  const order = Array.from({ length: found }, (_, j) => j).sort((a, b) => count[b] - count[a] || first[a] - first[b]);
  const rank = new Int32Array(found);
  order.forEach((old, j) => { rank[old] = j; });
  const noise = n - count.reduce((a, b) => a + b, 0);
  const k = found + (noise > 0 ? 1 : 0);
  const labels = new Int32Array(n);
  for (let i = 0; i < n; i++) labels[i] = h.labels[i] < 0 ? found : rank[h.labels[i]];
  const maxCore = new Float64Array(k);
  for (let i = 0; i < n; i++) if (labels[i] < found && h.coreDistance[i] > maxCore[labels[i]]) maxCore[labels[i]] = h.coreDistance[i];
  const confidence = new Float32Array(n);
  for (let i = 0; i < n; i++) {
    const l = labels[i];
    if (l < found) confidence[i] = maxCore[l] > 0 ? (maxCore[l] - h.coreDistance[i]) / maxCore[l] : 1;
  }
  const sizes = new Int32Array(k);
  for (let i = 0; i < n; i++) sizes[labels[i]]++;
  ctx.progress('clusters', 1);
  return {
    record: {
      method: 'hdbscan', minClusterSize: c.minClusterSize, minSamples, k, clusters: found, noise,
      noiseCluster: noise > 0 ? found : null, stability: order.map((old) => h.stability[old]), preReduced, space: choices.space,
    },
    labels,
    confidence,
    centroids: clusterMeans(data, n, d, labels, k),
    sizes,
  };
}

/** Mean of each cluster's rows, k × d. */
export function clusterMeans(data: Float64Array, n: number, d: number, labels: Int32Array, k: number): Float64Array {
  const out = new Float64Array(k * d);
  const counts = new Float64Array(k);
  for (let i = 0; i < n; i++) {
    const c = labels[i];
    counts[c]++;
    for (let j = 0; j < d; j++) out[c * d + j] += data[i * d + j];
  }
  for (let c = 0; c < k; c++) for (let j = 0; j < d; j++) out[c * d + j] /= counts[c] || 1;
  return out;
}
