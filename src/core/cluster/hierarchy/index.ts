export type { Linkage, MergeTree } from './merge-tree';
export { LINKAGES } from './merge-tree';
export { hierarchical, linkageFromDistances, type HierarchicalOptions } from './hierarchical';
export { cutTree, type CutOptions } from './cut';
export { leafOrder } from './leaf-order';
export { TWO_STAGE_THRESHOLD, twoStageHierarchy, windowLabels, type TwoStageOptions, type TwoStageResult } from './two-stage';
export { clusterHierarchy, type ClusterHierarchyOptions, type ClusterHierarchyResult } from './cluster-hierarchy';
export { cutConfidence } from './confidence';
export { condensedDistances, condensedIndex, type Condensed } from './condensed';
