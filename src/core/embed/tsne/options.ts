import { OptionError } from '../../errors';
import { PARAMS, perplexityLimit } from '../../params/analysis-params';
import { checkParam } from '../../params/param-spec';

/** t-SNE options; every field has a default (see TSNE_DEFAULTS). */
export interface TsneOptions {
  /** Effective number of neighbours each window's conditional distribution spreads over (default 30). */
  perplexity: number;
  /** Gradient-descent iterations in all, early exaggeration included (default 750: 250 exaggerated + 500). */
  iterations: number;
  /** Factor on the attractive forces during the first iterations (default 12). */
  earlyExaggeration: number;
  /** Iterations run with early exaggeration and momentum 0.5 (default 250); momentum is 0.8 after. */
  exaggerationIterations: number;
  /** Step size, or 'auto' = max(n / earlyExaggeration / 4, 50) (default 'auto'). */
  learningRate: 'auto' | number;
  /** Barnes–Hut opening angle (repulsion 'barnes-hut' only): a cell of width w at distance r is summarised when w / r < theta (default 0.5). 0 = exact. */
  theta: number;
  /** Seed of the initial jitter (and of any sampling); same seed and data → identical coordinates (default 1). */
  seed: number;
  /** 'pca': first two principal axes scaled to standard deviation 1e-4, plus seeded jitter; 'random': N(0, 1e-4²). */
  init: 'pca' | 'random';
  /** When there are more features than this, project onto this many principal axes first (default 50). */
  pcaDimensions: number;
  /**
   * Neighbour search for the affinities: 'exact' brute force, 'approximate' NN-descent (runTsne
   * only), or 'auto' (default): exact up to EXACT_MAX_N windows, approximate above.
   */
  neighbors: 'auto' | 'exact' | 'approximate';
  /**
   * Repulsive forces: 'barnes-hut' (quadtree, opening angle `theta`), 'fft' (polynomial
   * interpolation on a grid, convolution by FFT), or 'auto' (default): FFT from FFT_MIN_N windows.
   */
  repulsion: 'auto' | 'fft' | 'barnes-hut';
}

export const TSNE_DEFAULTS: Readonly<TsneOptions> = Object.freeze({
  perplexity: PARAMS.perplexity.default,
  iterations: PARAMS.iterations.default,
  earlyExaggeration: 12,
  exaggerationIterations: 250,
  learningRate: 'auto',
  theta: 0.5,
  seed: 1,
  init: 'pca',
  pcaDimensions: 50,
  neighbors: 'auto',
  repulsion: 'auto',
});

/** Smallest n for which repulsion 'auto' uses the FFT (measured: see docs/embeddings.md). */
export const FFT_MIN_N = 5_000;

/** Largest n for which 'auto' searches neighbours exactly (O(n² d)); NN-descent above. */
export const EXACT_MAX_N = 10_000;

/** Iterations between KL-divergence evaluations. */
export const COST_EVERY = 50;

/** Merges defaults and validates every option; `n` is the number of windows to embed. */
export function resolveTsneOptions(options: Partial<TsneOptions>, n: number): TsneOptions {
  const o: TsneOptions = { ...TSNE_DEFAULTS, ...definedOnly(options) };
  if (!Number.isInteger(n) || n < 4) throw new OptionError('number of windows', n, 'at least 4 windows for t-SNE');
  checkParam(PARAMS.perplexity, o.perplexity);
  const fits = perplexityLimit(n);
  if (!fits.fits(o.perplexity)) throw new OptionError('perplexity', o.perplexity, fits.expected);
  checkParam(PARAMS.iterations, o.iterations);
  checkInteger('exaggerationIterations', o.exaggerationIterations, 0);
  if (!(Number.isFinite(o.earlyExaggeration) && o.earlyExaggeration >= 1)) {
    throw new OptionError('earlyExaggeration', o.earlyExaggeration, 'a number of at least 1');
  }
  if (o.learningRate !== 'auto' && !(Number.isFinite(o.learningRate) && o.learningRate > 0)) {
    throw new OptionError('learningRate', o.learningRate, '"auto" or a number above 0');
  }
  if (!(Number.isFinite(o.theta) && o.theta >= 0 && o.theta <= 1)) throw new OptionError('theta', o.theta, 'a number from 0 to 1');
  if (!Number.isFinite(o.seed)) throw new OptionError('seed', o.seed, 'a finite number');
  if (o.init !== 'pca' && o.init !== 'random') throw new OptionError('init', o.init, '"pca" or "random"');
  checkInteger('pcaDimensions', o.pcaDimensions, 2);
  if (!['auto', 'exact', 'approximate'].includes(o.neighbors)) {
    throw new OptionError('neighbors', o.neighbors, '"auto", "exact" or "approximate"');
  }
  if (!['auto', 'fft', 'barnes-hut'].includes(o.repulsion)) {
    throw new OptionError('repulsion', o.repulsion, '"auto", "fft" or "barnes-hut"');
  }
  return o;
}

/** The repulsion method actually used for n windows. */
export function repulsionOf(o: TsneOptions, n: number): 'fft' | 'barnes-hut' {
  if (o.repulsion !== 'auto') return o.repulsion;
  return n >= FFT_MIN_N ? 'fft' : 'barnes-hut';
}

/** The learning rate actually used. */
export function learningRateOf(o: TsneOptions, n: number): number {
  return o.learningRate === 'auto' ? Math.max(n / o.earlyExaggeration / 4, 50) : o.learningRate;
}

function checkInteger(name: string, value: number, min: number): void {
  if (!Number.isInteger(value) || value < min) throw new OptionError(name, value, `an integer of at least ${min}`);
}

function definedOnly<T extends object>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}
