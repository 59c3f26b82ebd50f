import { describe, expect, it } from 'vitest';
import { Fft } from '../../../src/core/math/fft';
import { normal, seededRandom } from '../../../src/core/random';

/** Naive DFT by its definition X_k = Σ_t x_t e^{∓2πi kt/N} (common practice), O(N²). */
function naiveDft(re: Float64Array, im: Float64Array, inverse: boolean): { re: Float64Array; im: Float64Array } {
  const n = re.length;
  const sign = inverse ? 1 : -1;
  const outRe = new Float64Array(n), outIm = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    for (let t = 0; t < n; t++) {
      const a = (sign * 2 * Math.PI * ((k * t) % n)) / n;
      outRe[k] += re[t] * Math.cos(a) - im[t] * Math.sin(a);
      outIm[k] += re[t] * Math.sin(a) + im[t] * Math.cos(a);
    }
  }
  return { re: outRe, im: outIm };
}

function randomComplex(n: number, seed: number) {
  const random = seededRandom(seed);
  return { re: Float64Array.from({ length: n }, () => normal(random)), im: Float64Array.from({ length: n }, () => normal(random)) };
}

describe('Fft', () => {
  it('matches a naive DFT, forward and inverse, for sizes 1 to 256', () => {
    for (const n of [1, 2, 4, 8, 64, 256]) {
      for (const inverse of [false, true]) {
        const x = randomComplex(n, n + (inverse ? 1000 : 0));
        const want = naiveDft(x.re, x.im, inverse);
        const re = x.re.slice(), im = x.im.slice();
        new Fft(n).transform(re, im, inverse);
        for (let k = 0; k < n; k++) {
          expect(re[k]).toBeCloseTo(want.re[k], 9);
          expect(im[k]).toBeCloseTo(want.im[k], 9);
        }
      }
    }
  });

  it('gives the textbook transform of a unit impulse and of a constant', () => {
    // DFT of δ_0 is all ones; DFT of all ones is N δ_0 (common practice).
    const re = new Float64Array(8), im = new Float64Array(8);
    re[0] = 1;
    new Fft(8).transform(re, im);
    expect(Array.from(re)).toEqual(new Array(8).fill(1));
    const ones = new Float64Array(8).fill(1), zeros = new Float64Array(8);
    new Fft(8).transform(ones, zeros);
    expect(ones[0]).toBeCloseTo(8, 12);
    for (let k = 1; k < 8; k++) { expect(ones[k]).toBeCloseTo(0, 12); expect(zeros[k]).toBeCloseTo(0, 12); }
  });

  it('transform2d matches a naive 2-D DFT and its inverse restores the grid', () => {
    const n = 16;
    const x = randomComplex(n * n, 7);
    // Naive 2-D DFT: X_{kl} = Σ_{r,c} x_{rc} e^{−2πi (kr + lc)/N} (common practice).
    const wantRe = new Float64Array(n * n), wantIm = new Float64Array(n * n);
    for (let k = 0; k < n; k++) for (let l = 0; l < n; l++) {
      for (let r = 0; r < n; r++) for (let c = 0; c < n; c++) {
        const a = (-2 * Math.PI * ((k * r + l * c) % n)) / n;
        const vr = x.re[r * n + c], vi = x.im[r * n + c];
        wantRe[k * n + l] += vr * Math.cos(a) - vi * Math.sin(a);
        wantIm[k * n + l] += vr * Math.sin(a) + vi * Math.cos(a);
      }
    }
    const fft = new Fft(n);
    const re = x.re.slice(), im = x.im.slice();
    fft.transform2d(re, im);
    for (let t = 0; t < n * n; t++) { expect(re[t]).toBeCloseTo(wantRe[t], 9); expect(im[t]).toBeCloseTo(wantIm[t], 9); }
    fft.transform2d(re, im, true);
    for (let t = 0; t < n * n; t++) { expect(re[t]).toBeCloseTo(x.re[t], 12); expect(im[t]).toBeCloseTo(x.im[t], 12); }
  });

  it('transform2d with active rows equals the full transform when the other rows are zero', () => {
    const n = 32, rows = 11;
    const x = randomComplex(n * n, 9);
    x.re.fill(0, rows * n); x.im.fill(0, rows * n);
    const fft = new Fft(n);
    const full = { re: x.re.slice(), im: x.im.slice() };
    fft.transform2d(full.re, full.im);
    const part = { re: x.re.slice(), im: x.im.slice() };
    fft.transform2d(part.re, part.im, false, rows);
    for (let t = 0; t < n * n; t++) { expect(part.re[t]).toBeCloseTo(full.re[t], 12); expect(part.im[t]).toBeCloseTo(full.im[t], 12); }
    fft.transform2d(part.re, part.im, true, rows);
    for (let t = 0; t < rows * n; t++) { expect(part.re[t]).toBeCloseTo(x.re[t], 12); expect(part.im[t]).toBeCloseTo(x.im[t], 12); }
  });

  it('rejects sizes that are not powers of two', () => {
    expect(() => new Fft(12)).toThrow(/power of two/);
    expect(() => new Fft(0)).toThrow(/power of two/);
  });
});
