import type { JobContext } from '../../job';
import { approximateKnn } from '../../neighbors/nndescent';
import { seededRandom } from '../../random';
import { EXACT_MAX_N, type TsneOptions } from './options';
import { approximateNeighboursFor, reduceForTsne, type NeighbourInput } from './prepare';
import { Tsne } from './tsne';

/** Share of the progress bar given to the preparation (neighbours and affinities). */
const PREPARE_SHARE = 0.15;
/**
 * Candidates joined per window and round of NN-descent (its default is min(60, k)): measured at
 * 100,000 windows, d = 50, k = 46: 30 candidates gave recall 0.988 in 104 s of CPU (see
 * DEVELOPERS.md "Embeddings"); 20 keeps the search near a minute.
 */
const NN_DESCENT_CANDIDATES = 20;
/** Iterations between onFrame calls (and the last one). */
export const FRAME_EVERY = 10;

/**
 * Runs t-SNE to the end under a job context: awaits ctx.checkpoint() between slices of the
 * preparation and between iterations (so a cancel stops it within one iteration), reports
 * ctx.progress('t-SNE', fraction), and hands every 10th frame (and the last) to onFrame.
 * Neighbours: exact brute force (⌊3 · perplexity⌋ + 1 per window), or NN-descent (seeded by
 * options.seed; ⌊1.5 · perplexity⌋ + 1 per window) per options.neighbors.
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
      progress: (_stage, fraction) => ctx.progress('t-SNE', PREPARE_SHARE * 0.9 * fraction),
    };
    const knn = await approximateKnn(x, n, dim, approximateNeighboursFor(o.perplexity, n), {
      metric: 'euclidean', random: seededRandom(o.seed + 0x5eed), ctx: progressCtx, maxCandidates: NN_DESCENT_CANDIDATES,
    });
    given = { x, dim, knn };
  }
  for (const fraction of tsne.initSlices(given)) {
    ctx.progress('t-SNE', PREPARE_SHARE * fraction);
    await ctx.checkpoint();
  }
  const total = o.iterations;
  while (tsne.step()) {
    ctx.progress('t-SNE', PREPARE_SHARE + (1 - PREPARE_SHARE) * (tsne.iteration / total));
    if (onFrame && (tsne.iteration % FRAME_EVERY === 0 || tsne.finished)) onFrame(tsne.coords(), tsne.iteration, tsne.cost);
    await ctx.checkpoint();
  }
  return tsne.coords();
}
