import { describe, expect, it } from 'vitest';
import { covariance, columnMeans } from '../../../src/core/embed/covariance';
import { symmetricEigen } from '../../../src/core/embed/eigen';
import { pca } from '../../../src/core/embed/pca';
import { irisMatrix } from '../iris';

/** Compare two vectors up to a common sign (PCA axes are defined up to sign). */
function expectUpToSign(actual: ArrayLike<number>, expected: number[], digits: number) {
  const sign = Math.sign(actual[0]) === Math.sign(expected[0]) ? 1 : -1;
  expected.forEach((v, i) => expect(sign * actual[i]).toBeCloseTo(v, digits));
}

describe('pca(data, n, d, nComponents)', () => {
  // scikit-learn sklearn/decomposition/_pca.py PCA docstring example.
  const X = Float64Array.from([-1, -1, -2, -1, -3, -2, 1, 1, 2, 1, 3, 2]);

  it('matches the scikit-learn PCA docstring example', () => {
    const p = pca(X, 6, 2, 2);
    expect(p.explainedVarianceRatio[0]).toBeCloseTo(0.99244289, 8);
    expect(p.explainedVarianceRatio[1]).toBeCloseTo(0.00755711, 8);
    expect(p.singularValues[0]).toBeCloseTo(6.30061232, 7);
    expect(p.singularValues[1]).toBeCloseTo(0.54980396, 7);
    expect(p.explainedVariance[0]).toBeCloseTo(7.93954312, 7);
    expect(p.explainedVariance[1]).toBeCloseTo(0.06045688, 7);
    expectUpToSign(p.components.subarray(0, 2), [0.83849224, 0.54491354], 7);
    expectUpToSign(p.components.subarray(2, 4), [-0.54491354, 0.83849224], 7);
  });

  it('gives the scikit-learn scores, and the largest loading of each axis is positive', () => {
    const p = pca(X, 6, 2, 2);
    // Our sign convention (largest-|loading| positive) coincides with the docstring's signs here.
    expect(p.components[0]).toBeGreaterThan(0);
    expect(p.components[3]).toBeGreaterThan(0);
    expect(p.scores[0]).toBeCloseTo(-1.38340578, 7);
    expect(p.scores[1]).toBeCloseTo(-0.2935787, 7);
    expect(p.scores[4]).toBeCloseTo(-3.6053038, 7);
    expect(p.scores[5]).toBeCloseTo(-0.04224385, 7);
  });

  it('reproduces the covariance and eigenvalues of the L. I. Smith tutorial', () => {
    // L. I. Smith, "A tutorial on Principal Components Analysis" (2002), p. 15.
    const x = [2.5, 0.5, 2.2, 1.9, 3.1, 2.3, 2.0, 1.0, 1.5, 1.1];
    const y = [2.4, 0.7, 2.9, 2.2, 3.0, 2.7, 1.6, 1.1, 1.6, 0.9];
    const data = Float64Array.from(x.flatMap((v, i) => [v, y[i]]));
    const c = covariance(data, 10, 2, columnMeans(data, 10, 2));
    expect(c[0]).toBeCloseTo(0.616555556, 8);
    expect(c[1]).toBeCloseTo(0.615444444, 8);
    expect(c[2]).toBeCloseTo(0.615444444, 8);
    expect(c[3]).toBeCloseTo(0.716555556, 8);
    const e = symmetricEigen(c, 2);
    expect(e.values[0]).toBeCloseTo(1.28402771, 8);
    expect(e.values[1]).toBeCloseTo(0.0490833989, 9);
  });

  it('matches R prcomp on iris (variance ratio, sdev, PC1 loadings)', () => {
    // R prcomp(iris[, 1:4]) on the R/Fisher iris; fixture test/fixtures/iris.csv.
    const { data, n, d } = irisMatrix();
    const p = pca(data, n, d, 4);
    [0.924618723, 0.053066483, 0.01710261, 0.005212184].forEach((v, k) => expect(p.explainedVarianceRatio[k]).toBeCloseTo(v, 8));
    [2.0562689, 0.4926162, 0.2796596, 0.1543862].forEach((v, k) => expect(Math.sqrt(p.explainedVariance[k])).toBeCloseTo(v, 6));
    expectUpToSign(p.components.subarray(0, 4), [0.36138659, -0.08452251, 0.85667061, 0.3582892], 7);
  });

  it('diagonalizes a larger symmetric matrix: A v = λ v, orthonormal vectors', () => {
    const d = 12;
    const a = new Float64Array(d * d);
    for (let i = 0; i < d; i++) for (let j = 0; j <= i; j++) a[i * d + j] = a[j * d + i] = Math.sin(i * 7 + j * 3) + (i === j ? 3 : 0);
    const { values, vectors } = symmetricEigen(a, d);
    for (let k = 0; k < d; k++) {
      if (k > 0) expect(values[k]).toBeLessThanOrEqual(values[k - 1]);
      for (let i = 0; i < d; i++) {
        let av = 0;
        for (let j = 0; j < d; j++) av += a[i * d + j] * vectors[k * d + j];
        expect(av).toBeCloseTo(values[k] * vectors[k * d + i], 10);
      }
      for (let l = 0; l < d; l++) {
        let dot = 0;
        for (let j = 0; j < d; j++) dot += vectors[k * d + j] * vectors[l * d + j];
        expect(dot).toBeCloseTo(k === l ? 1 : 0, 10);
      }
    }
  });
});
