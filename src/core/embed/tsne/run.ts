import type { JobContext } from '../../job';
import { seededRandom } from '../../random';
import { approximateKnnLocal } from './local-order';
import { EXACT_MAX_N, type TsneOptions } from './options';
import { approximateNeighboursFor, reduceForTsne, type NeighbourInput } from './prepare';
import { Tsne } from './tsne';

/** Share of the progress bar given to the preparation (neighbours and affinities). */
const PREPARE_SHARE = 0.15;
/**
 * NN-descent settings for the affinities (its defaults serve UMAP's small k): candidates joined per
 * window and round, random-projection trees for the start, and the stopping share of improved
 * entries per round. Measured at 20,000 blobs, d = 50, k = 46 (recall against brute force on 200
 * rows; see docs/embeddings.md): its defaults with 20 candidates gave recall 0.997 in 14.6 s
 * of CPU, these 0.961 in 10.9 s; the map's trustworthiness (k = 10) stayed at 0.967 there and 0.964
 * at 100,000 windows.
 */
const NN_DESCENT = { maxCandidates: 10, trees: 4, delta: 0.01 };
/** Iterations between onFrame calls (and the last one). */
export const FRAME_EVERY = 10;

/**
 * Runs t-SNE to the end under a job context: awaits ctx.checkpoint() between slices of the
 * preparation, between iterations and between the two halves of each (so a cancel stops it within
 * half an iteration), reports
 * ctx.progress('t-SNE', fraction), and hands every 10th frame (and the last) to onFrame.
 * Neighbours: exact brute force (⌊3 · perplexity⌋ + 1 per window), or NN-descent on rows in a
 * space-local order (seeded by options.seed; ⌊1.5 · perplexity⌋ + 1 per window) per options.neighbors.
 */
export async function runTsne(
  data: Float64Array, n: number, d: number, options: Partial<TsneOptions>, ctx: JobContext,
  onFrame?: (coords: Float32Array, iteration: number, cost: number | undefined) => void,
): Promise<Float32Array> {
  const tsne = new Tsne(data, n, d, options);
  const o = tsne.options;
  await ctx.checkpoint();
  let given: NeighbourInput | undefined;
  if (o.neighbors === 'approximate' || (o.neighbors === 'auto' && n > EXACT_MAX_N)) {
    const { x, dim } = reduceForTsne(data, n, d, o);
    const progressCtx: JobContext = {
      checkpoint: () => ctx.checkpoint(),
      progress: (_stage, fraction) => ctx.progress('t-SNE', PREPARE_SHARE * 0.9 * fraction, 'neighbours'),
    };
    const knn = await approximateKnnLocal(x, n, dim, approximateNeighboursFor(o.perplexity, n), {
      metric: 'euclidean', random: seededRandom(o.seed + 0x5eed), ctx: progressCtx, ...NN_DESCENT,
    }, seededRandom(o.seed + 0x0bde));
    given = { x, dim, knn };
  }
  for (const fraction of tsne.initSlices(given)) {
    ctx.progress('t-SNE', PREPARE_SHARE * fraction, 'affinities');
    await ctx.checkpoint();
  }
  const total = o.iterations;
  for (;;) {
    // Each step in two parts with a checkpoint between (repulsion, then attraction and update).
    const parts = tsne.stepParts();
    let r = parts.next();
    while (!r.done) {
      await ctx.checkpoint();
      r = parts.next();
    }
    if (!r.value) break;
    ctx.progress('t-SNE', PREPARE_SHARE + (1 - PREPARE_SHARE) * (tsne.iteration / total), `iteration ${tsne.iteration} / ${total}`);
    if (onFrame && (tsne.iteration % FRAME_EVERY === 0 || tsne.finished)) onFrame(tsne.coords(), tsne.iteration, tsne.cost);
    await ctx.checkpoint();
  }
  return tsne.coords();
}
