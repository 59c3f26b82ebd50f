/** Columns transformed together in the 2-D transform's column pass. */
const BLOCK = 16;

/**
 * Radix-2 complex FFT on split real / imaginary Float64Arrays (iterative Cooley–Tukey with a
 * bit-reversal permutation), and a 2-D transform of square size × size grids built on it.
 * Forward: X_k = Σ_t x_t e^{−2πi kt/N}; inverse: x_t = (1/N) Σ_k X_k e^{+2πi kt/N}.
 */
export class Fft {
  readonly size: number;
  private readonly cos: Float64Array;
  private readonly sin: Float64Array;
  private readonly reverse: Int32Array;
  /** BLOCK columns gathered side by side (column c of the block at c · size) for the column pass. */
  private readonly colRe: Float64Array;
  private readonly colIm: Float64Array;

  constructor(size: number) {
    if (!Number.isInteger(size) || size < 1 || (size & (size - 1)) !== 0) {
      throw new RangeError(`FFT size must be a power of two, got ${size}`);
    }
    this.size = size;
    const half = size >> 1;
    this.cos = new Float64Array(half);
    this.sin = new Float64Array(half);
    for (let k = 0; k < half; k++) {
      this.cos[k] = Math.cos((2 * Math.PI * k) / size);
      this.sin[k] = Math.sin((2 * Math.PI * k) / size);
    }
    this.reverse = new Int32Array(size);
    const bits = Math.log2(size);
    for (let i = 0; i < size; i++) {
      let r = 0;
      for (let b = 0; b < bits; b++) r |= ((i >> b) & 1) << (bits - 1 - b);
      this.reverse[i] = r;
    }
    this.colRe = new Float64Array(size * Math.min(BLOCK, size));
    this.colIm = new Float64Array(size * Math.min(BLOCK, size));
  }

  /** In-place transform of re/im[offset .. offset + size); the inverse is not scaled here. */
  transform(re: Float64Array, im: Float64Array, inverse = false, offset = 0): void {
    const n = this.size;
    const { reverse, cos, sin } = this;
    for (let i = 0; i < n; i++) {
      const j = reverse[i];
      if (j > i) {
        const a = offset + i, b = offset + j;
        let t = re[a]; re[a] = re[b]; re[b] = t;
        t = im[a]; im[a] = im[b]; im[b] = t;
      }
    }
    const sign = inverse ? 1 : -1;
    for (let len = 2; len <= n; len <<= 1) {
      const half = len >> 1;
      const step = n / len;
      for (let start = offset; start < offset + n; start += len) {
        for (let k = 0; k < half; k++) {
          const wr = cos[k * step], wi = sign * sin[k * step];
          const a = start + k, b = a + half;
          const xr = re[b] * wr - im[b] * wi;
          const xi = re[b] * wi + im[b] * wr;
          re[b] = re[a] - xr; im[b] = im[a] - xi;
          re[a] += xr; im[a] += xi;
        }
      }
    }
  }

  /**
   * In-place 2-D transform of a row-major size × size grid. Forward: rows from `activeRows` on must be
   * zero (their row transforms are skipped). Inverse
   * (scaled by 1 / size²): only the first `activeRows` rows of the result are computed; the other
   * rows hold intermediate values.
   */
  transform2d(re: Float64Array, im: Float64Array, inverse = false, activeRows = this.size): void {
    const n = this.size;
    if (!inverse) for (let r = 0; r < activeRows; r++) this.transform(re, im, false, r * n);
    // Columns in blocks of BLOCK, so each row is read and written in short contiguous runs.
    const { colRe, colIm } = this;
    const block = Math.min(BLOCK, n);
    for (let c0 = 0; c0 < n; c0 += block) {
      for (let r = 0; r < n; r++) {
        const row = r * n + c0;
        for (let c = 0; c < block; c++) { colRe[c * n + r] = re[row + c]; colIm[c * n + r] = im[row + c]; }
      }
      for (let c = 0; c < block; c++) this.transform(colRe, colIm, inverse, c * n);
      for (let r = 0; r < n; r++) {
        const row = r * n + c0;
        for (let c = 0; c < block; c++) { re[row + c] = colRe[c * n + r]; im[row + c] = colIm[c * n + r]; }
      }
    }
    if (inverse) {
      const scale = 1 / (n * n);
      for (let r = 0; r < activeRows; r++) {
        this.transform(re, im, true, r * n);
        for (let t = r * n; t < (r + 1) * n; t++) { re[t] *= scale; im[t] *= scale; }
      }
    }
  }
}
