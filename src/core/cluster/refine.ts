import type { JobContext } from '../job';
import type { KMeansResult } from './kmeans.types';
import { inertia, runLloyd } from './lloyd';
import { proposeMove } from './split-merge';
import { transferPasses } from './transfers';

/** The refined run: a k-means result (centres = means of the final clusters) and its transfers. */
export interface Refined extends KMeansResult {
  /** Single-window transfers made at the end. */
  transfers: number;
}

/** A move must lower the total sum of squares by more than this share of it to be tried and kept. */
const MIN_RELATIVE_GAIN = 1e-9;

/**
 * Takes k-means from converged centres to a better optimum:
 * 1. polish: Lloyd from `centres` until no window changes cluster (a fixed point);
 * 2. split–merge (`split-merge.ts`), at most `rounds` times: merge the cheapest pair, split the
 *    cluster that gains most, Lloyd to a fixed point again; kept only if the inertia drops, and
 *    the first move that is not predicted or not found to help ends the rounds;
 * 3. single-window transfers (`transfers.ts`) until no window's move lowers the inertia.
 * Deterministic (no random draws). `report` gets the fraction of the rounds done.
 */
export async function refineKMeans(
  data: Float64Array, n: number, d: number, centres: Float64Array, maxIterations: number, rounds: number,
  ctx: JobContext, report: (fraction: number) => void = () => {},
): Promise<Refined> {
  const k = centres.length / d;
  const checkpoint = () => ctx.checkpoint();
  let state = await runLloyd(data, n, d, centres, 0, maxIterations, checkpoint);
  let total = inertia(state);
  let iterations = state.iterations;
  let refinements = 0;
  for (let round = 0; round < rounds; round++) {
    await ctx.checkpoint();
    const move = proposeMove(data, n, d, k, state.labels, MIN_RELATIVE_GAIN * total);
    if (!move) break;
    const next = await runLloyd(data, n, d, move.centres, 0, maxIterations, checkpoint);
    const nextTotal = inertia(next);
    if (!(nextTotal < total * (1 - MIN_RELATIVE_GAIN))) break;
    state = next;
    total = nextTotal;
    iterations += next.iterations;
    refinements++;
    report((round + 1) / rounds);
  }
  // One transfer pass per checkpoint; each pass that moves windows lowers the inertia strictly.
  let labels = state.labels;
  let means = state.centres;
  let transfers = 0;
  let first = true;
  for (let pass = 0; pass < maxIterations; pass++) {
    await ctx.checkpoint();
    const t = transferPasses(data, n, d, labels, means, 1);
    // The first pass also replaces the Lloyd centres by the exact means of the labels; a later pass
    // is kept only if it lowers the inertia (rounding could otherwise make moves go round).
    const keep = first || t.inertia < total;
    if (keep) {
      labels = t.labels;
      means = t.centres;
      total = t.inertia;
      transfers += t.transfers;
    }
    first = false;
    if (t.transfers === 0 || !keep) break;
  }
  report(1);
  return { labels, centres: means, inertia: total, iterations, converged: state.converged, refinements, transfers };
}
