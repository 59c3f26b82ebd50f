import { describe, expect, it } from 'vitest';
import type { SparseGraph } from '../../../../src/core/embed/umap/fuzzy-graph';
import { spectralLayout } from '../../../../src/core/embed/umap/spectral';
import { seededRandom } from '../../../../src/core/random';

/** A ring of n vertices, each joined to its two neighbours with weight 1. */
function ring(n: number): SparseGraph {
  const rowStart = new Int32Array(n + 1);
  const cols = new Int32Array(2 * n);
  for (let i = 0; i < n; i++) {
    rowStart[i + 1] = 2 * (i + 1);
    cols[2 * i] = (i + n - 1) % n;
    cols[2 * i + 1] = (i + 1) % n;
  }
  return { n, rowStart, cols, weights: new Float64Array(2 * n).fill(1) };
}

describe('spectralLayout', () => {
  it('lays a ring out as a circle in ring order', async () => {
    // The normalized Laplacian of a cycle C_n has the eigenvector pair cos(2πi/n), sin(2πi/n) for the
    // smallest non-zero eigenvalue 1 − cos(2π/n) (spectral graph theory, e.g. Chung, "Spectral Graph
    // Theory", 1997, section 1.5), so any orthonormal basis of that pair places vertex i on a circle
    // at angle ±2πi/n + constant.
    const n = 40;
    const y = await spectralLayout(ring(n), seededRandom(2));
    expect(y).not.toBeNull();
    const r = Array.from({ length: n }, (_, i) => Math.hypot(y![2 * i], y![2 * i + 1]));
    const mean = r.reduce((s, v) => s + v, 0) / n;
    for (const v of r) expect(Math.abs(v / mean - 1)).toBeLessThan(1e-2);
    // Consecutive vertices are 2π/n apart in angle.
    for (let i = 0; i < n; i++) {
      const j = (i + 1) % n;
      const cos = (y![2 * i] * y![2 * j] + y![2 * i + 1] * y![2 * j + 1]) / (r[i] * r[j]);
      expect(cos).toBeCloseTo(Math.cos((2 * Math.PI) / n), 2);
    }
  });
});
