import { describe, expect, it } from 'vitest';
import { FftRepulsion } from '../../../../src/core/embed/tsne/fft-repulsion';
import { normal, seededRandom } from '../../../../src/core/random';

/** Exact O(n²) repulsion by its definition: Σ_{j≠i} w_ij² (y_i − y_j) and Z = Σ_{i≠j} w_ij, w = 1/(1 + r²). */
function exactRepulsion(y: Float64Array, n: number) {
  const f = new Float64Array(2 * n);
  let z = 0;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      if (i === j) continue;
      const dx = y[2 * i] - y[2 * j], dy = y[2 * i + 1] - y[2 * j + 1];
      const w = 1 / (1 + dx * dx + dy * dy);
      z += w; f[2 * i] += w * w * dx; f[2 * i + 1] += w * w * dy;
    }
  }
  return { f, z };
}

/** Seeded points: `clusters` Gaussian clumps of sd `sd` with centres spread over ±`spread`. */
function points(n: number, clusters: number, spread: number, sd: number, seed: number): Float64Array {
  const random = seededRandom(seed);
  const centres = Float64Array.from({ length: 2 * clusters }, () => spread * (2 * random() - 1));
  const y = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) {
    const c = i % clusters;
    y[2 * i] = centres[2 * c] + sd * normal(random);
    y[2 * i + 1] = centres[2 * c + 1] + sd * normal(random);
  }
  return y;
}

function compare(y: Float64Array, n: number) {
  const want = exactRepulsion(y, n);
  const got = new Float64Array(2 * n);
  const fft = new FftRepulsion(n);
  const z = fft.compute(y, n, got);
  let err = 0, norm = 0, worst = 0;
  for (let i = 0; i < n; i++) {
    const ex = got[2 * i] - want.f[2 * i], ey = got[2 * i + 1] - want.f[2 * i + 1];
    err += ex * ex + ey * ey;
    norm += want.f[2 * i] ** 2 + want.f[2 * i + 1] ** 2;
    worst = Math.max(worst, Math.hypot(ex, ey));
  }
  let maxForce = 0;
  for (let i = 0; i < n; i++) maxForce = Math.max(maxForce, Math.hypot(want.f[2 * i], want.f[2 * i + 1]));
  return { relForce: Math.sqrt(err / norm), worstRel: worst / maxForce, relZ: Math.abs(z - want.z) / want.z, grid: fft.gridSide };
}

// Tolerances: the interpolation error of 3 Lagrange nodes per box (the published method's default)
// with boxes about 1 map unit wide or less; it shrinks as the box width cubed. The bounds sit a few
// times above the errors measured here (small map ~1e-5 relative force error and ~1e-6 in Z, wide maps
// ~3e-2 to 4e-2 and ~1e-3), near the ~5% error accepted for Barnes–Hut at theta 0.5 (gradient.test.ts).
describe('FftRepulsion against the exact O(n²) repulsion', () => {
  it('matches on 400 points in a small map (span about 5: the minimum of 40 boxes)', () => {
    const r = compare(points(400, 4, 2, 0.5, 1), 400);
    expect(r.relForce).toBeLessThan(1e-4);
    expect(r.worstRel).toBeLessThan(1e-3);
    expect(r.relZ).toBeLessThan(1e-5);
  });

  it('matches on 1,500 points in a wide map (span about 90: the 512 grid, boxes about 1 wide)', () => {
    // Boxes 1 wide are the published method's default; measured here 2.8e-2 relative force error,
    // 6.1e-2 worst point, 1.1e-3 in Z.
    const r = compare(points(1500, 10, 40, 2, 5), 1500);
    expect(r.grid).toBe(512);
    expect(r.relForce).toBeLessThan(6e-2);
    expect(r.worstRel).toBeLessThan(1.2e-1);
    expect(r.relZ).toBeLessThan(3e-3);
  });

  it('matches on 1,500 points in a very wide map (span about 190: the 1024 grid, boxes about 1.1 wide)', () => {
    // Measured here 4.3e-2 relative force error, 1.1e-1 worst point, 2.0e-3 in Z.
    const r = compare(points(1500, 10, 100, 2, 5), 1500);
    expect(r.grid).toBe(1024);
    expect(r.relForce).toBeLessThan(8e-2);
    expect(r.worstRel).toBeLessThan(2e-1);
    expect(r.relZ).toBeLessThan(5e-3);
  });

  it('sizes the grid by span: 256 up to about 40, then 512 (boxes up to 1.5 wide), then 1024', () => {
    const side = (spread: number) => {
      const n = 200;
      const f = new FftRepulsion(n);
      f.compute(points(n, 10, spread, 2, 5), n, new Float64Array(2 * n));
      return f.gridSide;
    };
    expect(side(15)).toBe(256);
    expect(side(30)).toBe(512);
    expect(side(45)).toBe(512);
    expect(side(80)).toBe(1024);
  });

  it('matches on an early-iteration map (span 1e-3) and with duplicate points', () => {
    const y = points(300, 3, 1e-3, 1e-4, 3);
    y[2] = y[0]; y[3] = y[1];
    const r = compare(y, 300);
    expect(r.relForce).toBeLessThan(1e-4);
    expect(r.relZ).toBeLessThan(1e-6);
  });

  it('gives the same forces when the whole map is shifted (translation invariance)', () => {
    const n = 200;
    const y = points(n, 3, 5, 1, 4);
    const shifted = y.map((v) => v + 1000);
    const a = new Float64Array(2 * n), b = new Float64Array(2 * n);
    const za = new FftRepulsion(n).compute(y, n, a);
    const zb = new FftRepulsion(n).compute(shifted, n, b);
    expect(zb).toBeCloseTo(za, 6);
    for (let t = 0; t < 2 * n; t++) expect(b[t]).toBeCloseTo(a[t], 8);
  });
});
