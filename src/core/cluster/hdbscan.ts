/**
 * HDBSCAN (Campello, Moulavi & Sander 2013, "Density-based clustering based on hierarchical
 * density estimates"; the condensed tree and excess-of-mass selection as McInnes & Healy 2017,
 * "Accelerated hierarchical density based clustering", describe them): clusters without choosing k.
 *
 * 1. Core distance of a window: the Euclidean distance to its (minSamples − 1)-th nearest other
 *    window (so minSamples counts the window itself, as R's dbscan::hdbscan does).
 * 2. Mutual reachability of a and b: max(core(a), core(b), d(a, b)); its minimum spanning tree
 *    (Prim, O(n²) distance evaluations, O(n) memory) sorted by weight is the single-linkage tree.
 * 3. Condensed tree: walking down from the root, a split whose two sides both hold at least
 *    minClusterSize windows makes two child clusters; a smaller side's windows fall out of the
 *    cluster at that level (λ = 1 / distance); when both sides are small the cluster ends.
 * 4. Stability of a cluster: Σ over its windows (λ when the window leaves it − λ at its birth). A
 *    window that leaves in a group too small to be a cluster leaves at that split's λ, as in the
 *    condensed tree of McInnes & Healy; R's dbscan 1.1.11 takes each such window's own merge height
 *    instead, so the two can select differently where small groups break off (the bench reports
 *    the agreement; on the reference datasets of the tests they agree exactly).
 *    Excess of mass: going up, a cluster is selected when its stability is at least the sum of its
 *    selected descendants'; the root is never selected. Windows under no selected cluster are noise.
 */
import { OptionError } from '../errors';
import { quietContext, type JobContext } from '../job';
import { exactKnn } from '../neighbors/exact';
import { squaredDistance } from './distance';
import { singleLinkageMst } from './hierarchy/mst-single';
import { toMergeTree, type MergeTree } from './hierarchy/merge-tree';

export interface HdbscanOptions {
  /** Smallest number of windows a cluster may hold (≥ 2). */
  minClusterSize: number;
  /** Windows (itself included) that make a window's neighbourhood dense; default minClusterSize. */
  minSamples?: number;
}

/** The condensed tree: cluster 0 is the root; clusters are numbered in order of birth, top down. */
export interface CondensedTree {
  parent: Int32Array;
  /** λ = 1 / mutual-reachability distance at which the cluster appears (root: 0). */
  birth: Float64Array;
  /** Windows in the cluster at its birth. */
  size: Int32Array;
  stability: Float64Array;
  /** 1 for the clusters excess of mass selected. */
  selected: Uint8Array;
}

export interface HdbscanResult {
  /** Cluster of each window, 0..clusters−1 numbered by their first window; −1 = noise. */
  labels: Int32Array;
  clusters: number;
  /** Stability of each output cluster (its λ-excess of mass). */
  stability: Float64Array;
  /** Core distance of each window. */
  coreDistance: Float64Array;
  condensed: CondensedTree;
  /** The single-linkage tree of mutual reachability (heights are distances). */
  tree: MergeTree;
}

/** λ − birth, 0 when both are infinite (windows at distance zero). */
function excess(lambda: number, birth: number): number {
  return lambda === birth ? 0 : lambda - birth;
}

/** HDBSCAN of the rows of a row-major n × d matrix (Euclidean). Deterministic: ties go to the lower index. */
export async function hdbscan(
  data: Float64Array, n: number, d: number, options: HdbscanOptions, ctx: JobContext = quietContext,
): Promise<HdbscanResult> {
  const mcs = options.minClusterSize;
  const ms = options.minSamples ?? mcs;
  if (!Number.isInteger(mcs) || mcs < 2) throw new OptionError('minClusterSize', mcs, 'an integer ≥ 2');
  if (!Number.isInteger(ms) || ms < 1) throw new OptionError('minSamples', ms, 'an integer ≥ 1');
  if (mcs > n || ms > n) throw new OptionError(mcs > n ? 'minClusterSize' : 'minSamples', mcs > n ? mcs : ms, `at most the ${n} windows`);

  ctx.progress('core distances', 0);
  const coreDistance = new Float64Array(n);
  if (ms > 1) {
    const knn = await exactKnn(data, n, d, ms - 1, 'euclidean', ctx);
    for (let i = 0; i < n; i++) coreDistance[i] = knn.distances[i * knn.k + knn.k - 1];
  }
  const core2 = coreDistance.map((c) => c * c);
  const mutual = (i: number, j: number): number => {
    const dd = squaredDistance(data, i * d, data, j * d, d);
    return Math.max(dd, core2[i], core2[j]);
  };
  // Prim on squared mutual reachability (same tree, same order); heights back to distances.
  const raw = await singleLinkageMst(n, mutual, ctx, d);
  for (let k = 0; k < raw.height.length; k++) raw.height[k] = Math.sqrt(raw.height[k]);
  const tree = toMergeTree(raw);
  ctx.progress('condensed tree', 0.99);
  const condensed = condense(tree, mcs);
  select(condensed.tree);
  const { labels, clusters, stability } = labelWindows(n, condensed.tree, condensed.pointCluster);
  return { labels, clusters, stability, coreDistance, condensed: condensed.tree, tree };
}

interface Condensing {
  tree: CondensedTree;
  /** The cluster each window falls out of, and at which λ. */
  pointCluster: Int32Array;
  pointLambda: Float64Array;
}

/** Step 3 and the stabilities of step 4. */
function condense(tree: MergeTree, mcs: number): Condensing {
  const n = tree.n;
  const nodeSize = (node: number): number => (node < n ? 1 : tree.size[node - n]);
  const parent: number[] = [-1], birth: number[] = [0], size: number[] = [n];
  const pointCluster = new Int32Array(n).fill(-1);
  const pointLambda = new Float64Array(n);
  const fallOut = (node: number, cluster: number, lambda: number): void => {
    const stack = [node];
    while (stack.length) {
      const v = stack.pop()!;
      if (v < n) { pointCluster[v] = cluster; pointLambda[v] = lambda; continue; }
      stack.push(tree.left[v - n], tree.right[v - n]);
    }
  };
  // (dendrogram node, the condensed cluster it belongs to)
  const stack: [number, number][] = [[2 * n - 2, 0]];
  while (stack.length) {
    const [node, cluster] = stack.pop()!;
    if (node < n) { pointCluster[node] = cluster; pointLambda[node] = 1 / 0; continue; }
    const m = node - n;
    const lambda = tree.height[m] > 0 ? 1 / tree.height[m] : Infinity;
    const left = tree.left[m], right = tree.right[m];
    const bigLeft = nodeSize(left) >= mcs, bigRight = nodeSize(right) >= mcs;
    if (bigLeft && bigRight) {
      // Right pushed first so the left child is born (numbered) first.
      const kids: [number, number][] = [];
      for (const child of [left, right]) {
        parent.push(cluster); birth.push(lambda); size.push(nodeSize(child));
        kids.push([child, parent.length - 1]);
      }
      stack.push(kids[1], kids[0]);
    } else if (bigLeft) {
      fallOut(right, cluster, lambda);
      stack.push([left, cluster]);
    } else if (bigRight) {
      fallOut(left, cluster, lambda);
      stack.push([right, cluster]);
    } else {
      fallOut(left, cluster, lambda);
      fallOut(right, cluster, lambda);
    }
  }
  const c = parent.length;
  const out: CondensedTree = {
    parent: Int32Array.from(parent), birth: Float64Array.from(birth), size: Int32Array.from(size),
    stability: new Float64Array(c), selected: new Uint8Array(c),
  };
  for (let p = 0; p < n; p++) out.stability[pointCluster[p]] += excess(pointLambda[p], out.birth[pointCluster[p]]);
  for (let k = 1; k < c; k++) out.stability[out.parent[k]] += out.size[k] * excess(out.birth[k], out.birth[out.parent[k]]);
  return { tree: out, pointCluster, pointLambda };
}

/** Excess-of-mass selection (step 4), bottom up; children always have larger numbers than parents. */
function select(t: CondensedTree): void {
  const c = t.parent.length;
  const best = Float64Array.from(t.stability);
  const childSum = new Float64Array(c);
  const hasChild = new Uint8Array(c);
  for (let k = c - 1; k >= 1; k--) {
    if (hasChild[k] && childSum[k] > t.stability[k]) best[k] = childSum[k];
    else t.selected[k] = 1;
    childSum[t.parent[k]] += best[k];
    hasChild[t.parent[k]] = 1;
  }
  // A selected cluster takes its descendants' windows: unselect every cluster below a selected one.
  for (let k = 1; k < c; k++) {
    for (let a = t.parent[k]; a > 0; a = t.parent[a]) if (t.selected[a]) { t.selected[k] = 0; break; }
  }
}

/** Labels from the selection: a window joins the selected cluster above where it fell out. */
function labelWindows(n: number, t: CondensedTree, pointCluster: Int32Array): { labels: Int32Array; clusters: number; stability: Float64Array } {
  const owner = new Int32Array(t.parent.length).fill(-1);
  for (let k = 1; k < t.parent.length; k++) owner[k] = t.selected[k] ? k : owner[t.parent[k]];
  const number = new Map<number, number>();
  const labels = new Int32Array(n).fill(-1);
  const stability: number[] = [];
  for (let p = 0; p < n; p++) {
    const sel = owner[pointCluster[p]];
    if (sel < 0) continue;
    let id = number.get(sel);
    if (id === undefined) {
      id = number.size;
      number.set(sel, id);
      stability.push(t.stability[sel]);
    }
    labels[p] = id;
  }
  return { labels, clusters: number.size, stability: Float64Array.from(stability) };
}
