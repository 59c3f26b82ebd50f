import { OptionError } from '../../errors';
import { quietContext, type JobContext } from '../../job';
import type { Knn } from '../../neighbors/knn.types';
import { approximateKnn } from '../../neighbors/nndescent';
import { normal, seededRandom, type Random } from '../../random';
import { pca } from '../pca';
import { fitAB } from './fit-ab';
import { fuzzySimplicialSetAsync, type SparseGraph } from './fuzzy-graph';
import { LayoutOptimizer } from './layout';
import { resolveUmapOptions, type ResolvedUmapOptions, type UmapOptions } from './options';
import { spectralLayout } from './spectral';

/** Coordinates of the starting layout are scaled to this range, as UMAP does. */
const INIT_RANGE = 10;
const INIT_NOISE = 1e-4;

/**
 * UMAP as init + step: `await init()` finds the neighbours, builds the fuzzy graph and the
 * starting layout; then each `step()` runs one epoch of the layout optimisation (`stepEdges` a
 * slice of one). The same data, options and seed give identical coordinates.
 */
export class Umap {
  readonly options: ResolvedUmapOptions;
  private readonly random: Random;
  private embedding: Float64Array | null = null;
  private optimizer: LayoutOptimizer | null = null;
  private neighbours: Knn | null = null;
  private fuzzy: SparseGraph | null = null;

  constructor(
    private readonly data: Float64Array, readonly n: number, readonly d: number, options: UmapOptions = {},
  ) {
    if (!Number.isInteger(d) || d < 1) throw new OptionError('d', d, 'an integer of at least 1 feature');
    if (data.length < n * d) throw new OptionError('data length', data.length, `at least n × d = ${n * d}`);
    this.options = resolveUmapOptions(options, n);
    this.random = seededRandom(this.options.seed);
  }

  /**
   * Neighbours, fuzzy graph and starting layout. Reports ctx.progress('neighbours' | 'graph' |
   * 'init', fraction of that stage) and awaits ctx.checkpoint() between slices.
   */
  async init(ctx: JobContext = quietContext): Promise<void> {
    const o = this.options;
    this.neighbours = await approximateKnn(this.data, this.n, this.d, o.neighbors - 1, { metric: o.metric, random: this.random, ctx });
    await ctx.checkpoint();
    ctx.progress('graph', 0);
    this.fuzzy = await fuzzySimplicialSetAsync(this.neighbours, () => ctx.checkpoint());
    ctx.progress('graph', 1);
    await ctx.checkpoint();
    ctx.progress('init', 0);
    const start = o.init === 'spectral' ? await spectralLayout(this.fuzzy, this.random, ctx) : null;
    await ctx.checkpoint();
    const raw = start ?? pca(this.data, this.n, this.d, 2).scores;
    this.embedding = scaleStart(raw, this.n, this.random);
    ctx.progress('init', 1);
    const { a, b } = fitAB(o.spread, o.minDist);
    this.optimizer = new LayoutOptimizer(this.fuzzy, this.embedding, {
      epochs: o.epochs, a, b, negativeSampleRate: o.negativeSampleRate, learningRate: o.learningRate,
    }, this.random);
  }

  /** Runs one epoch; returns true while epochs remain. */
  step(): boolean {
    return this.layout().run(Number.MAX_SAFE_INTEGER, true);
  }

  /** Runs at most `maxEdges` edge visits (possibly across epochs); returns true while epochs remain. */
  stepEdges(maxEdges: number): boolean {
    return this.layout().run(maxEdges);
  }

  /** Completed epochs. */
  get epoch(): number {
    return this.optimizer?.epoch ?? 0;
  }

  get epochs(): number {
    return this.options.epochs;
  }

  /** Edge visits per epoch (for sizing slices). */
  get edgesPerEpoch(): number {
    return this.layout().edgeCount;
  }

  /** The neighbour graph used (after init). */
  get knn(): Knn | null {
    return this.neighbours;
  }

  /** The symmetric fuzzy graph (after init). */
  get graph(): SparseGraph | null {
    return this.fuzzy;
  }

  /** A copy of the current coordinates, n × 2 row-major. */
  coords(): Float32Array {
    if (!this.embedding) throw new Error('Umap.coords() called before init()');
    return Float32Array.from(this.embedding);
  }

  private layout(): LayoutOptimizer {
    if (!this.optimizer) throw new Error('Umap.step() called before init()');
    return this.optimizer;
  }
}

/**
 * Starting coordinates as UMAP prepares them: scaled so the largest |coordinate| is 10, a little
 * Gaussian noise added (ties broken), then each axis rescaled to [0, 10].
 */
function scaleStart(raw: Float64Array, n: number, random: Random): Float64Array {
  let big = 0;
  for (let e = 0; e < 2 * n; e++) big = Math.max(big, Math.abs(raw[e]));
  const scale = big > 0 ? INIT_RANGE / big : 1;
  const y = new Float64Array(2 * n);
  for (let e = 0; e < 2 * n; e++) y[e] = raw[e] * scale + INIT_NOISE * normal(random);
  for (let c = 0; c < 2; c++) {
    let lo = Infinity;
    let hi = -Infinity;
    for (let i = 0; i < n; i++) {
      lo = Math.min(lo, y[2 * i + c]);
      hi = Math.max(hi, y[2 * i + c]);
    }
    const span = hi - lo > 0 ? hi - lo : 1;
    for (let i = 0; i < n; i++) y[2 * i + c] = (INIT_RANGE * (y[2 * i + c] - lo)) / span;
  }
  return y;
}
