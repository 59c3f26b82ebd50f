import { columnMoments, modeShareSorted, sortedColumn } from './column-stats';
import { correlationMatrix } from './correlation';

export interface NearConstantFeature {
  index: number;
  variance: number;
  modeShare: number;
}

/**
 * Features whose variance (ddof 0) is at or below `minVariance` (a spread at rounding level of
 * the mean counts as 0) or whose most frequent value covers at least `maxModeShare` of its
 * present values. Features with no value at all are included (variance NaN).
 */
export function nearConstantFeatures(data: Float64Array, n: number, d: number, minVariance: number, maxModeShare: number): NearConstantFeature[] {
  const { variance, mean } = columnMoments(data, n, d);
  const out: NearConstantFeature[] = [];
  for (let j = 0; j < d; j++) {
    const modeShare = modeShareSorted(sortedColumn(data, n, d, j));
    const tiny = 1e-12 * Math.max(1, Math.abs(mean[j]));
    const v = variance[j];
    if (!(v > minVariance) || Math.sqrt(v) <= tiny || !(modeShare < maxModeShare)) out.push({ index: j, variance: v, modeShare });
  }
  return out;
}

export interface CorrelatedPair {
  a: number;
  b: number;
  r: number;
}

/** Every pair a < b with |r| > threshold, strongest first (ties by a, then b). */
export function correlatedPairs(data: Float64Array, n: number, d: number, threshold: number): CorrelatedPair[] {
  const r = correlationMatrix(data, n, d);
  const out: CorrelatedPair[] = [];
  for (let a = 0; a < d; a++) {
    for (let b = a + 1; b < d; b++) {
      const v = r[a * d + b];
      if (Math.abs(v) > threshold) out.push({ a, b, r: v });
    }
  }
  return out.sort((x, y) => Math.abs(y.r) - Math.abs(x.r) || x.a - y.a || x.b - y.b);
}

export interface PrunedFeature {
  index: number;
  /** The kept feature it was too correlated with. */
  because: number;
  r: number;
}

/**
 * Greedy pruning in feature order: a feature is dropped when it correlates above the threshold
 * with an earlier feature that is kept. Returns the dropped features, ascending.
 */
export function pruneCorrelated(data: Float64Array, n: number, d: number, threshold: number): PrunedFeature[] {
  const r = correlationMatrix(data, n, d);
  const kept: number[] = [];
  const dropped: PrunedFeature[] = [];
  for (let b = 0; b < d; b++) {
    const hit = kept.find((a) => Math.abs(r[a * d + b]) > threshold);
    if (hit === undefined) kept.push(b);
    else dropped.push({ index: b, because: hit, r: r[hit * d + b] });
  }
  return dropped;
}
