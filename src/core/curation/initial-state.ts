import type { ClusterRecord } from '../analysis.types';
import type { ClusterNote, CurationState } from './curation.types';

export function emptyNote(): ClusterNote {
  return { name: '', colour: '', description: '', setAside: false, className: '', mergedInto: -1 };
}

/**
 * The state before any curation: the run's labels (copied) and k blank clusters, the run's noise
 * cluster (HDBSCAN) already set aside.
 */
export function initialCuration(labels: Int32Array, k: number, cluster?: ClusterRecord): CurationState {
  for (let i = 0; i < labels.length; i++) {
    if (!(labels[i] >= 0 && labels[i] < k)) throw new Error(`initialCuration: label ${labels[i]} of window ${i} is outside 0..${k - 1}`);
  }
  const clusters = Array.from({ length: k }, emptyNote);
  const noise = cluster?.method === 'hdbscan' ? cluster.noiseCluster : null;
  if (noise !== null && noise < k) clusters[noise].setAside = true;
  return { labels: labels.slice(), clusters };
}

/** Windows per cluster index. */
export function clusterSizes(state: CurationState): Int32Array {
  const sizes = new Int32Array(state.clusters.length);
  for (let i = 0; i < state.labels.length; i++) sizes[state.labels[i]]++;
  return sizes;
}

/** Class name per cluster ('' for candidates and for clusters set aside), for exports. */
export function classNames(state: CurationState): string[] {
  return state.clusters.map((c) => (c.setAside ? '' : c.className));
}

/** Set-aside flag per cluster, for exports. */
export function setAsideFlags(state: CurationState): boolean[] {
  return state.clusters.map((c) => c.setAside);
}
