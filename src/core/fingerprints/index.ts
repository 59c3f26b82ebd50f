export { cohensD, momentsOf, type Moments } from './cohens-d';
export { clusterMoments, ownMoments, restMoments, type ClusterMoments } from './cluster-moments';
export { distinguishingFeatures, fingerprints, type DistinguishingFeature, type FeatureSeparation, type Fingerprints } from './fingerprints';
export { kruskalWallis, type KruskalWallis } from './kruskal-wallis';
export { averageRanks, type Ranks } from './ranks';
