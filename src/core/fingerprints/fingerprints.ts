import { cohensD } from './cohens-d';
import { clusterMoments, ownMoments, restMoments, type ClusterMoments } from './cluster-moments';
import { kruskalWallis } from './kruskal-wallis';

/** How strongly one feature separates the clusters. */
export interface FeatureSeparation {
  feature: number;
  name: string;
  /** Kruskal–Wallis H across clusters (tie-corrected); NaN when it cannot be computed. */
  h: number;
  pValue: number;
  /** Share of the feature's variance between cluster means (between SS / total SS), 0..1. */
  etaSquared: number;
}

/** The Fingerprints view's numbers: clusters × features. */
export interface Fingerprints {
  k: number;
  d: number;
  featureNames: string[];
  /**
   * k × d row-major: (cluster mean - overall mean) / overall sd (ddof 0), missing values left
   * out; 0 for a feature with no spread; NaN for a cluster without values of the feature.
   */
  standardizedMeans: Float64Array;
  /** Per feature, in table order. */
  separation: FeatureSeparation[];
  /** Feature indices, most separating first: by H, then by eta², then by table order. */
  order: number[];
  moments: ClusterMoments;
}

/**
 * Standardized cluster means of every feature and the features ordered by how much they
 * separate the clusters (Kruskal–Wallis H across clusters: rank-based, so one extreme window
 * cannot put a feature first). `data` is row-major n × d, usually the features before scaling.
 */
export function fingerprints(
  data: ArrayLike<number>, n: number, d: number, labels: ArrayLike<number>, k: number, featureNames: readonly string[],
): Fingerprints {
  if (data.length !== n * d) throw new Error(`matrix shape does not fit its data: n = ${n}, d = ${d}, ${data.length} values`);
  if (featureNames.length !== d) throw new Error(`expected ${d} feature names, got ${featureNames.length}`);
  const m = clusterMoments(data, n, d, labels, k);
  const standardizedMeans = new Float64Array(k * d);
  const column = new Float64Array(n);
  const separation: FeatureSeparation[] = [];
  for (let j = 0; j < d; j++) {
    const cnt = m.total.counts[j];
    const sd = cnt > 0 ? Math.sqrt(m.total.ss[j] / cnt) : 0;
    const flat = !(sd > 1e-12 * Math.max(1, Math.abs(m.total.means[j])));
    let between = 0;
    for (let c = 0; c < k; c++) {
      const t = c * d + j;
      if (m.counts[t] === 0) { standardizedMeans[t] = NaN; continue; }
      standardizedMeans[t] = flat ? 0 : (m.means[t] - m.total.means[j]) / sd;
      between += m.counts[t] * (m.means[t] - m.total.means[j]) ** 2;
    }
    for (let i = 0; i < n; i++) column[i] = data[i * d + j];
    const kw = kruskalWallis(column, labels, k);
    separation.push({
      feature: j, name: featureNames[j], h: kw.h, pValue: kw.pValue,
      etaSquared: flat ? 0 : Math.min(1, between / m.total.ss[j]),
    });
  }
  const key = (s: FeatureSeparation) => (s.h === s.h ? s.h : -1);
  const order = separation
    .slice()
    .sort((a, b) => key(b) - key(a) || b.etaSquared - a.etaSquared || a.feature - b.feature)
    .map((s) => s.feature);
  return { k, d, featureNames: featureNames.slice(), standardizedMeans, separation, order, moments: m };
}

/** One feature that sets a focused cluster apart from all other windows. */
export interface DistinguishingFeature {
  feature: number;
  name: string;
  /** Cohen's d of the cluster against the rest (pooled sd); positive when the cluster is higher. */
  cohensD: number;
  meanIn: number;
  meanOut: number;
  standardizedMean: number;
}

/** The `top` features with the largest |Cohen's d| of cluster `cluster` against all other clusters. */
export function distinguishingFeatures(fp: Fingerprints, cluster: number, top = 10): DistinguishingFeature[] {
  if (!Number.isInteger(cluster) || cluster < 0 || cluster >= fp.k) throw new Error(`no cluster ${cluster}: expected 0..${fp.k - 1}`);
  const out: DistinguishingFeature[] = [];
  for (let j = 0; j < fp.d; j++) {
    const own = ownMoments(fp.moments, cluster, j);
    const rest = restMoments(fp.moments, cluster, j);
    out.push({
      feature: j, name: fp.featureNames[j], cohensD: cohensD(own, rest),
      meanIn: own.mean, meanOut: rest.mean, standardizedMean: fp.standardizedMeans[cluster * fp.d + j],
    });
  }
  const size = (x: number) => (x === x ? Math.abs(x) : -1);
  return out.sort((a, b) => size(b.cohensD) - size(a.cohensD) || a.feature - b.feature).slice(0, Math.max(0, top));
}
