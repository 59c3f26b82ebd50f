import { OptionError } from '../../errors';
import type { JobContext } from '../../job';
import { quietContext } from '../../job';
import { squaredDistance } from '../distance';
import { condensedDistances, condensedIndex, type Condensed } from './condensed';
import { LINKAGES, toMergeTree, type Linkage, type MergeTree } from './merge-tree';
import { singleLinkageMst } from './mst-single';
import { nnChainCondensed } from './nn-chain';
import { wardFromPoints } from './ward-points';

export interface HierarchicalOptions {
  linkage: Linkage;
}

export function validateLinkage(linkage: unknown): Linkage {
  if (!(LINKAGES as readonly unknown[]).includes(linkage)) throw new OptionError('linkage', linkage, `one of ${LINKAGES.join(', ')}`);
  return linkage as Linkage;
}

function checkPoints(data: ArrayLike<number>, n: number, d: number): void {
  if (!Number.isInteger(n) || !Number.isInteger(d) || n < 1 || d < 1 || data.length !== n * d) {
    throw new Error(`hierarchical clustering: matrix shape does not fit its data: n = ${n}, d = ${d}, ${data.length} values`);
  }
  for (let i = 0; i < data.length; i++) {
    if (!Number.isFinite(data[i])) {
      throw new Error(`hierarchical clustering: window ${Math.floor(i / d) + 1}, feature ${(i % d) + 1} is ${data[i]}; expected a finite number (fill missing values first)`);
    }
  }
}

/**
 * Exact agglomerative clustering of n windows (row-major n × d) on Euclidean distance. Ward: the
 * nearest-neighbour chain on centroids (O(n d) memory); single: Prim's minimum spanning tree on
 * distances computed as needed (O(n) memory); average and complete: the nearest-neighbour chain on
 * a condensed distance matrix (n(n−1)/2 values, single precision above 8,192 windows). The tree
 * matches SciPy's `linkage` (heights; node numbering up to the order of equal-height merges).
 */
export async function hierarchical(
  data: ArrayLike<number>, n: number, d: number, options: HierarchicalOptions, ctx: JobContext = quietContext,
): Promise<MergeTree> {
  const linkage = validateLinkage(options.linkage);
  checkPoints(data, n, d);
  ctx.progress('linkage', 0);
  let tree: MergeTree;
  if (linkage === 'ward') {
    tree = toMergeTree(await wardFromPoints(data, n, d, ctx));
  } else if (linkage === 'single') {
    tree = toMergeTree(await singleLinkageMst(n, (i, j) => Math.sqrt(squaredDistance(data, i * d, data, j * d, d)), ctx, d));
  } else {
    ctx.progress('distances', 0);
    const dist = condensedDistances(data, n, d);
    await ctx.checkpoint();
    tree = toMergeTree(await nnChainCondensed(dist, n, linkage, ctx));
  }
  ctx.progress('linkage', 1);
  return tree;
}

/**
 * Agglomerative clustering from a condensed distance matrix of n items (SciPy's `linkage` on a
 * condensed matrix). The matrix is left unchanged. Ward assumes the distances are Euclidean.
 */
export async function linkageFromDistances(
  distances: Condensed, n: number, options: HierarchicalOptions, ctx: JobContext = quietContext,
): Promise<MergeTree> {
  const linkage = validateLinkage(options.linkage);
  if (!Number.isInteger(n) || n < 1 || distances.length !== (n * (n - 1)) / 2) {
    throw new Error(`condensed distance matrix of ${distances.length} values does not fit n = ${n}`);
  }
  if (linkage === 'single') return toMergeTree(await singleLinkageMst(n, (i, j) => distances[condensedIndex(n, i, j)], ctx));
  return toMergeTree(await nnChainCondensed(distances.slice(), n, linkage, ctx));
}
