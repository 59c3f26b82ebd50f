import type { JobContext } from '../../job';
import { Umap } from './umap';
import type { UmapOptions } from './options';

export { fitAB } from './fit-ab';
export { fuzzySimplicialSet, smoothKnnDistances, type SparseGraph } from './fuzzy-graph';
export { autoEpochs, resolveUmapOptions, UMAP_DEFAULTS, type ResolvedUmapOptions, type UmapInit, type UmapOptions } from './options';
export { Umap } from './umap';
export { neighbourRecall, exactKnnOfRows, type SampleKnn } from '../../neighbors/recall';

/** Edge visits per slice of the layout: small enough that a slice takes a few milliseconds. */
const EDGES_PER_SLICE = 20_000;
/** Share of the progress bar given to the stages before the layout epochs. */
const STAGES = { neighbours: [0, 0.3], graph: [0.3, 0.33], init: [0.33, 0.4] } as const;

/**
 * Runs UMAP to the end: init, then the epochs in short slices with ctx.checkpoint() between them
 * (so a cancel lands within one slice) and ctx.progress('UMAP', fraction of the whole job).
 * `onFrame` receives a copy of the coordinates after each slice that completed an epoch (for live maps).
 */
export async function runUmap(
  data: Float64Array, n: number, d: number, options: UmapOptions, ctx: JobContext,
  onFrame?: (coords: Float32Array, epoch: number) => void,
): Promise<Float32Array> {
  const umap = new Umap(data, n, d, options);
  const staged: JobContext = {
    checkpoint: () => ctx.checkpoint(),
    progress(stage, fraction) {
      const span = STAGES[stage as keyof typeof STAGES];
      if (span) ctx.progress('UMAP', span[0] + (span[1] - span[0]) * fraction, stage);
    },
  };
  ctx.progress('UMAP', 0);
  await umap.init(staged);
  const [, start] = STAGES.init;
  let more = umap.epoch < umap.epochs;
  while (more) {
    await ctx.checkpoint();
    const before = umap.epoch;
    more = umap.stepEdges(EDGES_PER_SLICE);
    if (umap.epoch !== before) {
      ctx.progress('UMAP', start + (1 - start) * (umap.epoch / umap.epochs), `epoch ${umap.epoch} / ${umap.epochs}`);
      onFrame?.(umap.coords(), umap.epoch);
    }
  }
  ctx.progress('UMAP', 1);
  return umap.coords();
}
