import { Fft } from '../../math/fft';
import type { Repulsion } from './repulsion.types';

/** Lagrange interpolation nodes per box and dimension (3, as the published method's default). */
export const INTERPOLATION_NODES = 3;
/** Fewest boxes per dimension: 40 (the published default is 50; 40 lets small maps use a 256 × 256 grid). */
export const MIN_BOXES = 40;
/** Widest box, in map units, on grids up to COARSE_GRID (1, as the published method's default: one box per unit of span at least). */
export const MAX_BOX_WIDTH = 1;
/**
 * Widest box on grids of side COARSE_GRID and up: 1.5. A 1024 grid costs about four times a 512 one
 * (over 0.2 s of CPU per step, most of a 100,000-window run), so spans from about 40 to 120 keep the
 * 512 grid with boxes 0.5 to 1.5 wide (measured: see docs/embeddings.md).
 */
export const COARSE_BOX_WIDTH = 1.5;
/** Grid side from which boxes may be COARSE_BOX_WIDTH wide. */
export const COARSE_GRID = 512;

/** Largest FFT grid side; past a span of about 170 the boxes grow wider than 1 instead. */
const MAX_GRID = 1024;
/** Ratio between consecutive box widths on the ladder (2^(1/16), about 4.4%). */
const LADDER = 2 ** (1 / 16);

/** The smallest width on the ladder 2^(k/16) (k an integer) that is at least `width`. */
function quantize(width: number): number {
  const k = Math.ceil(Math.log2(width) * 16 - 1e-9);
  return 2 ** (k / 16);
}

/**
 * Repulsive t-SNE forces by FFT-accelerated polynomial interpolation, following "Fast
 * interpolation-based t-SNE for improved visualization of single-cell RNA-seq data" (G. C.
 * Linderman, M. Rachh, J. G. Hoskins, S. Steinerberger, Y. Kluger; Nature Methods 2019) (from memory).
 *
 * The square around the points is cut into B × B boxes with p equispaced Lagrange nodes per box
 * and dimension, so all nodes lie on one regular m × m grid (m = B·p). Each point's unit charge is
 * spread to the nodes of its box with the interpolation weights (q), convolved on the grid by a 2-D
 * FFT (zero-padded circulant embedding of size L × L, L a power of two ≥ 2m) with the force
 * kernels w(d)² d_x and w(d)² d_y (packed as real and imaginary parts of one complex kernel, as
 * both results are real), and read back at the points with the same weights: these are the
 * repulsive sums Σ_j w_ij² (y_i − y_j), w(d) = 1/(1 + |d|²). Convolving with the force kernels
 * themselves (rather than expanding y_i − y_j into charges 1, y_j) keeps the error relative to the
 * force, whatever the map's offset and size. The normaliser needs only the total
 * Σ_i Σ_j w_ij ≈ Σ_nodes q · (w ∗ q), taken in the frequency domain (Parseval), minus the n self terms.
 * B = max(40, ⌈span · 2^(1/16)⌉) (boxes at most 1 wide) while L < 512, and B = max(40,
 * ⌈span · 2^(1/16) / 1.5⌉) (boxes at most 1.5 wide) for L ≥ 512, raised to the most boxes the chosen L
 * allows; the box width is span / B rounded up to the ladder 2^(k/16), so the kernel transforms
 * are reused until it moves a step. L is capped at 1024 (boxes then grow wider than 1). Cost per
 * call: O(n·p²) plus two L × L FFTs.
 */
export class FftRepulsion implements Repulsion {
  private readonly p: number;
  /** Node positions within a box, in box units, and the Lagrange denominators. */
  private readonly nodes: Float64Array;
  private readonly denominators: Float64Array;
  /** Per point: first grid column / row of its box and its p weights along x and along y. */
  private readonly col: Int32Array;
  private readonly row: Int32Array;
  private readonly wx: Float64Array;
  private readonly wy: Float64Array;
  private fft: Fft | null = null;
  /** Side L of the FFT grid used by the latest compute() (0 before the first). */
  gridSide = 0;
  /** Grid size and node spacing the kernel transforms were computed for. */
  private kernelSize = 0;
  private kernelSpacing = 0;
  /** The charge grid (real; then its transform, times the force kernels', then the potentials). */
  private qRe = new Float64Array(0);
  private qIm = new Float64Array(0);
  /** Transform of w (real), and of w²d_x + i·w²d_y. */
  private kW = new Float64Array(0);
  private kFre = new Float64Array(0);
  private kFim = new Float64Array(0);

  constructor(n: number, p = INTERPOLATION_NODES, private readonly maxBoxWidth = MAX_BOX_WIDTH) {
    this.p = p;
    this.nodes = Float64Array.from({ length: p }, (_, j) => (j + 0.5) / p);
    this.denominators = new Float64Array(p);
    for (let j = 0; j < p; j++) {
      let den = 1;
      for (let k = 0; k < p; k++) if (k !== j) den *= this.nodes[j] - this.nodes[k];
      this.denominators[j] = den;
    }
    this.col = new Int32Array(n);
    this.row = new Int32Array(n);
    this.wx = new Float64Array(n * p);
    this.wy = new Float64Array(n * p);
  }

  compute(y: Float64Array, n: number, out: Float64Array): number {
    const p = this.p;
    let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
    for (let i = 0; i < n; i++) {
      const a = y[2 * i], b = y[2 * i + 1];
      if (a < minX) minX = a; if (a > maxX) maxX = a;
      if (b < minY) minY = b; if (b > maxY) maxY = b;
    }
    const span = Math.max(maxX - minX, maxY - minY, 1e-12) * (1 + 1e-9);
    const cx = (minX + maxX) / 2, cy = (minY + maxY) / 2;
    const fine = Math.max(MIN_BOXES, Math.ceil(span / (this.maxBoxWidth / LADDER)));
    const coarse = Math.max(MIN_BOXES, Math.ceil(span / (Math.max(this.maxBoxWidth, COARSE_BOX_WIDTH) / LADDER)));
    let size = 2;
    while (Math.floor(size / 2 / p) < (size >= COARSE_GRID ? coarse : fine) && size < MAX_GRID) size *= 2;
    const boxes = Math.floor(size / 2 / p);
    const m = boxes * p;
    // Box width on a geometric ladder (so the kernel transforms are reused while it holds); the
    // grid, centred on the points, is then up to one ladder step wider than the span.
    const boxWidth = quantize(span / boxes);
    const x0 = cx - (boxes * boxWidth) / 2, y0 = cy - (boxes * boxWidth) / 2;
    this.ensureGrids(size);
    this.gridSide = size;
    if (this.kernelSize !== size || this.kernelSpacing !== boxWidth / p) this.kernels(size, m, boxWidth / p);
    this.locate(y, n, x0, y0, boxWidth, boxes);
    this.spread(n, size);
    const fft = this.fft as Fft;
    const { qRe, qIm, kW, kFre, kFim } = this;
    fft.transform2d(qRe, qIm, false, m);
    // Σ_i Σ_j w_ij = Σ_nodes q · (w ∗ q) = (1/L²) Σ_k |Q_k|² Ŵ_k (Parseval; Ŵ is real, w being even).
    let zSum = 0;
    for (let t = 0; t < size * size; t++) {
      const qr = qRe[t], qi = qIm[t];
      zSum += (qr * qr + qi * qi) * kW[t];
      const kr = kFre[t], ki = kFim[t];
      qRe[t] = qr * kr - qi * ki; qIm[t] = qr * ki + qi * kr;
    }
    fft.transform2d(qRe, qIm, true, m);
    this.gather(n, size, out);
    return zSum / (size * size) - n;
  }

  private ensureGrids(size: number): void {
    if (this.fft?.size === size) return;
    this.fft = new Fft(size);
    const cells = size * size;
    this.qRe = new Float64Array(cells); this.qIm = new Float64Array(cells);
    this.kW = new Float64Array(cells);
    this.kFre = new Float64Array(cells); this.kFim = new Float64Array(cells);
    this.kernelSize = 0;
  }

  /** Box of every point and its Lagrange weights along each axis. */
  private locate(y: Float64Array, n: number, x0: number, y0: number, boxWidth: number, boxes: number): void {
    const { p, col, row, wx, wy } = this;
    for (let i = 0; i < n; i++) {
      const u = (y[2 * i] - x0) / boxWidth, v = (y[2 * i + 1] - y0) / boxWidth;
      const bx = Math.max(0, Math.min(boxes - 1, Math.floor(u))), by = Math.max(0, Math.min(boxes - 1, Math.floor(v)));
      col[i] = bx * p; row[i] = by * p;
      this.weights(u - bx, wx, i * p);
      this.weights(v - by, wy, i * p);
    }
  }

  private weights(u: number, out: Float64Array, at: number): void {
    const { p, nodes, denominators } = this;
    for (let j = 0; j < p; j++) {
      let num = 1;
      for (let k = 0; k < p; k++) if (k !== j) num *= u - nodes[k];
      out[at + j] = num / denominators[j];
    }
  }

  /**
   * The kernels at every grid offset (row offset a along y, column offset b along x, node spacing
   * h), wrapped for the circulant (offset −a at L − a; w is even, w²d_x odd in b, w²d_y odd in a),
   * then transformed: w alone (its transform is real), and w²d_x + i·w²d_y packed in one grid.
   */
  private kernels(size: number, m: number, h: number): void {
    this.kernelSize = size; this.kernelSpacing = h;
    const { kW, kFre, kFim, qIm: scratch } = this;
    kW.fill(0); kFre.fill(0); kFim.fill(0); scratch.fill(0);
    for (let a = 0; a < m; a++) {
      const ra = a === 0 ? 0 : size - a;
      for (let b = 0; b < m; b++) {
        const rb = b === 0 ? 0 : size - b;
        const w = 1 / (1 + h * h * (a * a + b * b));
        const fx = w * w * b * h, fy = w * w * a * h;
        // At b = 0 (a = 0) the x (y) force kernel is 0, so writing a cell twice does no harm.
        let t = a * size + b; kW[t] = w; kFre[t] = fx; kFim[t] = fy;
        t = a * size + rb; kW[t] = w; kFre[t] = -fx; kFim[t] = fy;
        t = ra * size + b; kW[t] = w; kFre[t] = fx; kFim[t] = -fy;
        t = ra * size + rb; kW[t] = w; kFre[t] = -fx; kFim[t] = -fy;
      }
    }
    const fft = this.fft as Fft;
    fft.transform2d(kW, scratch, false);
    fft.transform2d(kFre, kFim, false);
  }

  /** Spreads every point's unit charge onto the grid nodes of its box. */
  private spread(n: number, size: number): void {
    const { p, col, row, wx, wy, qRe, qIm } = this;
    qRe.fill(0); qIm.fill(0);
    for (let i = 0; i < n; i++) {
      for (let r = 0; r < p; r++) {
        const base = (row[i] + r) * size + col[i];
        const wr = wy[i * p + r];
        for (let c = 0; c < p; c++) qRe[base + c] += wr * wx[i * p + c];
      }
    }
  }

  /** Interpolates the force potentials (x real, y imaginary) back to the points. */
  private gather(n: number, size: number, out: Float64Array): void {
    const { p, col, row, wx, wy, qRe, qIm } = this;
    for (let i = 0; i < n; i++) {
      let fx = 0, fy = 0;
      for (let r = 0; r < p; r++) {
        const base = (row[i] + r) * size + col[i];
        const wr = wy[i * p + r];
        for (let c = 0; c < p; c++) {
          const w = wr * wx[i * p + c];
          fx += w * qRe[base + c]; fy += w * qIm[base + c];
        }
      }
      out[2 * i] = fx; out[2 * i + 1] = fy;
    }
  }
}
