import { describe, expect, it } from 'vitest';
import { fitAB } from '../../../../src/core/embed/umap/fit-ab';

describe('fitAB(spread, minDist)', () => {
  it('matches the reference curve parameters for spread 1, min_dist 0.1', () => {
    // Source: lmcinnes/umap umap/layouts.py, a = 1.576943460405378, b = 0.8950608781227859. That value comes out of SciPy's curve_fit
    // (Levenberg–Marquardt, relative tolerances 1.49e-8 on the parameters and on the cost); a
    // different solver stops at a slightly different point of the same flat optimum, so we check to
    // 1e-4, well inside the 1e-3 that matters for the layout and well outside the solvers' stopping noise.
    const { a, b } = fitAB(1, 0.1);
    expect(Math.abs(a - 1.576943460405378)).toBeLessThan(1e-4);
    expect(Math.abs(b - 0.8950608781227859)).toBeLessThan(1e-4);
  });

  it('pulls the curve in as min_dist grows (smaller a, larger b) — a property of the target curve', () => {
    const tight = fitAB(1, 0.01);
    const loose = fitAB(1, 0.5);
    expect(tight.a).toBeGreaterThan(loose.a);
    expect(tight.b).toBeLessThan(loose.b);
    // The fitted curve stays close to the target at x = min_dist + spread (= e^−1 there).
    const x = 1.5;
    expect(1 / (1 + loose.a * x ** (2 * loose.b))).toBeCloseTo(Math.exp(-1), 1);
  });
});
