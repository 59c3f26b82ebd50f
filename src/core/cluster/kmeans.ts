import { quietContext, type JobContext } from '../job';
import type { Random } from '../random';
import { kmeansPlusPlus } from './kmeanspp';
import { assign, inertia, initLloyd, lloydStep } from './lloyd';

export interface KMeansOptions {
  k: number;
  /** Independent seedings; the run with the lowest inertia is kept (the first on ties). */
  restarts: number;
  maxIterations: number;
  /** Relative tolerance: stop when centres move less than tol × mean feature variance. */
  tol: number;
  random: Random;
}

export interface KMeansResult {
  /** Cluster per window, 0..k-1 (in the order the run produced them). */
  labels: Int32Array;
  centres: Float64Array;
  inertia: number;
  /** Iterations of the kept run. */
  iterations: number;
  converged: boolean;
}

/**
 * k-means (Lloyd) with k-means++ seeding and restarts. Checks in with the job context between
 * iterations (progress as the fraction of the restarts done, cancellation via checkpoint).
 */
export async function kmeans(
  data: Float64Array, n: number, d: number, options: KMeansOptions, ctx: JobContext = quietContext,
  report: (fraction: number) => void = () => {},
): Promise<KMeansResult> {
  const { k, restarts, maxIterations, tol, random } = options;
  const tolerance = tol * meanVariance(data, n, d);
  let best: KMeansResult | null = null;
  for (let r = 0; r < restarts; r++) {
    await ctx.checkpoint();
    const state = initLloyd(data, n, d, kmeansPlusPlus(data, n, d, k, random), tolerance);
    while (!state.converged && state.iterations < maxIterations) {
      lloydStep(state);
      report((r + state.iterations / maxIterations) / restarts);
      await ctx.checkpoint();
    }
    // Final assignment so that labels and inertia match the final centres.
    assign(state);
    const total = inertia(state);
    if (!best || total < best.inertia) {
      best = { labels: state.labels, centres: state.centres, inertia: total, iterations: state.iterations, converged: state.converged };
    }
    report((r + 1) / restarts);
  }
  if (!best) throw new Error('k-means needs at least one restart');
  return best;
}

/** Mean over features of the per-feature variance (ddof 0). */
function meanVariance(data: Float64Array, n: number, d: number): number {
  let total = 0;
  for (let j = 0; j < d; j++) {
    let s = 0;
    let ss = 0;
    for (let i = 0; i < n; i++) { const x = data[i * d + j]; s += x; ss += x * x; }
    const m = s / n;
    total += Math.max(0, ss / n - m * m);
  }
  return total / d;
}
