import { OptionError } from '../../errors';
import type { Metric } from '../../neighbors/knn.types';
import { neighborsLimit, PARAMS } from '../../params/analysis-params';
import { checkParam } from '../../params/param-spec';

export type UmapInit = 'spectral' | 'pca';

/** UMAP settings; every field is optional and defaulted by resolveUmapOptions. */
export interface UmapOptions {
  /** Size of the local neighbourhood, counting the window itself (15). */
  neighbors?: number;
  /** Smallest distance between points in the map (0.1). */
  minDist?: number;
  /** Scale of the map's distances; with minDist it sets the curve a, b (1). */
  spread?: number;
  /** Distance between windows in feature space ('euclidean'). */
  metric?: Metric;
  /** Optimisation epochs: 'auto' = 500 up to 10,000 windows, else 200. */
  epochs?: number | 'auto';
  /** Negative samples per positive sample (5). */
  negativeSampleRate?: number;
  /** Initial learning rate, decaying linearly to 0 (1). */
  learningRate?: number;
  /** Starting layout: graph Laplacian eigenvectors ('spectral') or the first two principal components ('pca'). */
  init?: UmapInit;
  /** Seed of every random step (0). */
  seed?: number;
}

export type ResolvedUmapOptions = Required<Omit<UmapOptions, 'epochs'>> & { epochs: number };

export const UMAP_DEFAULTS = {
  neighbors: PARAMS.neighbors.default,
  minDist: PARAMS.minDist.default,
  spread: 1,
  metric: PARAMS.metric.default,
  epochs: 'auto',
  negativeSampleRate: 5,
  learningRate: 1,
  init: 'spectral',
  seed: 0,
} as const satisfies Required<UmapOptions>;

/** Epoch count used for 'auto': 500 for small data, 200 above 10,000 windows. */
export function autoEpochs(n: number): number {
  return n <= 10_000 ? 500 : 200;
}

/** Fills defaults and rejects bad values with an OptionError naming the option. n is the number of windows. */
export function resolveUmapOptions(options: UmapOptions, n: number): ResolvedUmapOptions {
  const o = { ...UMAP_DEFAULTS, ...stripUndefined(options) };
  if (!Number.isInteger(n) || n < 3) throw new OptionError('number of windows', n, 'at least 3 windows for UMAP');
  checkParam(PARAMS.neighbors, o.neighbors);
  const fits = neighborsLimit(n);
  if (!fits.fits(o.neighbors)) throw new OptionError('neighbors', o.neighbors, fits.expected);
  if (!(typeof o.spread === 'number' && o.spread > 0 && Number.isFinite(o.spread))) {
    throw new OptionError('spread', o.spread, 'a positive number');
  }
  if (!(typeof o.minDist === 'number' && o.minDist >= 0 && o.minDist <= o.spread)) {
    throw new OptionError('minDist', o.minDist, `a number from 0 to spread (${o.spread})`);
  }
  checkParam(PARAMS.metric, o.metric);
  const epochs = o.epochs === 'auto' ? autoEpochs(n) : o.epochs;
  if (!Number.isInteger(epochs) || epochs < 1 || epochs > 100_000) {
    throw new OptionError('epochs', o.epochs, '"auto" or an integer from 1 to 100000');
  }
  if (!(typeof o.negativeSampleRate === 'number' && o.negativeSampleRate >= 0 && o.negativeSampleRate <= 100)) {
    throw new OptionError('negativeSampleRate', o.negativeSampleRate, 'a number from 0 to 100');
  }
  if (!(typeof o.learningRate === 'number' && o.learningRate > 0 && Number.isFinite(o.learningRate))) {
    throw new OptionError('learningRate', o.learningRate, 'a positive number');
  }
  if (o.init !== 'spectral' && o.init !== 'pca') throw new OptionError('init', o.init, '"spectral" or "pca"');
  if (!Number.isFinite(o.seed)) throw new OptionError('seed', o.seed, 'a finite number');
  return { ...o, epochs };
}

function stripUndefined(o: UmapOptions): UmapOptions {
  const out: Record<string, unknown> = {};
  for (const [key, value] of Object.entries(o)) if (value !== undefined) out[key] = value;
  return out as UmapOptions;
}
