import type { AnalysisPartial, EmbedRecord, SamplingRecord } from '../analysis.types';
import { pca } from '../embed/pca';
import { PLACE_NEIGHBOURS, placeWindows, stratifiedSample } from '../embed/place';
import { learningRateOf, resolveTsneOptions, runTsne, type TsneOptions } from '../embed/tsne';
import { resolveUmapOptions, runUmap, type UmapOptions } from '../embed/umap';
import type { JobContext } from '../job';
import { seededRandom } from '../random';
import type { PipelineChoices } from './choices';

/** Seed offset of the subject-stratified sample, so it never shares a stream with clustering. */
const SAMPLE_SEED = 0x5a3c1;

export interface EmbedInput {
  /** Scaled features after the recipe, n × d. */
  data: Float64Array;
  n: number;
  d: number;
  /** Subject code per analysed window (-1 = none), for the stratified sample. */
  subjectCodes?: Int32Array;
  /** The input row of each analysed window, when the recipe dropped some (for the partials). */
  windows?: Int32Array;
  seed: number;
}

export interface EmbedOutput {
  coords: Float32Array;
  /** Without quality figures yet (see quality.ts). */
  record: EmbedRecord;
  placed?: Uint8Array;
}

/**
 * `report(stage, fraction, detail)` maps the embedding's own 0..1 onto the job's progress bar:
 * stage 'embedding' (the method and what it is at in the detail) or 'placing' (windows placed).
 */
export type StageReport = (stage: 'embedding' | 'placing', fraction: number, detail?: string) => void;

/**
 * The map: PCA (two axes of the scaled features), or t-SNE / UMAP on the features projected onto
 * `preReduce` principal axes when there are more, on a subject-stratified sample with the others
 * placed above `sampleAbove` windows. Offers the layout so far through ctx.partial.
 */
export async function embedStage(input: EmbedInput, choices: PipelineChoices, ctx: JobContext, report: StageReport): Promise<EmbedOutput> {
  const { data, n, d } = input;
  const e = choices.embed;
  if (e.method === 'pca') {
    report('embedding', 0, 'PCA');
    const p = pca(data, n, d, 2);
    const coords = new Float32Array(2 * n);
    for (let i = 0; i < n; i++) {
      coords[2 * i] = p.scores[i * p.nComponents];
      coords[2 * i + 1] = p.nComponents > 1 ? p.scores[i * p.nComponents + 1] : 0;
    }
    const ratios = [p.explainedVarianceRatio[0], p.nComponents > 1 ? p.explainedVarianceRatio[1] : 0];
    return { coords, record: { method: 'pca', components: 2, explainedVarianceRatio: ratios } };
  }

  // Pre-reduction: PCA onto preReduce axes when there are more features (recorded in provenance).
  let x = data, dim = d, preReduced: number | null = null;
  if (d > choices.preReduce) {
    report('embedding', 0, `PCA to ${choices.preReduce} axes before ${e.method === 'tsne' ? 't-SNE' : 'UMAP'}`);
    x = pca(data, n, d, choices.preReduce).scores;
    dim = choices.preReduce;
    preReduced = choices.preReduce;
    await ctx.checkpoint();
  }

  // Sample then place above the threshold.
  const sampling = n > choices.sampleAbove;
  const sample = sampling ? stratifiedSample(n, choices.sampleAbove, input.subjectCodes, seededRandom(input.seed + SAMPLE_SEED)) : null;
  const m = sample ? sample.length : n;
  let xs = x;
  if (sample) {
    xs = new Float64Array(m * dim);
    for (let s = 0; s < m; s++) xs.set(x.subarray(sample[s] * dim, sample[s] * dim + dim), s * dim);
  }
  const layoutShare = sampling ? 0.8 : 1;
  const layoutCtx: JobContext = {
    checkpoint: () => ctx.checkpoint(),
    progress: (stage, f, detail) => report('embedding', layoutShare * f, detail ? `${stage} · ${detail}` : stage),
  };
  // The input row of each live point (copied per partial: a posted partial's buffers are transferred).
  const rows = sample && input.windows ? Int32Array.from(sample, (s) => input.windows![s]) : (sample ?? input.windows);
  const offer = (coords: Float32Array, unit: AnalysisPartial['unit'], step: number, steps: number, cost?: number) => {
    if (!ctx.partial || !ctx.wantsPartial?.()) return;
    const value: AnalysisPartial = {
      kind: 'layout', coords, unit, step, steps, ...(rows ? { windows: rows.slice() } : {}), ...(cost !== undefined ? { cost } : {}),
    };
    ctx.partial(value);
  };

  let layout: Float32Array;
  let record: EmbedRecord;
  if (e.method === 'tsne') {
    const options: Partial<TsneOptions> = {
      perplexity: e.perplexity, iterations: e.iterations, seed: input.seed, pcaDimensions: Math.max(2, dim),
      ...(e.learningRate !== undefined ? { learningRate: e.learningRate } : {}),
      ...(e.theta !== undefined ? { theta: e.theta } : {}),
    };
    const o = resolveTsneOptions(options, m);
    let cost: number | undefined;
    layout = await runTsne(xs, m, dim, options, layoutCtx, (coords, iteration, c) => {
      if (c !== undefined) cost = c;
      offer(coords, 'iteration', iteration, o.iterations, c);
    });
    record = {
      method: 'tsne', perplexity: o.perplexity, iterations: o.iterations, learningRate: learningRateOf(o, m),
      earlyExaggeration: o.earlyExaggeration, exaggerationIterations: o.exaggerationIterations, theta: o.theta, init: o.init,
      preReduced, sampleSize: m, ...(cost !== undefined ? { cost } : {}),
      trustworthiness: NaN, neighbourhoodPreservation: NaN, qualitySampleSize: 0,
    };
  } else {
    const options: UmapOptions = { neighbors: e.neighbors, minDist: e.minDist, metric: e.metric, seed: input.seed, ...(e.epochs !== undefined ? { epochs: e.epochs } : {}) };
    const o = resolveUmapOptions(options, m);
    layout = await runUmap(xs, m, dim, options, layoutCtx, (coords, epoch) => offer(coords, 'epoch', epoch, o.epochs));
    record = {
      method: 'umap', neighbors: o.neighbors, minDist: o.minDist, metric: o.metric, epochs: o.epochs, spread: o.spread,
      negativeSampleRate: o.negativeSampleRate, init: o.init, preReduced, sampleSize: m,
      trustworthiness: NaN, neighbourhoodPreservation: NaN, qualitySampleSize: 0,
    };
  }
  if (!sample) return { coords: layout, record };

  const placedRun = await placeWindows(x, n, dim, sample, layout, {
    k: PLACE_NEIGHBOURS,
    ctx: { checkpoint: () => ctx.checkpoint(), progress: (_s, f, detail) => report('placing', layoutShare + (1 - layoutShare) * f, detail) },
  });
  const samplingRecord: SamplingRecord = {
    threshold: choices.sampleAbove, embedded: m, placed: n - m, neighbours: PLACE_NEIGHBOURS,
    stratifiedBy: input.subjectCodes ? 'subject' : 'none',
  };
  record.sampling = samplingRecord;
  return { coords: placedRun.coords, record, placed: placedRun.placed };
}
