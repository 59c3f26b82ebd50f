import { columnMeans, covariance } from './covariance';
import { symmetricEigen } from './eigen';

export interface PcaResult {
  nComponents: number;
  /** Principal axes as rows (nComponents × d), unit length; each one's largest-|loading| entry is positive. */
  components: Float64Array;
  /** Variance along each axis (denominator n - 1). */
  explainedVariance: Float64Array;
  /** Each axis' share of the total variance. */
  explainedVarianceRatio: Float64Array;
  /** Singular values of the centred data: sqrt(variance · (n - 1)). */
  singularValues: Float64Array;
  /** Column means that were subtracted. */
  mean: Float64Array;
  /** Projections of the rows, row-major n × nComponents. */
  scores: Float64Array;
}

/**
 * PCA by the covariance route: d × d covariance, symmetric eigen-decomposition, projection.
 * Suits many rows and few features (n ≫ d). Deterministic signs: the largest-magnitude loading
 * of each component is positive (first one on ties).
 */
export function pca(data: ArrayLike<number>, n: number, d: number, nComponents: number): PcaResult {
  const mean = columnMeans(data, n, d);
  const axes = pcaAxes(covariance(data, n, d, mean), mean, n, d, nComponents);
  return { ...axes, scores: project(data, n, d, mean, axes.components, axes.nComponents) };
}

/** The principal axes from a covariance matrix (what `pca` returns, without the scores). */
export function pcaAxes(cov: Float64Array, mean: Float64Array, n: number, d: number, nComponents: number): Omit<PcaResult, 'scores'> {
  const c = Math.min(nComponents, d);
  const { values, vectors } = symmetricEigen(cov, d);
  let total = 0;
  for (let k = 0; k < d; k++) total += Math.max(0, values[k]);
  const components = new Float64Array(c * d);
  const explainedVariance = new Float64Array(c);
  const explainedVarianceRatio = new Float64Array(c);
  const singularValues = new Float64Array(c);
  for (let k = 0; k < c; k++) {
    let big = 0;
    for (let j = 1; j < d; j++) if (Math.abs(vectors[k * d + j]) > Math.abs(vectors[k * d + big]) + 1e-12) big = j;
    const sign = vectors[k * d + big] < 0 ? -1 : 1;
    for (let j = 0; j < d; j++) components[k * d + j] = sign * vectors[k * d + j];
    const ev = Math.max(0, values[k]);
    explainedVariance[k] = ev;
    explainedVarianceRatio[k] = total > 0 ? ev / total : 0;
    singularValues[k] = Math.sqrt(ev * Math.max(1, n - 1));
  }
  return { nComponents: c, components, explainedVariance, explainedVarianceRatio, singularValues, mean };
}

/** Projects rows onto the components: (x - mean) · component, row-major n × c. */
export function project(
  data: ArrayLike<number>, n: number, d: number, mean: Float64Array, components: Float64Array, c: number,
): Float64Array {
  const out = new Float64Array(n * c);
  for (let i = 0; i < n; i++) {
    const o = i * d;
    for (let k = 0; k < c; k++) {
      let s = 0;
      const co = k * d;
      for (let j = 0; j < d; j++) s += (data[o + j] - mean[j]) * components[co + j];
      out[i * c + k] = s;
    }
  }
  return out;
}
