export { boundRule, DEFAULT_BOUND_RULE, judgeBound, type BoundRule, type BoundVerdict } from './bound-rule';
export { categoriesOf, withMissingAsValue, type Categories } from './categories';
export { clusterMix, type ClusterMix, type CohortMix, type MixTable, type ValueCount } from './cluster-mix';
export { categoricalColumn, composeByName, MAX_CATEGORIES } from './compose-by-name';
export { composeColumn, type ColumnComposition, type ComposedCluster } from './compose-column';
export { labelAgreement, type LabelAgreement } from './label-agreement';
export { compareRuns, type ClusterMatch, type RunComparison } from './run-comparison';
