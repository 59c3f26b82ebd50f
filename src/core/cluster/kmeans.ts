import { quietContext, type JobContext } from '../job';
import type { Random } from '../random';
import { kmeansPlusPlus } from './kmeanspp';
import { inertia, runLloyd, type LloydState } from './lloyd';
import type { KMeansResult } from './kmeans.types';
import { refineKMeans } from './refine';

/** Default bound on split–merge rounds (each accepted round repairs one split + merge). */
const MAX_DEFAULT_ROUNDS = 16;

export interface KMeansOptions {
  k: number;
  /** Independent seedings; the run with the lowest inertia is kept (the first on ties). */
  restarts: number;
  maxIterations: number;
  /** Relative tolerance: stop when centres move less than tol × mean feature variance. */
  tol: number;
  random: Random;
  /**
   * Most split–merge moves on the kept run (default min(k, 16)). 0 turns the whole refinement off (polish,
   * moves and transfers: plain restarted Lloyd as before).
   */
  refineRounds?: number;
}

export type { KMeansResult } from './kmeans.types';

/**
 * k-means (Lloyd) with k-means++ seeding and restarts; the run with the lowest inertia is then
 * refined (`refine.ts`: Lloyd to a fixed point, split–merge moves that escape a local optimum where
 * one blob holds two centres and two blobs share one, single-window transfers). Checks in with the
 * job context between iterations (progress over the restarts and the refinement, cancellation via
 * checkpoint). Deterministic for a seed.
 */
export async function kmeans(
  data: Float64Array, n: number, d: number, options: KMeansOptions, ctx: JobContext = quietContext,
  report: (fraction: number) => void = () => {},
): Promise<KMeansResult> {
  const { k, restarts, maxIterations, tol, random } = options;
  const rounds = Math.max(0, Math.floor(options.refineRounds ?? Math.min(k, MAX_DEFAULT_ROUNDS)));
  const units = restarts + (rounds > 0 ? 1 : 0);
  const tolerance = tol * meanVariance(data, n, d);
  const checkpoint = () => ctx.checkpoint();
  let best: KMeansResult | null = null;
  for (let r = 0; r < restarts; r++) {
    await ctx.checkpoint();
    const state = await runLloyd(data, n, d, kmeansPlusPlus(data, n, d, k, random), tolerance, maxIterations, checkpoint,
      (s) => report((r + s.iterations / maxIterations) / units));
    const total = inertia(state);
    if (!best || total < best.inertia) best = resultOf(state, total, state.iterations, 0);
    report((r + 1) / units);
  }
  if (!best) throw new Error('k-means needs at least one restart');
  if (rounds === 0) return best;
  const refined = await refineKMeans(data, n, d, best.centres, maxIterations, rounds, ctx, (f) => report((restarts + f) / units));
  return {
    labels: refined.labels, centres: refined.centres, inertia: refined.inertia, iterations: best.iterations + refined.iterations,
    converged: refined.converged, refinements: refined.refinements,
  };
}

function resultOf(state: LloydState, total: number, iterations: number, refinements: number): KMeansResult {
  return { labels: state.labels, centres: state.centres, inertia: total, iterations, converged: state.converged, refinements };
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
