import { composeColumn, type ColumnComposition } from '../composition/compose-column';
import { labelAgreement, type LabelAgreement } from '../composition/label-agreement';
import { distinguishingFeatures, fingerprints, type DistinguishingFeature } from '../fingerprints/fingerprints';
import type { Column } from '../table/table';
import { featureHistograms, type FeatureHistograms } from './histograms';

/** What the Mix, Fingerprints and cluster list show for one run. */
export interface ProfileInput {
  /** Feature values before scaling, row-major n × d (missing = NaN). */
  data: Float64Array;
  n: number;
  d: number;
  featureNames: string[];
  /** Cluster per window (table row), -1 for windows the run left out. */
  labels: Int32Array;
  k: number;
  /** Column to compose clusters by (subject, device, site…); undefined gives one value. */
  compose?: Column;
  /** Noun for the composed values in reasons ('subject' for the subject column). */
  noun?: string;
  /** A partial label column: agreement is computed on its labelled windows only. */
  label?: Column;
  /** Distinguishing features kept per cluster (default 8). */
  top?: number;
  /** Bins of each feature's distribution plot (default 24). */
  bins?: number;
}

export interface RunProfile {
  composition: ColumnComposition;
  /** k × d standardized cluster means (row-major), NaN where a cluster has no value. */
  standardizedMeans: Float64Array;
  /** Feature indices, most separating first (Kruskal–Wallis H). */
  order: Int32Array;
  /** Kruskal–Wallis H per feature, table order. */
  h: Float64Array;
  featureNames: string[];
  /** Per cluster: its features with the largest |Cohen's d| against all other windows. */
  distinguishing: DistinguishingFeature[][];
  histograms: FeatureHistograms;
  labelAgreement: LabelAgreement | null;
}

/** Composition, fingerprints, per-cluster distribution plots and label agreement of one run. */
export function profileRun(p: ProfileInput): RunProfile {
  const { data, n, d, labels, k } = p;
  if (labels.length !== n) throw new Error(`expected ${n} cluster labels, got ${labels.length}`);
  const fp = fingerprints(data, n, d, labels, k, p.featureNames);
  const top = Math.max(1, Math.min(d, p.top ?? 8));
  return {
    composition: composeColumn(labels, k, p.compose, {}, p.noun ?? p.compose?.name ?? 'value'),
    standardizedMeans: fp.standardizedMeans,
    order: Int32Array.from(fp.order),
    h: Float64Array.from(fp.separation, (s) => s.h),
    featureNames: fp.featureNames,
    distinguishing: Array.from({ length: k }, (_, c) => distinguishingFeatures(fp, c, top)),
    histograms: featureHistograms(data, n, d, labels, k, p.bins ?? 24),
    labelAgreement: p.label ? labelAgreement(labels, p.label) : null,
  };
}
