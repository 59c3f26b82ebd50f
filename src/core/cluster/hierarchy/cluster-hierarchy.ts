import type { JobContext } from '../../job';
import { quietContext } from '../../job';
import { hierarchical } from './hierarchical';
import type { Linkage, MergeTree } from './merge-tree';
import { TWO_STAGE_THRESHOLD, twoStageHierarchy } from './two-stage';

export interface ClusterHierarchyOptions {
  linkage: Linkage;
  seed: number;
  /** Windows above which the two-stage path is taken; default TWO_STAGE_THRESHOLD (20,000). */
  threshold?: number;
  /** Micro-clusters of the two-stage path; default 1,000. */
  microClusters?: number;
}

export interface ClusterHierarchyResult {
  tree: MergeTree;
  /** Leaf of every window: the window itself on the exact path, its micro-cluster on the two-stage path. */
  assignment: Int32Array;
  path: 'exact' | 'two-stage';
}

/** The hierarchy for any n: exact up to `threshold` windows, two-stage above. */
export async function clusterHierarchy(
  data: Float64Array, n: number, d: number, options: ClusterHierarchyOptions, ctx: JobContext = quietContext,
): Promise<ClusterHierarchyResult> {
  const threshold = options.threshold ?? TWO_STAGE_THRESHOLD;
  if (n <= threshold) {
    const tree = await hierarchical(data, n, d, { linkage: options.linkage }, ctx);
    return { tree, assignment: Int32Array.from({ length: n }, (_, i) => i), path: 'exact' };
  }
  const r = await twoStageHierarchy(data, n, d, { linkage: options.linkage, seed: options.seed, microClusters: options.microClusters }, ctx);
  return { tree: r.tree, assignment: r.assignment, path: 'two-stage' };
}
